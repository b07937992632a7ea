import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import { appUrl, sendEmail } from '@/lib/email/mailer';

// Sign-in throttling, kept in PostgreSQL so that it holds across processes and restarts.
//
// Failures are keyed by account and client: a client is a browser that signed in to that account
// before (its device cookie) or else the address the request came from. Each such pair gets a
// few free tries, then a delay that doubles with every further failure, so a stranger guessing
// slows only themselves. An address trying many accounts, and an account tried from very many
// addresses, slow every client without a device cookie; a known device, and a browser that has
// just used a reset link, still get in. The account holder is told of repeated failures.
export const SIGN_IN_LIMITS = {
  /** failures of one account from one client before delays start */
  freeTries: 3,
  firstDelaySeconds: 15,
  maxDelaySeconds: 15 * 60,
  pairWindowMinutes: 60,
  /** an address failing on many accounts (unknown clients only) */
  perAddress: 30,
  addressWindowMinutes: 15,
  /** an account failing from many addresses (unknown clients only) */
  perAccountUnknownClients: 100,
  accountWindowMinutes: 60,
  /** the account holder is e-mailed at this many failures in accountWindowMinutes, once per noticeHours */
  noticeAt: 10,
  noticeHours: 6,
} as const;

/** The wait after `failures` consecutive failures of one account from one client, in seconds. */
export function delayAfterFailures(failures: number): number {
  if (failures < SIGN_IN_LIMITS.freeTries) return 0;
  const doublings = Math.min(failures - SIGN_IN_LIMITS.freeTries, 20);
  return Math.min(SIGN_IN_LIMITS.maxDelaySeconds, SIGN_IN_LIMITS.firstDelaySeconds * 2 ** doublings);
}

export function waitMessage(seconds: number): string {
  const wait = seconds < 60 ? `${seconds} second${seconds === 1 ? '' : 's'}` : `${Math.ceil(seconds / 60)} minute${Math.ceil(seconds / 60) === 1 ? '' : 's'}`;
  return `Too many failed sign-in attempts from here. Wait ${wait} and try again, or use "Forgot your password?".`;
}

export type Client = { key: string; ip: string; known: boolean };

/** Seconds this client must still wait before trying this account, or 0. */
export async function signInWaitSeconds(emailKey: string, client: Client): Promise<number> {
  const L = SIGN_IN_LIMITS;
  const row = await db
    .selectFrom('sign_in_attempts')
    .select([
      sql<number>`count(*) filter (where email_key = ${emailKey} and client_key = ${client.key}
        and created_at > now() - make_interval(mins => ${L.pairWindowMinutes}))::int`.as('pair'),
      sql<Date | null>`max(created_at) filter (where email_key = ${emailKey} and client_key = ${client.key})`.as('pairLast'),
      sql<number>`count(*) filter (where ip = ${client.ip} and created_at > now() - make_interval(mins => ${L.addressWindowMinutes}))::int`.as('address'),
      sql<Date | null>`min(created_at) filter (where ip = ${client.ip} and created_at > now() - make_interval(mins => ${L.addressWindowMinutes}))`.as('addressOldest'),
      sql<number>`count(*) filter (where email_key = ${emailKey})::int`.as('account'),
      sql<Date | null>`min(created_at) filter (where email_key = ${emailKey})`.as('accountOldest'),
      sql<Date>`now()`.as('now'),
    ])
    .where('succeeded', '=', false)
    .where(sql<boolean>`created_at > now() - make_interval(mins => ${Math.max(L.pairWindowMinutes, L.accountWindowMinutes)})`)
    .where((eb) => eb.or([eb('email_key', '=', emailKey), eb('ip', '=', client.ip)]))
    .executeTakeFirstOrThrow();
  const now = new Date(row.now).getTime();
  const until = (from: Date | null, seconds: number) => (from ? Math.ceil((new Date(from).getTime() + seconds * 1000 - now) / 1000) : 0);
  let wait = until(row.pairLast, delayAfterFailures(row.pair));
  if (!client.known) {
    if (row.address >= L.perAddress) wait = Math.max(wait, until(row.addressOldest, L.addressWindowMinutes * 60));
    if (row.account >= L.perAccountUnknownClients) wait = Math.max(wait, until(row.accountOldest, L.accountWindowMinutes * 60));
  }
  return Math.max(0, wait);
}

