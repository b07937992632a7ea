// Invoices made from shipped work orders, credit notes, payments and refunds, the Stripe events
// already processed, checkout sessions opened for an invoice, and overdue reminders sent.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    -- An issued invoice is never edited: only its running balance (paid, credited, status) moves,
    -- always recomputed from the payments and credit_notes rows in the same transaction.
    create table invoices (
      id uuid primary key default gen_random_uuid(),
      number text not null unique check (number ~ '^I[0-9]{4}-[0-9]{5,}$'),
      customer_id uuid not null references customers(id) on delete restrict,
      status text not null default 'issued' check (status in ('issued', 'partly_paid', 'paid', 'credited')),
      issued_on date not null,
      due_on date not null,
      payment_terms_days integer not null check (payment_terms_days between 0 and 365),
      tax_rate_bp integer not null check (tax_rate_bp between 0 and 10000),
      currency text not null default 'usd' check (currency ~ '^[a-z]{3}$'),
      subtotal_cents bigint not null check (subtotal_cents >= 0),
      tax_cents bigint not null check (tax_cents >= 0),
      total_cents bigint not null check (total_cents >= 0),
      -- payments received less refunds; above total_cents when the customer overpaid
      paid_cents bigint not null default 0 check (paid_cents >= 0),
      credited_cents bigint not null default 0 check (credited_cents >= 0),
      bill_to_name text not null check (length(trim(bill_to_name)) between 1 and 200),
      bill_to_address text not null default '' check (length(bill_to_address) <= 1000),
      billing_email text check (billing_email is null or billing_email ~ '^[^@\\s]+@[^@\\s]+$'),
      notes text not null default '' check (length(notes) <= 2000),
      rounding_rule text not null check (length(rounding_rule) between 1 and 500),
      issued_by text references users(id) on delete set null,
      emailed_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      check (total_cents = subtotal_cents + tax_cents),
      check (due_on >= issued_on),
      check (credited_cents <= total_cents)
    );
    create index invoices_customer_idx on invoices (customer_id, issued_on desc);
    create index invoices_open_idx on invoices (due_on) where status in ('issued', 'partly_paid');

    create table invoice_lines (
      id uuid primary key default gen_random_uuid(),
      invoice_id uuid not null references invoices(id) on delete restrict,
      line_no smallint not null check (line_no between 1 and 500),
      kind text not null check (kind in ('work_order', 'rush', 'expedite', 'rework', 'other')),
      work_order_id uuid references work_orders(id) on delete restrict,
      description text not null check (length(trim(description)) between 1 and 500),
      quantity numeric(18, 4) not null check (quantity > 0),
      unit text not null check (length(unit) between 1 and 20),
      unit_price_cents numeric(18, 4) not null check (unit_price_cents >= 0),
      amount_cents bigint not null check (amount_cents >= 0),
      unique (invoice_id, line_no),
      check ((kind = 'work_order') = (work_order_id is not null)),
      check (kind <> 'rework' or amount_cents = 0)
    );
    -- A work order is billed once, whatever happens to the invoice afterwards.
    create unique index invoice_lines_work_order_key on invoice_lines (work_order_id) where work_order_id is not null;

    create table credit_notes (
      id uuid primary key default gen_random_uuid(),
      number text not null unique check (number ~ '^C[0-9]{4}-[0-9]{5,}$'),
      invoice_id uuid not null references invoices(id) on delete restrict,
      customer_id uuid not null references customers(id) on delete restrict,
      amount_cents bigint not null check (amount_cents > 0),
      reason text not null check (length(trim(reason)) between 3 and 1000),
      issued_on date not null,
      issued_by text references users(id) on delete set null,
      created_at timestamptz not null default now()
    );
    create index credit_notes_invoice_idx on credit_notes (invoice_id);

    create table payments (
      id uuid primary key default gen_random_uuid(),
      invoice_id uuid not null references invoices(id) on delete restrict,
      customer_id uuid not null references customers(id) on delete restrict,
      kind text not null check (kind in ('payment', 'refund')),
      method text not null check (method in ('card', 'check', 'bank_transfer')),
      amount_cents bigint not null check (amount_cents > 0),
      currency text not null default 'usd' check (currency ~ '^[a-z]{3}$'),
      received_at timestamptz not null default now(),
      reference text not null default '' check (length(reference) <= 200),
      stripe_payment_intent_id text,
      stripe_charge_id text,
      -- refunds arrive as a charge's running refunded total: charge id + that total keys one refund
      stripe_refund_key text unique,
      recorded_by text references users(id) on delete set null,
      created_at timestamptz not null default now(),
      check (method = 'card' or (stripe_payment_intent_id is null and stripe_refund_key is null)),
      check (method <> 'card' or stripe_payment_intent_id is not null),
      check (kind = 'refund' or stripe_refund_key is null)
    );
    -- One payment per payment intent, whichever event about it arrives first.
    create unique index payments_intent_key on payments (stripe_payment_intent_id) where kind = 'payment';
    create index payments_invoice_idx on payments (invoice_id, received_at);

    -- Every verified Stripe event, by Stripe's own id: a replay conflicts here and changes nothing.
    create table stripe_events (
      id text primary key check (id ~ '^evt_[A-Za-z0-9_]+$'),
      type text not null,
      invoice_id uuid references invoices(id) on delete set null,
      outcome text not null check (length(outcome) <= 500),
      stripe_created_at timestamptz not null,
      received_at timestamptz not null default now()
    );
    create index stripe_events_invoice_idx on stripe_events (invoice_id, received_at);

    create table invoice_checkouts (
      id text primary key,
      invoice_id uuid not null references invoices(id) on delete restrict,
      customer_id uuid not null references customers(id) on delete restrict,
      amount_cents bigint not null check (amount_cents > 0),
      url text not null,
      expires_at timestamptz not null,
      created_by text references users(id) on delete set null,
      created_at timestamptz not null default now()
    );
    create index invoice_checkouts_invoice_idx on invoice_checkouts (invoice_id, created_at desc);

    -- One row per reminder stage sent; the key makes a second send of the same stage impossible.
    create table invoice_reminders (
      invoice_id uuid not null references invoices(id) on delete restrict,
      stage text not null check (stage in ('overdue_1', 'overdue_15', 'overdue_30', 'overdue_60')),
      sent_to text not null,
      sent_at timestamptz not null default now(),
      primary key (invoice_id, stage)
    );
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
