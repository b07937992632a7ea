// Indexes for a busy shop's ten years: trigram indexes (pg_trgm, shipped with PostgreSQL) so the
// lists' quick search finds a part, order, PO or customer by any part of its text without reading
// every row; the work order's part for the search's join back; and the open invoices in the order
// the receivables page lists them (most overdue first), so it pages by key.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create extension if not exists pg_trgm;
    create index work_orders_number_trgm on work_orders using gin (number gin_trgm_ops);
    create index work_orders_po_trgm on work_orders using gin (po_number gin_trgm_ops);
    create index work_orders_part_idx on work_orders (part_id);
    create index parts_part_number_trgm on parts using gin (part_number gin_trgm_ops);
    create index customers_name_trgm on customers using gin (name gin_trgm_ops);
    create index quotes_number_trgm on quotes using gin (number gin_trgm_ops);
    drop index invoices_open_idx;
    create index invoices_open_idx on invoices (due_on, number) where status in ('issued', 'partly_paid');
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    drop index invoices_open_idx;
    create index invoices_open_idx on invoices (due_on) where status in ('issued', 'partly_paid');
    drop index quotes_number_trgm;
    drop index customers_name_trgm;
    drop index parts_part_number_trgm;
    drop index work_orders_part_idx;
    drop index work_orders_po_trgm;
    drop index work_orders_number_trgm;
  `.execute(db);
}
