import 'server-only';
import type { Kysely } from 'kysely';
import type pg from 'pg';
import type { Database } from './types';
import { createPool } from './pool';
import { createDb } from './kysely';

// One pool and one Kysely instance per process; kept on globalThis so dev hot reload reuses them.
const g = globalThis as unknown as { __ampwrightPool?: pg.Pool; __ampwrightDb?: Kysely<Database> };
export const pool: pg.Pool = (g.__ampwrightPool ??= createPool());
export const db: Kysely<Database> = (g.__ampwrightDb ??= createDb(pool));

export type { Database } from './types';
