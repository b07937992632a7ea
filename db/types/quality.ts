// Tables of migration 2026_12_01_2240_create_quality_records.
import type { Generated, Selectable } from 'kysely';
import type { Json, Numeric, NumericNullable, Timestamp, TimestampNullable } from './columns';

// Defaulted timestamps use Timestamp (its insert type allows undefined) rather than Generated<…>,
// which would select as the column-type wrapper instead of Date.

/** ASTM method numbers for coating thickness. */
export type ThicknessMethod = 'B568' | 'B499' | 'B244' | 'B504' | 'B487' | 'B567';
export type ReadingStatusColumn = 'pass' | 'below_minimum' | 'above_maximum';
export type NonconformanceSource = 'thickness' | 'bake' | 'bath' | 'other';
export type Disposition = 'rework' | 'strip_and_replate' | 'use_as_is' | 'scrap';

export type SamplingPlansTable = {
  id: Generated<string>;
  name: string;
  source: Generated<string>;
  is_active: Generated<boolean>;
  created_by: string | null;
  created_at: Timestamp;
};

export type SamplingPlanRowsTable = {
  plan_id: string;
  position: number;
  min_lot: number;
  max_lot: number | null;
  code_letter: string;
  sample_size: number;
};

export type ThicknessReadingsTable = {
  id: Generated<string>;
  work_order_id: string;
  part_no: number;
  location: string;
  method: ThicknessMethod;
  thickness_um: Numeric;
  minimum_um: Numeric;
  maximum_um: NumericNullable;
  status: ReadingStatusColumn;
  entry: 'manual' | 'csv';
  upload_id: string | null;
  source_file_id: string | null;
  recorded_by: string | null;
  recorded_at: Timestamp;
  voided_at: TimestampNullable;
  voided_by: string | null;
  void_reason: string | null;
};

/** A reason the bake failed, as judged when it was recorded (lib/quality/bake.ts BakeReason). */
export type StoredBakeReason = { code: string; message: string };

export type BakeRecordsTable = {
  id: Generated<string>;
  work_order_id: string;
  plating_ended_at: Timestamp;
  oven: string;
  bake_started_at: Timestamp;
  temp_min_c: Numeric;
  temp_max_c: Numeric;
  duration_h: Numeric;
  chart_file_id: string | null;
  required_min_hours: NumericNullable;
  required_min_temp_c: Numeric;
  required_max_temp_c: Numeric;
  window_hours: Numeric;
  deadline_at: Timestamp;
  verdict: 'pass' | 'fail';
  reasons: Json<StoredBakeReason[]>;
  notes: Generated<string>;
  recorded_by: string | null;
  recorded_at: Timestamp;
  disposition_reason: string | null;
  disposition_by: string | null;
  disposition_at: TimestampNullable;
};

export type BakeWindowAlertsTable = {
  work_order_id: string;
  deadline_at: Timestamp;
  sent_to: Generated<string[]>;
  sent_at: Timestamp;
};

export type NonconformancesTable = {
  id: Generated<string>;
  work_order_id: string;
  source: NonconformanceSource;
  description: string;
  opened_by: string | null;
  opened_at: Timestamp;
  disposition: Disposition | null;
  customer_approval_ref: string | null;
  disposition_note: string | null;
  dispositioned_by: string | null;
  dispositioned_at: TimestampNullable;
  closed_at: TimestampNullable;
};

export type CertificatesTable = {
  id: Generated<string>;
  number: string;
  work_order_id: string;
  customer_id: string;
  content: Json<unknown>;
  pdf_file_id: string;
  signed_by: string | null;
  signed_by_name: string;
  signed_at: Timestamp;
};

// Migration 2026_12_03_1000_add_process_families: the families' own lot records.
export type ProcessRecordKind = 'seal_test' | 'phosphorus_content' | 'passivation_lot' | 'passivation_test' | 'salt_spray';

export type ProcessRecordsTable = {
  id: Generated<string>;
  work_order_id: string;
  kind: ProcessRecordKind;
  method: string;
  values: Json<Record<string, number | string>>;
  verdict: 'pass' | 'fail';
  reasons: Json<string[]>;
  notes: Generated<string>;
  recorded_by: string | null;
  recorded_at: Timestamp;
  voided_at: TimestampNullable;
  voided_by: string | null;
  void_reason: string | null;
};

export type QualityTables = {
  process_records: ProcessRecordsTable;
  sampling_plans: SamplingPlansTable;
  sampling_plan_rows: SamplingPlanRowsTable;
  thickness_readings: ThicknessReadingsTable;
  bake_records: BakeRecordsTable;
  bake_window_alerts: BakeWindowAlertsTable;
  nonconformances: NonconformancesTable;
  certificates: CertificatesTable;
};

export type ThicknessReading = Selectable<ThicknessReadingsTable>;
export type BakeRecord = Selectable<BakeRecordsTable>;
export type Nonconformance = Selectable<NonconformancesTable>;
export type Certificate = Selectable<CertificatesTable>;
export type ProcessRecord = Selectable<ProcessRecordsTable>;
