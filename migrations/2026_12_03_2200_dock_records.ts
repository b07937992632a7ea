// The dock: what came in (receipts, with their photos), what left (shipments, each with its
// packing slip) and what the shop set aside (scrap and holds). The work order keeps the running
// counts, and the database refuses any state where more left or was set aside than came in.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table number_counters drop constraint number_counters_series_check;
    alter table number_counters add constraint number_counters_series_check
      check (series in ('quote', 'work_order', 'invoice', 'credit_note', 'certificate', 'receipt', 'shipment'));

    alter table work_orders
      add column quantity_scrapped integer not null default 0 check (quantity_scrapped >= 0),
      add column quantity_held integer not null default 0 check (quantity_held >= 0),
      add column rework_of_id uuid references work_orders(id) on delete restrict,
      add column rework_nonconformance_id uuid references nonconformances(id) on delete restrict,
      drop constraint work_orders_check,
      add constraint work_orders_counts_balance
        check (quantity_shipped >= 0 and quantity_shipped + quantity_scrapped + quantity_held <= quantity_received);

    create table receipts (
      id uuid primary key default gen_random_uuid(),
      number text not null unique check (number ~ '^R[0-9]{4}-[0-9]{5,}$'),
      work_order_id uuid not null references work_orders(id) on delete restrict,
      customer_id uuid not null references customers(id) on delete restrict,
      received_at timestamptz not null default now(),
      received_by text references users(id) on delete set null,
      quantity integer not null check (quantity between 1 and 100000000),
      weight_kg numeric check (weight_kg > 0 and weight_kg < 1000000),
      containers integer not null check (containers between 1 and 1000),
      condition_note text not null default '' check (length(condition_note) <= 2000),
      customer_part_number text not null default '' check (length(customer_part_number) <= 80),
      customer_lot text not null default '' check (length(customer_lot) <= 80),
      discrepancy text not null default 'none' check (discrepancy in ('none', 'short', 'over', 'damaged', 'wrong_part')),
      discrepancy_note text not null default '' check (length(discrepancy_note) <= 2000),
      discrepancy_emailed_at timestamptz,
      is_return boolean not null default false,
      created_at timestamptz not null default now(),
      check (discrepancy = 'none' or length(trim(discrepancy_note)) > 0)
    );
    create index receipts_work_order_idx on receipts (work_order_id, received_at);
    create index receipts_customer_idx on receipts (customer_id, received_at desc);

    create table receipt_photos (
      receipt_id uuid not null references receipts(id) on delete restrict,
      file_id uuid not null references files(id) on delete restrict,
      primary key (receipt_id, file_id)
    );
    create index receipt_photos_file_idx on receipt_photos (file_id);

    -- Parts set aside: scrapped, put on hold, released from hold back to the line.
    create table count_moves (
      id bigint generated always as identity primary key,
      work_order_id uuid not null references work_orders(id) on delete restrict,
      kind text not null check (kind in ('scrap', 'hold', 'release', 'scrap_held')),
      quantity integer not null check (quantity between 1 and 100000000),
      reason text not null check (length(trim(reason)) between 3 and 500),
      actor_id text references users(id) on delete set null,
      created_at timestamptz not null default now()
    );
    create index count_moves_work_order_idx on count_moves (work_order_id, created_at);

    create table shipments (
      id uuid primary key default gen_random_uuid(),
      number text not null unique check (number ~ '^S[0-9]{4}-[0-9]{5,}$'),
      work_order_id uuid not null references work_orders(id) on delete restrict,
      customer_id uuid not null references customers(id) on delete restrict,
      shipped_at timestamptz not null default now(),
      shipped_by text references users(id) on delete set null,
      quantity integer not null check (quantity between 1 and 100000000),
      containers integer not null check (containers between 1 and 1000),
      weight_kg numeric check (weight_kg > 0 and weight_kg < 1000000),
      carrier text not null check (length(trim(carrier)) between 1 and 100),
      tracking_number text not null default '' check (length(tracking_number) <= 100),
      ship_to text not null default '' check (length(ship_to) <= 1000),
      certificate_id uuid references certificates(id) on delete restrict,
      slip_file_id uuid not null references files(id) on delete restrict,
      emailed_at timestamptz,
      email_to text,
      created_at timestamptz not null default now()
    );
    create index shipments_work_order_idx on shipments (work_order_id, shipped_at);
    create index shipments_customer_idx on shipments (customer_id, shipped_at desc);
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
