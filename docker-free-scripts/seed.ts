// npm run db:seed — loads the invented demo shop into DATABASE_URL. Idempotent.
import { createDb } from '../db/kysely';
import { seedDemo } from '../lib/seed';

async function main() {
  const db = createDb();
  try {
    await seedDemo(db);
    console.log('[seed] demo data loaded');
  } catch (err) {
    console.error('[seed] failed:', err instanceof Error ? err.message : err);
    process.exitCode = 1;
  } finally {
    await db.destroy();
  }
}
void main();
