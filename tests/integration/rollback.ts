// Runs `fn` in a transaction that is always rolled back, so a test leaves the shared database as it was.
import type { Kysely, Transaction } from 'kysely';
import { db, type Database } from '@/db';

class Rollback extends Error {}

export async function inRolledBackTransaction<T>(fn: (trx: Transaction<Database>) => Promise<T>): Promise<T> {
  let result: T | undefined;
  try {
    await db.transaction().execute(async (trx) => {
      result = await fn(trx);
      throw new Rollback();
    });
  } catch (e) {
    if (!(e instanceof Rollback)) throw e;
  }
  return result as T;
}

export type AnyDb = Kysely<any>;
