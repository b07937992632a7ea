import type { Kysely } from 'kysely';
import type { Database } from '@/db';

/** Runs `work` in a transaction: the caller's, when `q` already is one (tests roll theirs back), else a new one. */
export function inTransaction<T>(q: Kysely<Database>, work: (trx: Kysely<Database>) => Promise<T>): Promise<T> {
  return q.isTransaction ? work(q) : q.transaction().execute(work);
}
