// The one Database interface, assembled from one file per migration group under db/types/.
// Written beside the migrations; tests/integration/schema.test.ts checks each table exists.
import type { FoundationTables } from './types/foundation';
import type { CoreRecordTables } from './types/core-records';
import type { QuoteTables } from './types/quotes';

export type Database = FoundationTables & CoreRecordTables & QuoteTables;

export * from './types/foundation';
export * from './types/core-records';
export * from './types/quotes';
export type { Json, Timestamp, TimestampNullable, DateColumn, Numeric, NumericNullable } from './types/columns';
