// Tables of migration 2026_12_01_2210_create_core_records.
import type { Generated, Selectable } from 'kysely';
import type { Json, Numeric, NumericNullable, NumericWithDefault, DateColumn, Timestamp, GeneratedTimestamp, TimestampNullable } from './columns';

export type FilesTable = {
  id: Generated<string>;
  name: string;
  content_type: string;
  size_bytes: number;
  sha256: string;
  bytes: Buffer;
  uploaded_by: string | null;
  created_at: GeneratedTimestamp;
};

export type CustomerContactsTable = {
  id: Generated<string>;
  customer_id: string;
  name: string;
  email: string | null;
  phone: Generated<string>;
  is_billing: Generated<boolean>;
  user_id: string | null;
  created_at: GeneratedTimestamp;
};

export type LinesTable = {
  id: Generated<string>;
  name: string;
  method: 'rack' | 'barrel' | 'mixed';
  description: Generated<string>;
  created_at: GeneratedTimestamp;
};

export type TanksTable = {
  id: Generated<string>;
  line_id: string;
  code: string;
  name: string;
  template_id: string;
  volume_l: Numeric;
  element: string | null;
  ion_charge: number | null;
  efficiency: NumericNullable;
  rectifier_max_a: NumericNullable;
  has_ah_meter: Generated<boolean>;
  anode_type: 'soluble' | 'insoluble' | 'none';
  temp_min_c: NumericNullable;
  temp_max_c: NumericNullable;
  is_active: Generated<boolean>;
  created_at: GeneratedTimestamp;
  /** What the tank's process family needs to run it (lib/families/*): see each family's tank settings. */
  family_settings: Json<Record<string, unknown>>;
  made_up_at: TimestampNullable;
  /** The line's schedule (migration 2026_12_04_0615): one load's cycle, a load's work area, manned shifts. */
  cycle_minutes: NumericWithDefault;
  load_area_dm2: NumericNullable;
  shifts_per_day: Generated<number>;
  shift_hours: NumericWithDefault;
};

export type CalculationsTable = {
  id: Generated<string>;
  title: string;
  input: Json<unknown>;
  result: Json<unknown>;
  area_dm2: Numeric;
  created_by: string | null;
  created_at: GeneratedTimestamp;
};

export type PartsTable = {
  id: Generated<string>;
  customer_id: string;
  part_number: string;
  revision: Generated<string>;
  description: Generated<string>;
  substrate: string;
  tensile_mpa: NumericNullable;
  hardness_hrc: NumericNullable;
  area_dm2: Numeric;
  weight_g: NumericNullable;
  calculation_id: string | null;
  drawing_file_id: string | null;
  stl_file_id: string | null;
  created_at: GeneratedTimestamp;
  updated_at: GeneratedTimestamp;
  corrosivity_category: 'C1' | 'C2' | 'C3' | 'C4' | 'C5' | 'CX' | null;
  design_life_years: NumericNullable;
  size_tolerance_um: NumericNullable;
};

export type ProcessStep = { step: string; note?: string };

export type FinishesTable = {
  id: Generated<string>;
  code: string;
  name: string;
  spec_text: Generated<string>;
  process_route: Json<ProcessStep[]>;
  element: string;
  ion_charge: number;
  min_thickness_um: Numeric;
  max_thickness_um: NumericNullable;
  method: 'rack' | 'barrel';
  /** Electroplating and anodizing only; null for families that run without current. */
  current_density_adm2: NumericNullable;
  /** Electroplating only (cathode current efficiency). */
  efficiency: NumericNullable;
  distribution_ratio: Numeric;
  tank_volts: Numeric;
  parts_per_load: number;
  handling_minutes_per_load: Numeric;
  masking_per_piece_cents: Generated<number>;
  bake_required: Generated<boolean>;
  bake_threshold_hrc: NumericNullable;
  bake_window_hours: Numeric;
  bake_temp_c: NumericNullable;
  bake_hours: NumericNullable;
  line_id: string | null;
  is_active: Generated<boolean>;
  created_at: GeneratedTimestamp;
  family: Generated<ProcessFamilyId>;
  family_params: Json<Record<string, unknown>>;
};

export type ProcessFamilyId = 'electroplating' | 'electroless_nickel' | 'anodizing' | 'passivation';

export type RateSetsTable = {
  id: Generated<string>;
  effective_from: DateColumn;
  labour_per_hour_cents: number;
  tank_hour_rack_cents: number;
  tank_hour_barrel_cents: number;
  metal_per_kg_cents: Json<Record<string, number>>;
  additives_per_kah_cents: number;
  power_per_kwh_cents: number;
  bake_per_load_cents: Generated<number>;
  lot_charge_cents: number;
  minimum_charge_cents: number;
  rush_multiplier_pct: Generated<number>;
  margin_pct: Generated<number>;
  quote_valid_days: Generated<number>;
  created_by: string | null;
  created_at: GeneratedTimestamp;
};

export type CoreRecordTables = {
  files: FilesTable;
  customer_contacts: CustomerContactsTable;
  lines: LinesTable;
  tanks: TanksTable;
  calculations: CalculationsTable;
  parts: PartsTable;
  finishes: FinishesTable;
  rate_sets: RateSetsTable;
};

export type Part = Selectable<PartsTable>;
export type Finish = Selectable<FinishesTable>;
export type Tank = Selectable<TanksTable>;
export type RateSet = Selectable<RateSetsTable>;
