// The one Database interface, assembled from one file per migration group under db/types/.
// Written beside the migrations; tests/integration/schema.test.ts checks each table exists.
import type { FoundationTables } from './types/foundation';
import type { CoreRecordTables } from './types/core-records';
import type { QuoteTables } from './types/quotes';
import type { QualityTables } from './types/quality';
import type { BillingTables } from './types/billing';
import type { BathTables } from './types/bath';
import type { DockTables } from './types/dock';

export type Database = FoundationTables & CoreRecordTables & QuoteTables & QualityTables & BillingTables & BathTables & DockTables;

export * from './types/foundation';
export * from './types/core-records';
export * from './types/quotes';
export * from './types/quality';
export * from './types/billing';
export * from './types/bath';
export * from './types/dock';
export type { Json, Timestamp, GeneratedTimestamp, TimestampNullable, DateColumn, Numeric, NumericNullable } from './types/columns';
