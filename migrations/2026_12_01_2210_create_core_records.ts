// Records that several areas share: stored files, plating lines and tanks, customers' contacts,
// parts, finish specifications, saved plating calculations and effective-dated rates.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    -- Uploaded files live in the database so that one backup holds everything.
    create table files (
      id uuid primary key default gen_random_uuid(),
      name text not null check (length(name) between 1 and 255),
      content_type text not null,
      size_bytes integer not null check (size_bytes between 1 and 67108864),
      sha256 text not null check (sha256 ~ '^[0-9a-f]{64}$'),
      bytes bytea not null,
      uploaded_by text references users(id) on delete set null,
      created_at timestamptz not null default now(),
      check (octet_length(bytes) = size_bytes)
    );
    create index files_sha256_idx on files (sha256);

    create table customer_contacts (
      id uuid primary key default gen_random_uuid(),
      customer_id uuid not null references customers(id) on delete cascade,
      name text not null check (length(trim(name)) between 1 and 200),
      email text check (email is null or email ~ '^[^@\\s]+@[^@\\s]+$'),
      phone text not null default '',
      is_billing boolean not null default false,
      user_id text references users(id) on delete set null,
      created_at timestamptz not null default now()
    );
    create index customer_contacts_customer_idx on customer_contacts (customer_id);

    create table lines (
      id uuid primary key default gen_random_uuid(),
      name text not null unique check (length(trim(name)) between 1 and 100),
      method text not null check (method in ('rack', 'barrel', 'mixed')),
      description text not null default '',
      created_at timestamptz not null default now()
    );

    create table tanks (
      id uuid primary key default gen_random_uuid(),
      line_id uuid not null references lines(id) on delete restrict,
      code text not null unique check (code ~ '^[A-Z0-9-]{1,20}$'),
      name text not null check (length(trim(name)) between 1 and 100),
      template_id text not null,
      volume_l numeric not null check (volume_l > 0 and volume_l < 1000000),
      element text,
      ion_charge smallint check (ion_charge between 1 and 6),
      efficiency numeric check (efficiency > 0 and efficiency <= 1),
      rectifier_max_a numeric check (rectifier_max_a > 0),
      has_ah_meter boolean not null default false,
      anode_type text not null check (anode_type in ('soluble', 'insoluble', 'none')),
      temp_min_c numeric,
      temp_max_c numeric,
      is_active boolean not null default true,
      created_at timestamptz not null default now(),
      check (temp_min_c is null or temp_max_c is null or temp_min_c <= temp_max_c),
      check ((element is null) = (ion_charge is null))
    );
    create index tanks_line_idx on tanks (line_id);

    -- A plating calculation an estimator saved from the workbench; quotes and parts refer to it.
    create table calculations (
      id uuid primary key default gen_random_uuid(),
      title text not null check (length(trim(title)) between 1 and 200),
      input jsonb not null,
      result jsonb not null,
      area_dm2 numeric not null check (area_dm2 > 0),
      created_by text references users(id) on delete set null,
      created_at timestamptz not null default now()
    );

    create table parts (
      id uuid primary key default gen_random_uuid(),
      customer_id uuid not null references customers(id) on delete restrict,
      part_number text not null check (length(trim(part_number)) between 1 and 80),
      revision text not null default '' check (length(revision) <= 20),
      description text not null default '' check (length(description) <= 500),
      substrate text not null,
      tensile_mpa numeric check (tensile_mpa > 0 and tensile_mpa < 5000),
      hardness_hrc numeric check (hardness_hrc > 0 and hardness_hrc < 80),
      area_dm2 numeric not null check (area_dm2 > 0 and area_dm2 < 100000),
      weight_g numeric check (weight_g > 0),
      calculation_id uuid references calculations(id) on delete set null,
      drawing_file_id uuid references files(id) on delete set null,
      stl_file_id uuid references files(id) on delete set null,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (customer_id, part_number, revision)
    );

    -- A finish specification: what the customer orders and how the shop runs it.
    create table finishes (
      id uuid primary key default gen_random_uuid(),
      code text not null unique check (code ~ '^[A-Z0-9-]{2,24}$'),
      name text not null check (length(trim(name)) between 1 and 200),
      spec_text text not null default '' check (length(spec_text) <= 300),
      process_route jsonb not null default '[]'::jsonb,
      element text not null,
      ion_charge smallint not null check (ion_charge between 1 and 6),
      min_thickness_um numeric not null check (min_thickness_um > 0 and min_thickness_um < 5000),
      max_thickness_um numeric check (max_thickness_um is null or max_thickness_um > min_thickness_um),
      method text not null check (method in ('rack', 'barrel')),
      current_density_adm2 numeric not null check (current_density_adm2 > 0 and current_density_adm2 <= 100),
      efficiency numeric not null check (efficiency > 0 and efficiency <= 1),
      distribution_ratio numeric not null check (distribution_ratio > 0 and distribution_ratio <= 1),
      tank_volts numeric not null default 6 check (tank_volts > 0 and tank_volts <= 50),
      parts_per_load integer not null check (parts_per_load > 0),
      handling_minutes_per_load numeric not null default 10 check (handling_minutes_per_load >= 0),
      masking_per_piece_cents integer not null default 0 check (masking_per_piece_cents >= 0),
      bake_required boolean not null default false,
      bake_threshold_hrc numeric check (bake_threshold_hrc > 0),
      bake_window_hours numeric not null default 4 check (bake_window_hours > 0 and bake_window_hours <= 48),
      bake_temp_c numeric check (bake_temp_c > 0 and bake_temp_c < 400),
      bake_hours numeric check (bake_hours > 0 and bake_hours <= 48),
      line_id uuid references lines(id) on delete set null,
      is_active boolean not null default true,
      created_at timestamptz not null default now()
    );

    -- Rates, kept with the date they take effect; a quote uses the set in force on its date.
    create table rate_sets (
      id uuid primary key default gen_random_uuid(),
      effective_from date not null unique,
      labour_per_hour_cents integer not null check (labour_per_hour_cents >= 0),
      tank_hour_rack_cents integer not null check (tank_hour_rack_cents >= 0),
      tank_hour_barrel_cents integer not null check (tank_hour_barrel_cents >= 0),
      metal_per_kg_cents jsonb not null default '{}'::jsonb,
      additives_per_kah_cents integer not null check (additives_per_kah_cents >= 0),
      power_per_kwh_cents integer not null check (power_per_kwh_cents >= 0),
      bake_per_load_cents integer not null default 0 check (bake_per_load_cents >= 0),
      lot_charge_cents integer not null check (lot_charge_cents >= 0),
      minimum_charge_cents integer not null check (minimum_charge_cents >= 0),
      rush_multiplier_pct integer not null default 150 check (rush_multiplier_pct between 100 and 500),
      margin_pct integer not null default 30 check (margin_pct between 0 and 500),
      quote_valid_days integer not null default 30 check (quote_valid_days between 1 and 365),
      created_by text references users(id) on delete set null,
      created_at timestamptz not null default now()
    );
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
