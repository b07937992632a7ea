// Process families beyond electroplating: a finish names its family (electroplating, electroless
// nickel, anodizing, passivation) and carries that family's own figures; a tank carries what its
// family needs to be run (make-up nickel and end of life for electroless nickel, a measured
// anodizing constant); runs without current (electroless, passivation) record time and bath
// conditions instead of amp-hours; and each lot keeps the family's own quality records.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table finishes
      add column family text not null default 'electroplating'
        check (family in ('electroplating', 'electroless_nickel', 'anodizing', 'passivation')),
      add column family_params jsonb not null default '{}'::jsonb,
      alter column current_density_adm2 drop not null,
      alter column efficiency drop not null,
      add constraint finishes_family_current check (
        (family in ('electroplating', 'anodizing')) = (current_density_adm2 is not null)),
      add constraint finishes_family_efficiency check ((family = 'electroplating') = (efficiency is not null)),
      -- passivation makes no coating: its finishes carry no thickness
      drop constraint finishes_min_thickness_um_check,
      add constraint finishes_min_thickness_um_check check (
        min_thickness_um >= 0 and min_thickness_um < 5000 and (family = 'passivation' or min_thickness_um > 0));

    alter table tanks add column family_settings jsonb not null default '{}'::jsonb;
    -- A bath at the end of the life the shop set (an electroless bath's metal turnovers).
    alter table bath_alerts drop constraint bath_alerts_kind_check;
    alter table bath_alerts add constraint bath_alerts_kind_check
      check (kind in ('out_of_limits', 'run_rule', 'overdue', 'addition_missing', 'end_of_life'));
    -- When the bath was last made up: an electroless bath's age (metal turnovers) counts from here.
    alter table tanks add column made_up_at timestamptz;

    alter table plating_runs
      alter column amp_hours drop not null,
      -- bath conditions of a run without current, e.g. { "temperatureC": 25, "concentration": 30 }
      add column conditions jsonb not null default '{}'::jsonb,
      -- a run judged by a window (passivation) that fell outside it
      add column is_outside_window boolean not null default false;
    alter table plating_runs drop constraint plating_runs_amp_hours_check;
    alter table plating_runs add constraint plating_runs_amp_hours_check check (amp_hours is null or amp_hours > 0);

    -- The environment the customer says a part will serve in (ISO 9223 corrosivity category).
    alter table parts
      add column corrosivity_category text
        check (corrosivity_category is null or corrosivity_category in ('C1', 'C2', 'C3', 'C4', 'C5', 'CX')),
      -- the service life the customer asks the coating to give, in years
      add column design_life_years numeric check (design_life_years is null or (design_life_years > 0 and design_life_years <= 200)),
      -- the drawing's tolerance on a finished diameter (±, µm), to weigh a coating's growth against
      add column size_tolerance_um numeric check (size_tolerance_um is null or (size_tolerance_um > 0 and size_tolerance_um < 100000));

    -- A lot's quality records of the families' own kinds (seal test, phosphorus content,
    -- passivation conditions and verification, salt spray). Never edited: a correction voids the
    -- record and adds another.
    create table process_records (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders(id) on delete restrict,
      kind text not null check (kind in ('seal_test', 'phosphorus_content', 'passivation_lot', 'passivation_test', 'salt_spray')),
      method text not null check (length(method) between 1 and 100),
      values jsonb not null,
      verdict text not null check (verdict in ('pass', 'fail')),
      reasons jsonb not null default '[]'::jsonb,
      notes text not null default '' check (length(notes) <= 1000),
      recorded_by text references users(id) on delete set null,
      recorded_at timestamptz not null default now(),
      voided_at timestamptz,
      voided_by text references users(id) on delete set null,
      void_reason text check (void_reason is null or length(trim(void_reason)) between 3 and 500),
      check ((voided_at is null) = (void_reason is null))
    );
    create index process_records_order_idx on process_records (work_order_id, kind, recorded_at);
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
