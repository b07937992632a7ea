// Money that does not fit an invoice as asked: an invoice can be overpaid (the excess is the
// customer's credit on account), credit moves between a customer's invoices by an entry of its
// own, and a payment that cannot be matched or differs from what was asked lands in an exceptions
// list with everything the payment service sent. Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table invoices drop constraint invoices_status_check;
    alter table invoices add constraint invoices_status_check
      check (status in ('issued', 'partly_paid', 'paid', 'overpaid', 'credited'));
    -- invoices holding a customer's credit on account
    create index invoices_overpaid_idx on invoices (customer_id) where status = 'overpaid';

    -- Credit on account moved from one invoice's excess to another open invoice of the same
    -- customer. Never edited; a mistaken application is reversed by an application back.
    create table credit_applications (
      id uuid primary key default gen_random_uuid(),
      customer_id uuid not null references customers(id) on delete restrict,
      from_invoice_id uuid not null references invoices(id) on delete restrict,
      to_invoice_id uuid not null references invoices(id) on delete restrict,
      amount_cents bigint not null check (amount_cents > 0),
      note text not null default '' check (length(note) <= 500),
      applied_by text references users(id) on delete set null,
      created_at timestamptz not null default now(),
      check (from_invoice_id <> to_invoice_id)
    );
    create index credit_applications_from_idx on credit_applications (from_invoice_id);
    create index credit_applications_to_idx on credit_applications (to_invoice_id);

    create table payment_exceptions (
      id uuid primary key default gen_random_uuid(),
      reason text not null check (reason in (
        'amount_differs', 'wrong_currency', 'unknown_invoice', 'other_customer',
        'credited_invoice', 'already_paid', 'overpaid', 'refund_exceeds_payments')),
      message text not null check (length(message) between 1 and 1000),
      amount_cents bigint not null check (amount_cents >= 0),
      currency text not null check (currency ~ '^[a-z]{3}$|^$'),
      invoice_id uuid references invoices(id) on delete restrict,
      customer_id uuid references customers(id) on delete restrict,
      -- set when the money is on the books (recorded against an invoice); null while it is nowhere else
      payment_id uuid references payments(id) on delete restrict,
      source text not null check (source in ('stripe', 'office')),
      stripe_event_id text,
      stripe_payment_intent_id text,
      payload jsonb not null default '{}'::jsonb,
      status text not null default 'open' check (status in ('open', 'resolved')),
      resolution text check (resolution is null or length(resolution) between 1 and 1000),
      resolved_by text references users(id) on delete set null,
      resolved_at timestamptz,
      owner_notified_at timestamptz,
      created_at timestamptz not null default now(),
      check ((status = 'resolved') = (resolved_at is not null and resolution is not null))
    );
    create index payment_exceptions_open_idx on payment_exceptions (created_at desc) where status = 'open';
    create index payment_exceptions_created_idx on payment_exceptions (created_at desc, id desc);
    create index payment_exceptions_customer_idx on payment_exceptions (customer_id) where customer_id is not null;
    -- one exception per payment intent and reason: the second event about the same payment, or a
    -- replay, adds nothing
    create unique index payment_exceptions_intent_key on payment_exceptions (stripe_payment_intent_id, reason)
      where stripe_payment_intent_id is not null;
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
