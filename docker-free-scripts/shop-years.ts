// npm run db:shop-years -- [--seed N] [--scale X] — adds ten years of an invented busy shop's history
// to DATABASE_URL (seed it first): ≈ 5 million analysis values, 50,000 quotes, work orders and
// invoices at scale 1. Deterministic by seed; refuses a database that already has it.
import { createDb } from '../db/kysely';
import { databaseUrl } from '../db/pool';
import { generateShopYears } from '../lib/seed/shop-years';

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  const v = i >= 0 ? Number(process.argv[i + 1]) : fallback;
  if (!Number.isFinite(v)) throw new Error(`--${name} must be a number`);
  return v;
}

async function main() {
  const db = createDb();
  const started = Date.now();
  try {
    const seed = arg('seed', 1);
    const scale = arg('scale', 1);
    console.log(`[shop-years] seed ${seed}, scale ${scale}`);
    const counts = await generateShopYears(db, databaseUrl(), { seed, scale, log: (line) => console.log(`[shop-years] ${line} (${((Date.now() - started) / 1000).toFixed(0)} s)`) });
    console.log(`[shop-years] done in ${((Date.now() - started) / 1000).toFixed(0)} s: ${JSON.stringify(counts)}`);
  } catch (err) {
    console.error('[shop-years] failed:', err instanceof Error ? err.message : err);
    process.exitCode = 1;
  } finally {
    await db.destroy();
  }
}
void main();
