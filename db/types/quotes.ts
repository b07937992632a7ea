// Tables of migration 2026_12_01_2220_create_quotes_and_work_orders.
import type { Generated, Selectable } from 'kysely';
import type { DateColumn, Json, Numeric, NumericNullable, Timestamp, TimestampNullable, GeneratedTimestamp } from './columns';

export type PricingBasis = 'piece' | 'hundred' | 'kg' | 'lb' | 'ft2' | 'dm2' | 'load';
export type QuoteStatus = 'draft' | 'sent' | 'accepted' | 'declined' | 'expired' | 'superseded';
export type WorkOrderState = 'accepted' | 'received' | 'in_process' | 'plated' | 'baked' | 'inspected' | 'shipped' | 'invoiced';

export type NumberCountersTable = {
  series: 'quote' | 'work_order' | 'invoice' | 'credit_note' | 'certificate' | 'receipt' | 'shipment';
  year: number;
  last_seq: number;
};

export type QuotesTable = {
  id: Generated<string>;
  number: string;
  revision: Generated<string>;
  customer_id: string;
  contact_user_id: string | null;
  status: Generated<QuoteStatus>;
  rate_set_id: string;
  valid_days: number;
  is_rush: Generated<boolean>;
  notes: Generated<string>;
  total_cents: Generated<number>;
  previous_revision_id: string | null;
  created_by: string | null;
  created_at: GeneratedTimestamp;
  updated_at: GeneratedTimestamp;
  sent_at: TimestampNullable;
  expires_at: TimestampNullable;
  decided_at: TimestampNullable;
  decided_by: string | null;
  po_number: string | null;
  decline_reason: string | null;
  /** Working days from acceptance to shipping, from the line's schedule when the quote was sent. */
  turnaround_days: Generated<number | null>;
};

export type QuoteLinesTable = {
  id: Generated<string>;
  quote_id: string;
  line_no: number;
  part_id: string;
  finish_id: string;
  quantity: number;
  pricing_basis: PricingBasis;
  calculation: Json<unknown>;
  cost: Json<unknown>;
  computed_total_cents: number;
  override_total_cents: number | null;
  override_reason: string | null;
  override_by: string | null;
  override_at: TimestampNullable;
  total_cents: number;
  unit_price_cents: Numeric;
};

export type WorkOrdersTable = {
  id: Generated<string>;
  number: string;
  customer_id: string;
  quote_line_id: string | null;
  part_id: string;
  finish_id: string;
  po_number: string;
  due_date: DateColumn | null;
  quantity_ordered: number;
  quantity_received: Generated<number>;
  quantity_shipped: Generated<number>;
  quantity_scrapped: Generated<number>;
  quantity_held: Generated<number>;
  rework_of_id: Generated<string | null>;
  rework_nonconformance_id: Generated<string | null>;
  state: Generated<WorkOrderState>;
  bake_required: Generated<boolean>;
  is_rush: Generated<boolean>;
  unit_price_cents: Numeric;
  pricing_basis: PricingBasis;
  total_cents: number;
  quoted_cost: Json<unknown>;
  created_at: GeneratedTimestamp;
  updated_at: GeneratedTimestamp;
};

export type WorkOrderEventsTable = {
  id: Generated<number>;
  work_order_id: string;
  from_state: WorkOrderState | null;
  to_state: WorkOrderState;
  actor_id: string | null;
  note: Generated<string>;
  created_at: GeneratedTimestamp;
};

export type PlatingRunsTable = {
  id: Generated<string>;
  work_order_id: string;
  tank_id: string;
  started_at: Timestamp;
  ended_at: Timestamp;
  current_a: NumericNullable;
  meter_start_ah: NumericNullable;
  meter_stop_ah: NumericNullable;
  /** Null for a run without current (electroless nickel, passivation). */
  amp_hours: NumericNullable;
  /** Bath conditions of a run without current, e.g. temperature and concentration. */
  conditions: Json<Record<string, number>>;
  is_outside_window: Generated<boolean>;
  loads: number;
  parts_per_load: number;
  predicted_thickness_um: Numeric;
  is_below_minimum: boolean;
  logged_by: string | null;
  idempotency_key: string | null;
  created_at: GeneratedTimestamp;
};

export type QuoteTables = {
  number_counters: NumberCountersTable;
  quotes: QuotesTable;
  quote_lines: QuoteLinesTable;
  work_orders: WorkOrdersTable;
  work_order_events: WorkOrderEventsTable;
  plating_runs: PlatingRunsTable;
};

export type Quote = Selectable<QuotesTable>;
export type QuoteLine = Selectable<QuoteLinesTable>;
export type WorkOrder = Selectable<WorkOrdersTable>;
export type PlatingRun = Selectable<PlatingRunsTable>;
