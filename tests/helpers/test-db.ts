// The test database: migrated from empty and loaded with the demo seed, shared by integration and e2e set-up.
import { createDb } from '@/db/kysely';
import { migrateToLatest } from '@/db/migrate';
import { createPool } from '@/db/pool';
import { seedDemo } from '@/lib/seed';

export const TEST_DATABASE_URL = process.env.TEST_DATABASE_URL ?? 'postgres://app@127.0.0.1:54329/ampwright_test';

/** The same server's address for another database (`postgres` for creating and dropping them). */
export function databaseNamed(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

export async function prepareTestDatabase(url: string = TEST_DATABASE_URL): Promise<void> {
  const db = createDb(createPool(url));
  try {
    const { error } = await migrateToLatest(db);
    if (error) throw error;
    await seedDemo(db);
  } finally {
    await db.destroy();
  }
}
