import type { ColumnType } from 'kysely';

// Column helpers shared by the table types.
// Optional on insert (most timestamps have a default; NOT NULL is the database's check), a Date when read.
export type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
// Kysely's Generated<> around a ColumnType would leak the wrapper into selected rows: use this instead.
export type GeneratedTimestamp = Timestamp;
export type TimestampNullable = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
export type Json<T> = ColumnType<T, string | T | undefined, string | T>;
// `date` columns come back as Date from pg; written as 'YYYY-MM-DD'.
export type DateColumn = ColumnType<Date, Date | string, Date | string>;
// numeric comes back as number (parser registered in db/pool.ts).
export type Numeric = ColumnType<number, number | string, number | string>;
export type NumericNullable = ColumnType<number | null, number | string | null | undefined, number | string | null>;
// A numeric column with a default: optional on insert.
export type NumericWithDefault = ColumnType<number, number | string | undefined, number | string>;