export async function recordSignInAttempt(emailKey: string, client: Client, succeeded: boolean): Promise<void> {
  await db.insertInto('sign_in_attempts').values({ email_key: emailKey, ip: client.ip, client_key: client.key, succeeded }).execute();
  // Success clears that client's failures for the account (others' stay: they are someone else).
  if (succeeded) {
    await db.deleteFrom('sign_in_attempts').where('email_key', '=', emailKey).where('client_key', '=', client.key).where('succeeded', '=', false).execute();
  } else {
    await tellOfRepeatedFailures(emailKey);
  }
}

/** A reset link proves the mailbox: the account's failures no longer count against anyone. */
export async function clearSignInFailures(emailKey: string): Promise<void> {
  await db.deleteFrom('sign_in_attempts').where('email_key', '=', emailKey).where('succeeded', '=', false).execute();
}

// One e-mail per account per noticeHours once failures reach noticeAt within the window. The
// claim (insert … on conflict … where older) is atomic, so two app processes never both send.
async function tellOfRepeatedFailures(emailKey: string): Promise<void> {
  const L = SIGN_IN_LIMITS;
  const counts = await db
    .selectFrom('sign_in_attempts')
    .select([sql<number>`count(*)::int`.as('failures'), sql<number>`count(distinct ip)::int`.as('addresses')])
    .where('email_key', '=', emailKey)
    .where('succeeded', '=', false)
    .where(sql<boolean>`created_at > now() - make_interval(mins => ${L.accountWindowMinutes})`)
    .executeTakeFirstOrThrow();
  if (counts.failures < L.noticeAt) return;
  const user = await db.selectFrom('users').select(['id', 'name', 'role']).where('email', '=', emailKey).where('is_active', '=', true).executeTakeFirst();
  if (!user) return; // no account: nobody to tell, and nothing is revealed
  const claimed = await db
    .insertInto('sign_in_notices')
    .values({ email_key: emailKey })
    .onConflict((oc) =>
      oc.column('email_key').doUpdateSet({ sent_at: sql`now()` }).where('sign_in_notices.sent_at', '<', sql<Date>`now() - make_interval(hours => ${L.noticeHours})`),
    )
    .returning('email_key')
    .executeTakeFirst();
  if (!claimed) return;
  await db.insertInto('audit_log').values({ actor_id: null, action: 'sign-in.repeated-failures', entity: 'user', entity_id: user.id, detail: JSON.stringify(counts) }).execute();
  const text =
    `Hello ${user.name},\n\nIn the last hour someone tried to sign in to your Ampwright account (${emailKey}) with a wrong ` +
    `password ${counts.failures} times, from ${counts.addresses} address${counts.addresses === 1 ? '' : 'es'}.\n\n` +
    `Your account is not locked: you can still sign in from your usual devices. Those attempts are slowed down, not yours.\n` +
    `If this was not you, consider a longer password and a second factor (Account → Second factor):\n${appUrl('/two-factor/setup')}\n`;
  await sendEmail({ to: emailKey, template: 'sign-in-failures', subject: 'Failed sign-in attempts on your Ampwright account', text });
  if (user.role !== 'owner') {
    const owners = await db.selectFrom('users').select('email').where('role', '=', 'owner').where('is_active', '=', true).execute();
    for (const o of owners) {
      await sendEmail({
        to: o.email,
        template: 'sign-in-failures-owner',
        subject: `Failed sign-in attempts on ${user.name}'s account`,
        text: `In the last hour ${counts.failures} sign-in attempts with a wrong password were made on ${user.name}'s account (${emailKey}), from ${counts.addresses} address${counts.addresses === 1 ? '' : 'es'}. The account is not locked; the attempts are slowed down.\n`,
      });
    }
  }
}
