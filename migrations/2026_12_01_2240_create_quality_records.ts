// Lot quality records: sampling plans, thickness readings, embrittlement-relief bakes,
// nonconformances and certificates of conformance. Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    -- A sampling plan is replaced, never edited in place, so an auditor can see the plan that was
    -- in force when a lot was inspected. Exactly one plan is active.
    create table sampling_plans (
      id uuid primary key default gen_random_uuid(),
      name text not null check (length(trim(name)) between 1 and 200),
      source text not null default '' check (length(source) <= 300),
      is_active boolean not null default false,
      created_by text references users(id) on delete set null,
      created_at timestamptz not null default now()
    );
    create unique index sampling_plans_one_active on sampling_plans (is_active) where is_active;

    create table sampling_plan_rows (
      plan_id uuid not null references sampling_plans(id) on delete cascade,
      position smallint not null check (position between 1 and 100),
      min_lot integer not null check (min_lot >= 1),
      max_lot integer check (max_lot is null or max_lot >= min_lot),
      code_letter text not null check (length(trim(code_letter)) between 1 and 4),
      sample_size integer not null check (sample_size between 1 and 100000),
      primary key (plan_id, position)
    );

    -- One thickness reading on one sampled part. The limits in force are stored beside the value
    -- so the verdict does not change if the finish is edited later. Readings are never deleted: a
    -- reading taken in error, or one made obsolete by a strip and replate, is voided with a reason.
    create table thickness_readings (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders(id) on delete restrict,
      part_no integer not null check (part_no between 1 and 100000),
      location text not null check (length(trim(location)) between 1 and 120),
      method text not null check (method in ('B568', 'B499', 'B244', 'B504', 'B487', 'B567')),
      thickness_um numeric not null check (thickness_um >= 0 and thickness_um < 5000),
      minimum_um numeric not null check (minimum_um > 0),
      maximum_um numeric check (maximum_um is null or maximum_um > minimum_um),
      status text not null check (status in ('pass', 'below_minimum', 'above_maximum')),
      entry text not null check (entry in ('manual', 'csv')),
      upload_id uuid,
      source_file_id uuid references files(id) on delete set null,
      recorded_by text references users(id) on delete set null,
      recorded_at timestamptz not null default now(),
      voided_at timestamptz,
      voided_by text references users(id) on delete set null,
      void_reason text check (void_reason is null or length(trim(void_reason)) between 1 and 500),
      check ((voided_at is null) = (void_reason is null)),
      check (
        (status = 'below_minimum' and thickness_um < minimum_um)
        or (status = 'above_maximum' and maximum_um is not null and thickness_um > maximum_um)
        or (status = 'pass' and thickness_um >= minimum_um and (maximum_um is null or thickness_um <= maximum_um))
      )
    );
    create index thickness_readings_wo_idx on thickness_readings (work_order_id, recorded_at);

    -- A relief bake as recorded at the oven, with the verdict computed when it was saved. A failed
    -- bake stands only with a supervisor's disposition and its reason.
    create table bake_records (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders(id) on delete restrict,
      plating_ended_at timestamptz not null,
      oven text not null check (length(trim(oven)) between 1 and 60),
      bake_started_at timestamptz not null,
      temp_min_c numeric not null check (temp_min_c between -50 and 1000),
      temp_max_c numeric not null check (temp_max_c between -50 and 1000),
      duration_h numeric not null check (duration_h >= 0 and duration_h <= 500),
      chart_file_id uuid references files(id) on delete set null,
      required_min_hours numeric check (required_min_hours is null or required_min_hours > 0),
      required_min_temp_c numeric not null,
      required_max_temp_c numeric not null,
      window_hours numeric not null check (window_hours > 0 and window_hours <= 72),
      deadline_at timestamptz not null,
      verdict text not null check (verdict in ('pass', 'fail')),
      reasons jsonb not null default '[]'::jsonb,
      notes text not null default '' check (length(notes) <= 1000),
      recorded_by text references users(id) on delete set null,
      recorded_at timestamptz not null default now(),
      disposition_reason text check (disposition_reason is null or length(trim(disposition_reason)) between 3 and 1000),
      disposition_by text references users(id) on delete set null,
      disposition_at timestamptz,
      check (temp_min_c <= temp_max_c),
      check (required_min_temp_c < required_max_temp_c),
      check ((disposition_reason is null) = (disposition_at is null)),
      check (disposition_at is null or verdict = 'fail')
    );
    create index bake_records_wo_idx on bake_records (work_order_id, recorded_at);

    -- The supervisor is told once that an order's bake window is about to close.
    create table bake_window_alerts (
      work_order_id uuid primary key references work_orders(id) on delete cascade,
      deadline_at timestamptz not null,
      sent_to text[] not null default '{}',
      sent_at timestamptz not null default now()
    );

    -- Invoicing leaves out any order with a nonconformance whose disposition is still null.
    create table nonconformances (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders(id) on delete restrict,
      source text not null check (source in ('thickness', 'bake', 'other')),
      description text not null check (length(trim(description)) between 3 and 2000),
      opened_by text references users(id) on delete set null,
      opened_at timestamptz not null default now(),
      disposition text check (disposition in ('rework', 'strip_and_replate', 'use_as_is', 'scrap')),
      customer_approval_ref text check (customer_approval_ref is null or length(trim(customer_approval_ref)) between 1 and 120),
      disposition_note text check (disposition_note is null or length(disposition_note) <= 2000),
      dispositioned_by text references users(id) on delete set null,
      dispositioned_at timestamptz,
      closed_at timestamptz,
      check ((disposition is null) = (closed_at is null)),
      check ((disposition is null) = (dispositioned_at is null)),
      check (disposition is distinct from 'use_as_is' or customer_approval_ref is not null)
    );
    create index nonconformances_wo_idx on nonconformances (work_order_id);
    create index nonconformances_open_idx on nonconformances (work_order_id) where disposition is null;

    -- A certificate of conformance: one per work order, its content and PDF frozen when issued.
    create table certificates (
      id uuid primary key default gen_random_uuid(),
      number text not null unique check (number ~ '^CC[0-9]{4}-[0-9]{5,}$'),
      work_order_id uuid not null unique references work_orders(id) on delete restrict,
      customer_id uuid not null references customers(id) on delete restrict,
      content jsonb not null,
      pdf_file_id uuid not null references files(id) on delete restrict,
      -- restrict, not set null: the frozen row may not change, so its signer cannot be deleted.
      signed_by text references users(id) on delete restrict,
      signed_by_name text not null check (length(trim(signed_by_name)) between 1 and 200),
      signed_at timestamptz not null default now()
    );
    create index certificates_customer_idx on certificates (customer_id, signed_at desc);

    create function certificates_are_frozen() returns trigger language plpgsql as $$
    begin
      raise exception 'certificates are frozen once issued' using errcode = 'check_violation';
    end;
    $$;
    create trigger certificates_frozen before update or delete on certificates
      for each row execute function certificates_are_frozen();
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
