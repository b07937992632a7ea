import type { Kysely } from 'kysely';
import type { Database } from '@/db/types';
import { seedCoreRecords } from './core-records';
import { seedFoundation } from './foundation';

// The demo data set, shared by the demo start command and the tests.
export async function seedDemo(db: Kysely<Database>): Promise<void> {
  await seedFoundation(db);
  await seedCoreRecords(db);
}

export { DEMO_PASSWORD, DEMO_USERS, DEMO_CUSTOMERS, DEMO_SHOP } from './foundation';
