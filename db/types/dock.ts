// Tables of migration 2026_12_03_2200_dock_records.
import type { Generated, Selectable } from 'kysely';
import type { DateColumn, GeneratedTimestamp, NumericNullable, TimestampNullable } from './columns';

export type Discrepancy = 'none' | 'short' | 'over' | 'damaged' | 'wrong_part';
export type CountMoveKind = 'scrap' | 'hold' | 'release' | 'scrap_held';

export type ReceiptsTable = {
  id: Generated<string>;
  number: string;
  work_order_id: string;
  customer_id: string;
  received_at: GeneratedTimestamp;
  received_by: string | null;
  quantity: number;
  weight_kg: NumericNullable;
  containers: number;
  condition_note: Generated<string>;
  customer_part_number: Generated<string>;
  customer_lot: Generated<string>;
  discrepancy: Generated<Discrepancy>;
  discrepancy_note: Generated<string>;
  discrepancy_emailed_at: TimestampNullable;
  is_return: Generated<boolean>;
  created_at: GeneratedTimestamp;
};

export type ReceiptPhotosTable = { receipt_id: string; file_id: string };

export type CountMovesTable = {
  id: Generated<number>;
  work_order_id: string;
  kind: CountMoveKind;
  quantity: number;
  reason: string;
  actor_id: string | null;
  created_at: GeneratedTimestamp;
};

export type ShipmentsTable = {
  id: Generated<string>;
  number: string;
  work_order_id: string;
  customer_id: string;
  shipped_at: GeneratedTimestamp;
  shipped_by: string | null;
  quantity: number;
  containers: number;
  weight_kg: NumericNullable;
  carrier: string;
  tracking_number: Generated<string>;
  ship_to: Generated<string>;
  certificate_id: string | null;
  slip_file_id: string;
  emailed_at: TimestampNullable;
  email_to: string | null;
  created_at: GeneratedTimestamp;
};

export type SchedulePlacementsTable = {
  work_order_id: string;
  tank_id: string;
  day: DateColumn;
  placed_by: string | null;
  placed_at: GeneratedTimestamp;
};

export type DockTables = {
  receipts: ReceiptsTable;
  receipt_photos: ReceiptPhotosTable;
  count_moves: CountMovesTable;
  shipments: ShipmentsTable;
  schedule_placements: SchedulePlacementsTable;
};

export type Receipt = Selectable<ReceiptsTable>;
export type Shipment = Selectable<ShipmentsTable>;
