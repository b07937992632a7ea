// npm run db:migrate — brings the database at DATABASE_URL to the latest migration.
import { createDb } from '../db/kysely';
import { migrateToLatest } from '../db/migrate';

async function main() {
  const db = createDb();
  try {
    const { error, results } = await migrateToLatest(db);
    for (const r of results ?? []) console.log(`[migrate] ${r.status === 'Success' ? 'applied' : r.status}: ${r.migrationName}`);
    if (error) {
      console.error('[migrate] failed:', error instanceof Error ? error.message : error);
      process.exitCode = 1;
    } else if (!results?.length) console.log('[migrate] already up to date');
  } finally {
    await db.destroy();
  }
}
void main();
