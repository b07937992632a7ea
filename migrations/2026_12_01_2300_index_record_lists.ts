// Indexes for the customer and part lists: each sortable column of a long list has one, so a
// sorted page reads only its rows. Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create index customers_name_idx on customers (name);
    create index customers_created_idx on customers (created_at);
    create index parts_part_number_idx on parts (part_number);
    create index parts_updated_idx on parts (updated_at);
    create index customer_contacts_user_idx on customer_contacts (user_id) where user_id is not null;
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
