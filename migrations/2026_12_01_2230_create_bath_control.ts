// Bath control: per-tank analytes with their limits (and the history of limit changes), analyses,
// additions, rectifier amp-hour meter readings, Hull cell panels, alerts and the record of alert
// e-mails sent. Analyses, additions and meter readings are never edited: a correction is a new
// row that names the row it supersedes. Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table tank_analytes (
      id uuid primary key default gen_random_uuid(),
      tank_id uuid not null references tanks(id) on delete restrict,
      key text not null check (key ~ '^[a-zA-Z][a-zA-Z0-9_]{0,39}$'),
      name text not null check (length(trim(name)) between 1 and 100),
      unit text not null check (length(unit) between 1 and 20),
      method_id text not null check (length(method_id) between 1 and 80),
      target numeric not null,
      lower_control numeric,
      upper_control numeric,
      lower_spec numeric,
      upper_spec numeric,
      frequency_hours numeric not null check (frequency_hours > 0 and frequency_hours <= 8760),
      additive_rate_ml_per_kah numeric check (additive_rate_ml_per_kah > 0),
      -- How the component is put back (salt, concentrate, as itself, additive); null: no calculator.
      supply jsonb,
      basis text not null default '' check (length(basis) <= 500),
      sort_order smallint not null default 0,
      is_active boolean not null default true,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tank_id, key),
      unique (id, tank_id),
      check (coalesce(lower_control, upper_control, lower_spec, upper_spec) is not null),
      check (lower_control is null or upper_control is null or lower_control <= upper_control),
      check (lower_spec is null or upper_spec is null or lower_spec < upper_spec),
      check (lower_spec is null or lower_control is null or lower_spec <= lower_control),
      check (upper_spec is null or upper_control is null or upper_spec >= upper_control),
      check (lower_control is null or target >= lower_control),
      check (upper_control is null or target <= upper_control)
    );

    create table analyte_limit_changes (
      id bigint generated always as identity primary key,
      analyte_id uuid not null references tank_analytes(id) on delete restrict,
      changed_by text not null references users(id) on delete restrict,
      reason text not null check (length(trim(reason)) between 3 and 500),
      before jsonb not null,
      after jsonb not null,
      created_at timestamptz not null default now()
    );
    create index analyte_limit_changes_analyte_idx on analyte_limit_changes (analyte_id, created_at desc);

    create table analyses (
      id uuid primary key default gen_random_uuid(),
      tank_id uuid not null,
      analyte_id uuid not null,
      method_id text not null,
      inputs jsonb not null default '{}'::jsonb,
      value numeric not null,
      unit text not null,
      verdict text not null check (verdict in ('in_range', 'near_limit', 'out_of_range')),
      severity smallint not null check (severity between 0 and 3),
      rules text[] not null default '{}',
      recommendation jsonb,
      source text not null check (source in ('floor', 'office', 'lab', 'seed')),
      taken_at timestamptz not null,
      logged_by text not null references users(id) on delete restrict,
      idempotency_key text not null unique check (length(idempotency_key) between 8 and 120),
      supersedes_id uuid unique,
      note text not null default '' check (length(note) <= 500),
      created_at timestamptz not null default now(),
      unique (id, analyte_id),
      foreign key (analyte_id, tank_id) references tank_analytes(id, tank_id) on delete restrict,
      -- A correction belongs to the same analyte as the entry it replaces.
      foreign key (supersedes_id, analyte_id) references analyses(id, analyte_id) on delete restrict,
      check (supersedes_id is null or supersedes_id <> id)
    );
    create index analyses_analyte_time_idx on analyses (analyte_id, taken_at) include (value, id);
    create index analyses_tank_time_idx on analyses (tank_id, taken_at desc);

    create table additions (
      id uuid primary key default gen_random_uuid(),
      tank_id uuid not null references tanks(id) on delete restrict,
      analyte_id uuid,
      analysis_id uuid references analyses(id) on delete restrict,
      kind text not null check (kind in ('correction', 'amp_hours', 'make_up', 'other')),
      material text not null check (length(trim(material)) between 1 and 120),
      amount numeric not null check (amount > 0 and amount < 100000),
      unit text not null check (unit in ('kg', 'L')),
      recommended_amount numeric check (recommended_amount >= 0),
      recommended_unit text check (recommended_unit in ('kg', 'L')),
      reason text not null default '' check (length(reason) <= 500),
      made_at timestamptz not null,
      made_by text not null references users(id) on delete restrict,
      idempotency_key text not null unique check (length(idempotency_key) between 8 and 120),
      supersedes_id uuid unique references additions(id) on delete restrict,
      created_at timestamptz not null default now(),
      foreign key (analyte_id, tank_id) references tank_analytes(id, tank_id) on delete restrict,
      check ((recommended_amount is null) = (recommended_unit is null)),
      check (supersedes_id is null or supersedes_id <> id)
    );
    create index additions_tank_time_idx on additions (tank_id, made_at desc);
    create index additions_analyte_time_idx on additions (analyte_id, made_at desc) where analyte_id is not null;
    create index additions_analysis_idx on additions (analysis_id) where analysis_id is not null;

    -- The rectifier's amp-hour meter as read at the tank: a running total, reset now and then.
    create table meter_readings (
      id uuid primary key default gen_random_uuid(),
      tank_id uuid not null references tanks(id) on delete restrict,
      amp_hours numeric not null check (amp_hours >= 0 and amp_hours < 1e12),
      read_at timestamptz not null,
      read_by text not null references users(id) on delete restrict,
      idempotency_key text not null unique check (length(idempotency_key) between 8 and 120),
      supersedes_id uuid unique references meter_readings(id) on delete restrict,
      note text not null default '' check (length(note) <= 500),
      created_at timestamptz not null default now(),
      check (supersedes_id is null or supersedes_id <> id)
    );
    create index meter_readings_tank_time_idx on meter_readings (tank_id, read_at);

    create table hull_cell_panels (
      id uuid primary key default gen_random_uuid(),
      tank_id uuid not null references tanks(id) on delete restrict,
      file_id uuid references files(id) on delete set null,
      current_a numeric not null check (current_a > 0 and current_a <= 20),
      minutes numeric not null check (minutes > 0 and minutes <= 60),
      notes text not null default '' check (length(notes) <= 2000),
      made_at timestamptz not null,
      made_by text not null references users(id) on delete restrict,
      idempotency_key text not null unique check (length(idempotency_key) between 8 and 120),
      created_at timestamptz not null default now()
    );
    create index hull_cell_panels_tank_idx on hull_cell_panels (tank_id, made_at desc);

    create table bath_alerts (
      id uuid primary key default gen_random_uuid(),
      tank_id uuid not null references tanks(id) on delete restrict,
      analyte_id uuid references tank_analytes(id) on delete restrict,
      analysis_id uuid references analyses(id) on delete restrict,
      kind text not null check (kind in ('out_of_limits', 'run_rule', 'overdue', 'addition_missing')),
      state text not null default 'open' check (state in ('open', 'acknowledged', 'escalated')),
      dedupe_key text not null check (length(dedupe_key) between 3 and 200),
      message text not null check (length(message) between 1 and 1000),
      detail jsonb not null default '{}'::jsonb,
      occurrences integer not null default 1 check (occurrences >= 1),
      raised_at timestamptz not null default now(),
      last_seen_at timestamptz not null default now(),
      escalated_at timestamptz,
      acknowledged_at timestamptz,
      acknowledged_by text references users(id) on delete restrict,
      corrective_action text check (corrective_action is null or length(trim(corrective_action)) between 3 and 2000),
      check ((state = 'acknowledged') = (acknowledged_at is not null)),
      check (state <> 'acknowledged' or (acknowledged_by is not null and corrective_action is not null)),
      check (state <> 'escalated' or escalated_at is not null)
    );
    -- The same condition raises one alert while it is open (or escalated); a repeat counts on it.
    create unique index bath_alerts_open_dedupe_idx on bath_alerts (dedupe_key) where state <> 'acknowledged';
    create index bath_alerts_state_idx on bath_alerts (state, raised_at);
    create index bath_alerts_tank_idx on bath_alerts (tank_id, raised_at desc);

    -- One row per alert, kind of message and recipient: a job that runs twice sends once.
    create table bath_alert_emails (
      alert_id uuid not null references bath_alerts(id) on delete cascade,
      kind text not null check (kind in ('raised', 'escalated')),
      recipient text not null check (length(recipient) between 3 and 320),
      status text not null default 'pending' check (status in ('pending', 'sent', 'failed')),
      created_at timestamptz not null default now(),
      sent_at timestamptz,
      primary key (alert_id, kind, recipient)
    );
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
