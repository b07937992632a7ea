import { Kysely, PostgresDialect } from 'kysely';
import type pg from 'pg';
import type { Database } from './types';
import { createPool } from './pool';

export function createDb(pool: pg.Pool = createPool()): Kysely<Database> {
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}
