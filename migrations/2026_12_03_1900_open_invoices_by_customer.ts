// What a customer owes is summed over its open invoices alone: an index of the open ones by
// customer, so ten years of paid invoices are not read to find the few still open.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index invoices_open_customer_idx on invoices (customer_id) where status in ('issued', 'partly_paid')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index invoices_open_customer_idx`.execute(db);
}
