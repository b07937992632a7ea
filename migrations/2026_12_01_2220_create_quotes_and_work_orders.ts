// Quotes with revisions, work orders that follow the parts through the shop, and plating runs.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    -- Numbers are sequential per year and never reused: the counter row is bumped inside the
    -- transaction that creates the record, so a rolled-back create does not burn or repeat one.
    create table number_counters (
      series text not null check (series in ('quote', 'work_order', 'invoice', 'credit_note', 'certificate')),
      year integer not null check (year between 2000 and 2999),
      last_seq integer not null check (last_seq >= 0),
      primary key (series, year)
    );

    create table quotes (
      id uuid primary key default gen_random_uuid(),
      number text not null check (number ~ '^Q[0-9]{4}-[0-9]{4,}$'),
      revision text not null default 'A' check (revision ~ '^[A-Z]$'),
      customer_id uuid not null references customers(id) on delete restrict,
      contact_user_id text references users(id) on delete set null,
      status text not null default 'draft'
        check (status in ('draft', 'sent', 'accepted', 'declined', 'expired', 'superseded')),
      rate_set_id uuid not null references rate_sets(id) on delete restrict,
      valid_days integer not null check (valid_days between 1 and 365),
      is_rush boolean not null default false,
      notes text not null default '' check (length(notes) <= 2000),
      total_cents bigint not null default 0 check (total_cents >= 0),
      previous_revision_id uuid references quotes(id) on delete restrict,
      created_by text references users(id) on delete set null,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      sent_at timestamptz,
      expires_at timestamptz,
      decided_at timestamptz,
      decided_by text references users(id) on delete set null,
      po_number text check (po_number is null or length(trim(po_number)) between 1 and 60),
      decline_reason text check (decline_reason is null or length(decline_reason) <= 1000),
      unique (number, revision),
      check (status <> 'accepted' or po_number is not null),
      check (status not in ('sent', 'accepted', 'declined', 'expired') or (sent_at is not null and expires_at is not null))
    );
    create index quotes_customer_idx on quotes (customer_id, created_at desc);
    create index quotes_status_idx on quotes (status);

    create table quote_lines (
      id uuid primary key default gen_random_uuid(),
      quote_id uuid not null references quotes(id) on delete cascade,
      line_no smallint not null check (line_no between 1 and 500),
      part_id uuid not null references parts(id) on delete restrict,
      finish_id uuid not null references finishes(id) on delete restrict,
      quantity integer not null check (quantity between 1 and 100000000),
      pricing_basis text not null check (pricing_basis in ('piece', 'hundred', 'kg', 'lb', 'ft2', 'dm2', 'load')),
      calculation jsonb not null,
      cost jsonb not null,
      computed_total_cents bigint not null check (computed_total_cents >= 0),
      override_total_cents bigint check (override_total_cents >= 0),
      override_reason text,
      override_by text references users(id) on delete set null,
      override_at timestamptz,
      total_cents bigint not null check (total_cents >= 0),
      unit_price_cents numeric(18, 4) not null check (unit_price_cents >= 0),
      unique (quote_id, line_no),
      check ((override_total_cents is null) = (override_reason is null)),
      check (total_cents = coalesce(override_total_cents, computed_total_cents))
    );

    create table work_orders (
      id uuid primary key default gen_random_uuid(),
      number text not null unique check (number ~ '^W[0-9]{4}-[0-9]{5,}$'),
      customer_id uuid not null references customers(id) on delete restrict,
      quote_line_id uuid unique references quote_lines(id) on delete restrict,
      part_id uuid not null references parts(id) on delete restrict,
      finish_id uuid not null references finishes(id) on delete restrict,
      po_number text not null check (length(trim(po_number)) between 1 and 60),
      due_date date,
      quantity_ordered integer not null check (quantity_ordered > 0),
      quantity_received integer not null default 0 check (quantity_received >= 0),
      quantity_shipped integer not null default 0 check (quantity_shipped >= 0 and quantity_shipped <= quantity_received),
      state text not null default 'accepted'
        check (state in ('accepted', 'received', 'in_process', 'plated', 'baked', 'inspected', 'shipped', 'invoiced')),
      bake_required boolean not null default false,
      is_rush boolean not null default false,
      unit_price_cents numeric(18, 4) not null check (unit_price_cents >= 0),
      pricing_basis text not null check (pricing_basis in ('piece', 'hundred', 'kg', 'lb', 'ft2', 'dm2', 'load')),
      total_cents bigint not null check (total_cents >= 0),
      quoted_cost jsonb not null default '{}'::jsonb,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    create index work_orders_customer_idx on work_orders (customer_id, created_at desc);
    create index work_orders_state_idx on work_orders (state);
    create index work_orders_due_idx on work_orders (due_date);

    create table work_order_events (
      id bigint generated always as identity primary key,
      work_order_id uuid not null references work_orders(id) on delete cascade,
      from_state text,
      to_state text not null,
      actor_id text references users(id) on delete set null,
      note text not null default '',
      created_at timestamptz not null default now()
    );
    create index work_order_events_wo_idx on work_order_events (work_order_id, created_at);

    create table plating_runs (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders(id) on delete restrict,
      tank_id uuid not null references tanks(id) on delete restrict,
      started_at timestamptz not null,
      ended_at timestamptz not null,
      current_a numeric check (current_a > 0),
      meter_start_ah numeric check (meter_start_ah >= 0),
      meter_stop_ah numeric,
      amp_hours numeric not null check (amp_hours > 0),
      loads integer not null check (loads > 0),
      parts_per_load integer not null check (parts_per_load > 0),
      predicted_thickness_um numeric not null check (predicted_thickness_um >= 0),
      is_below_minimum boolean not null,
      logged_by text references users(id) on delete set null,
      idempotency_key text unique,
      created_at timestamptz not null default now(),
      check (ended_at > started_at),
      check (meter_stop_ah is null or meter_start_ah is null or meter_stop_ah > meter_start_ah)
    );
    create index plating_runs_wo_idx on plating_runs (work_order_id);
    create index plating_runs_tank_idx on plating_runs (tank_id, ended_at);
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
