import type { Kysely } from 'kysely';
import type { Database } from '@/db/types';
import { seedBath } from './bath';
import { seedBilling } from './billing';
import { seedCoreRecords } from './core-records';
import { seedFamilies } from './families';
import { seedFoundation } from './foundation';
import { seedQuotes } from './quotes';
import { seedQuality } from './quality';
import { seedRecords } from './records';

// The demo data set, shared by the demo start command and the tests.
export async function seedDemo(db: Kysely<Database>): Promise<void> {
  await seedFoundation(db);
  await seedCoreRecords(db);
  await seedRecords(db);
  await seedBath(db);
  await seedQuotes(db);
  await seedQuality(db); // after the orders: measures, bakes, certifies and ships plated lots
  await seedBilling(db); // after the orders: bills shipped work orders
  await seedFamilies(db); // the other lines' work, after billing so the invoices stay as they were
}

export { DEMO_PASSWORD, DEMO_OWNER_TOTP_SECRET, DEMO_OWNER_ID, DEMO_USERS, DEMO_CUSTOMERS, DEMO_SHOP } from './foundation';
