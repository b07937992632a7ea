import type { Kysely } from 'kysely';
import type { Database } from '@/db/types';
import { seedFoundation } from './foundation';

// The demo data set, shared by the demo start command and the tests.
export async function seedDemo(db: Kysely<Database>): Promise<void> {
  await seedFoundation(db);
}

export { DEMO_PASSWORD, DEMO_USERS, DEMO_CUSTOMERS, DEMO_SHOP } from './foundation';
