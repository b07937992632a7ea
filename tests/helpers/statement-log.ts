// A Kysely on the app's pool that writes down every statement it sends, to see what a read costs.
import { Kysely, PostgresDialect } from 'kysely';
import { pool } from '@/db';
import type { Database } from '@/db/types';

export function statementLog(): { db: Kysely<Database>; sent: string[] } {
  const sent: string[] = [];
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }), log: (e) => void (e.level === 'query' && sent.push(e.query.sql)) });
  return { db, sent };
}
