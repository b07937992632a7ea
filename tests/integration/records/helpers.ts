// Runs `fn` in a transaction that is always rolled back, so a test leaves the shared database as it was.
import type { Kysely, Transaction } from 'kysely';
import { db, type Database } from '@/db';
import { AppError } from '@/lib/errors';

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



/** A seeded user as the session would give it. */
export async function sessionUserByEmail(email: string) {
  const u = await db.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirstOrThrow();
  return { id: u.id, email: u.email, name: u.name, role: u.role, customerId: u.customer_id, unitSystem: u.unit_system, isActive: u.is_active };
}

export async function customerIdByCode(code: string, q: Kysely<Database> = db): Promise<string> {
  return (await q.selectFrom('customers').select('id').where('code', '=', code).executeTakeFirstOrThrow()).id;
}

/** A short unique suffix so rows made by one test run never collide with another's. */
export function uniqueSuffix(): string {
  return `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`.toUpperCase();
}

/** "CODE: message {fieldErrors}" for an expected refusal, "done" if nothing was refused. */
export async function refusalOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'done';
  } catch (e) {
    if (!(e instanceof AppError)) throw e;
    return `${e.code}: ${e.message}${e.fieldErrors ? ` ${JSON.stringify(e.fieldErrors)}` : ''}`;
  }
}
