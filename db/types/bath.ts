// Tables of migration 2026_12_01_2230_create_bath_control.
import type { Generated, Selectable } from 'kysely';
import type { Json, Numeric, NumericNullable, Timestamp, TimestampNullable } from './columns';

export type AnalysisVerdict = 'in_range' | 'near_limit' | 'out_of_range';
export type AnalysisSource = 'floor' | 'office' | 'lab' | 'seed';
export type AdditionKind = 'correction' | 'amp_hours' | 'make_up' | 'other';
export type AdditionUnit = 'kg' | 'L';
export type AlertKind = 'out_of_limits' | 'run_rule' | 'overdue' | 'addition_missing' | 'end_of_life';
export type AlertState = 'open' | 'acknowledged' | 'escalated';
export type AlertEmailKind = 'raised' | 'escalated';

export type TankAnalytesTable = {
  id: Generated<string>;
  tank_id: string;
  key: string;
  name: string;
  unit: string;
  method_id: string;
  target: Numeric;
  lower_control: NumericNullable;
  upper_control: NumericNullable;
  lower_spec: NumericNullable;
  upper_spec: NumericNullable;
  frequency_hours: Numeric;
  additive_rate_ml_per_kah: NumericNullable;
  /** A lib/bath/additions Supply, or an additive marker; see lib/bath/templates/supplies.ts. */
  supply: Json<unknown> | null;
  basis: Generated<string>;
  sort_order: Generated<number>;
  is_active: Generated<boolean>;
  created_at: Timestamp;
  updated_at: Timestamp;
  /** Counts changes to the analyte's analyses (a trigger); chart_cache entries are kept under it. */
  analyses_version: Generated<string>;
};

/** A control chart's JSON, worked out once per change of its analyte (lib/bath/chart-cache.ts). */
export type ChartCacheTable = {
  analyte_id: string;
  view: string;
  version: string;
  body: string;
  created_at: Generated<Date>;
};

export type AnalyteLimitChangesTable = {
  id: Generated<number>;
  analyte_id: string;
  changed_by: string;
  reason: string;
  before: Json<Record<string, number | null>>;
  after: Json<Record<string, number | null>>;
  created_at: Timestamp;
};

export type AnalysesTable = {
  id: Generated<string>;
  tank_id: string;
  analyte_id: string;
  method_id: string;
  inputs: Json<Record<string, unknown>>;
  value: Numeric;
  unit: string;
  verdict: AnalysisVerdict;
  severity: number;
  rules: Generated<string[]>;
  recommendation: Json<unknown> | null;
  source: AnalysisSource;
  taken_at: Timestamp;
  logged_by: string;
  idempotency_key: string;
  supersedes_id: string | null;
  note: Generated<string>;
  created_at: Timestamp;
};

export type AdditionsTable = {
  id: Generated<string>;
  tank_id: string;
  analyte_id: string | null;
  analysis_id: string | null;
  kind: AdditionKind;
  material: string;
  amount: Numeric;
  unit: AdditionUnit;
  recommended_amount: NumericNullable;
  recommended_unit: AdditionUnit | null;
  reason: Generated<string>;
  made_at: Timestamp;
  made_by: string;
  idempotency_key: string;
  supersedes_id: string | null;
  created_at: Timestamp;
};

export type MeterReadingsTable = {
  id: Generated<string>;
  tank_id: string;
  amp_hours: Numeric;
  read_at: Timestamp;
  read_by: string;
  idempotency_key: string;
  supersedes_id: string | null;
  note: Generated<string>;
  created_at: Timestamp;
};

export type HullCellPanelsTable = {
  id: Generated<string>;
  tank_id: string;
  file_id: string | null;
  current_a: Numeric;
  minutes: Numeric;
  notes: Generated<string>;
  made_at: Timestamp;
  made_by: string;
  idempotency_key: string;
  created_at: Timestamp;
};

export type BathAlertsTable = {
  id: Generated<string>;
  tank_id: string;
  analyte_id: string | null;
  analysis_id: string | null;
  kind: AlertKind;
  state: Generated<AlertState>;
  dedupe_key: string;
  message: string;
  detail: Json<Record<string, unknown>>;
  occurrences: Generated<number>;
  raised_at: Timestamp;
  last_seen_at: Timestamp;
  escalated_at: TimestampNullable;
  acknowledged_at: TimestampNullable;
  acknowledged_by: string | null;
  corrective_action: string | null;
};

export type BathAlertEmailsTable = {
  alert_id: string;
  kind: AlertEmailKind;
  recipient: string;
  status: Generated<'pending' | 'sent' | 'failed'>;
  created_at: Timestamp;
  sent_at: TimestampNullable;
};

export type BathTables = {
  tank_analytes: TankAnalytesTable;
  chart_cache: ChartCacheTable;
  analyte_limit_changes: AnalyteLimitChangesTable;
  analyses: AnalysesTable;
  additions: AdditionsTable;
  meter_readings: MeterReadingsTable;
  hull_cell_panels: HullCellPanelsTable;
  bath_alerts: BathAlertsTable;
  bath_alert_emails: BathAlertEmailsTable;
};

export type TankAnalyte = Selectable<TankAnalytesTable>;
export type Analysis = Selectable<AnalysesTable>;
export type Addition = Selectable<AdditionsTable>;
export type MeterReading = Selectable<MeterReadingsTable>;
export type BathAlert = Selectable<BathAlertsTable>;
