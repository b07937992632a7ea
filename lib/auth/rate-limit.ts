import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';

// Sign-in throttling kept in PostgreSQL so that it holds across processes and restarts.
// Failures are counted per e-mail address (whether or not an account exists, so the answer never
// reveals it) and per client address, over a sliding window.
export const SIGN_IN_LIMITS = { windowMinutes: 15, perAccount: 5, perAddress: 30 } as const;

export async function signInBlockedFor(emailKey: string, ip: string): Promise<number | null> {
  const row = await db
    .selectFrom('sign_in_attempts')
    .select([
      sql<number>`count(*) filter (where email_key = ${emailKey})::int`.as('byAccount'),
      sql<number>`count(*) filter (where ip = ${ip})::int`.as('byAddress'),
      sql<Date | null>`min(created_at)`.as('oldest'),
    ])
    .where('succeeded', '=', false)
    .where(sql<boolean>`created_at > now() - make_interval(mins => ${SIGN_IN_LIMITS.windowMinutes})`)
    .where((eb) => eb.or([eb('email_key', '=', emailKey), eb('ip', '=', ip)]))
    .executeTakeFirstOrThrow();
  if (row.byAccount < SIGN_IN_LIMITS.perAccount && row.byAddress < SIGN_IN_LIMITS.perAddress) return null;
  const oldest = row.oldest ? new Date(row.oldest).getTime() : Date.now();
  const retryMs = oldest + SIGN_IN_LIMITS.windowMinutes * 60_000 - Date.now();
  return Math.max(1, Math.ceil(retryMs / 60_000));
}

export async function recordSignInAttempt(emailKey: string, ip: string, succeeded: boolean): Promise<void> {
  await db.insertInto('sign_in_attempts').values({ email_key: emailKey, ip, succeeded }).execute();
  if (succeeded) {
    // A successful sign-in clears that account's failures.
    await db.deleteFrom('sign_in_attempts').where('email_key', '=', emailKey).where('succeeded', '=', false).execute();
  }
}
