import 'server-only';
import { randomInt } from 'node:crypto';
import { sql } from 'kysely';
import { Secret, TOTP } from 'otpauth';
import { db } from '@/db';
import { AppError } from '@/lib/errors';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { hashToken } from './tokens';
import { lucia } from './lucia';

// The second factor: time-based one-time codes (RFC 6238: HMAC-SHA1, 6 digits, 30-second steps,
// what every authenticator app reads from an otpauth:// link) and ten single-use recovery codes.
// The owner must have one (the money and the records); every other user may turn it on.
export const TOTP_PERIOD_SECONDS = 30;
export const RECOVERY_CODE_COUNT = 10;
export const MAX_SECOND_FACTOR_FAILURES = 5;
const ISSUER = 'Ampwright';

export function totpFor(secretBase32: string, label: string): TOTP {
  return new TOTP({ issuer: ISSUER, label, algorithm: 'SHA1', digits: 6, period: TOTP_PERIOD_SECONDS, secret: Secret.fromBase32(secretBase32) });
}

/** 20 random bytes (160 bits, RFC 4226's recommended length) as 32 base32 characters. */
export function newTotpSecret(): string {
  return new Secret({ size: 20 }).base32;
}

/**
 * The 30-second step a code belongs to if it is valid now (one step of clock drift either way),
 * or null. The caller refuses a step at or before the last one accepted.
 */
export function acceptedStep(secretBase32: string, code: string, now = Date.now()): number | null {
  if (!/^\d{6}$/.test(code)) return null;
  const delta = totpFor(secretBase32, 'check').validate({ token: code, timestamp: now, window: 1 });
  if (delta === null) return null;
  return Math.floor(now / 1000 / TOTP_PERIOD_SECONDS) + delta;
}

// Recovery codes: 10 characters of an alphabet without look-alikes, written xxxxx-xxxxx.
const RECOVERY_ALPHABET = 'abcdefghjkmnpqrstuvwxyz23456789';

export function newRecoveryCode(): string {
  let s = '';
  for (let i = 0; i < 10; i++) s += RECOVERY_ALPHABET[randomInt(RECOVERY_ALPHABET.length)];
  return `${s.slice(0, 5)}-${s.slice(5)}`;
}

/** What the user typed, as stored: lower case, no spaces or dashes. */
export function normaliseRecoveryCode(input: string): string | null {
  const s = input.toLowerCase().replace(/[\s-]/g, '');
  return /^[a-z0-9]{10}$/.test(s) ? s : null;
}

export type SecondFactorStatus = { enabled: boolean; recoveryCodesLeft: number; required: boolean };

export async function secondFactorStatus(userId: string): Promise<SecondFactorStatus> {
  const row = await db
    .selectFrom('users')
    .select([
      'role',
      'totp_enabled_at',
      (eb) => eb.selectFrom('recovery_codes').select(sql<number>`count(*)::int`.as('n')).whereRef('recovery_codes.user_id', '=', 'users.id').where('used_at', 'is', null).as('left'),
    ])
    .where('id', '=', userId)
    .executeTakeFirstOrThrow();
  return { enabled: !!row.totp_enabled_at, recoveryCodesLeft: row.left ?? 0, required: row.role === 'owner' };
}

/** Starts (or restarts) enrolment: a new secret, not yet switched on. */
export async function beginEnrolment(userId: string): Promise<{ secret: string; uri: string }> {
  const secret = newTotpSecret();
  const user = await db
    .updateTable('users')
    .set({ totp_secret: secret, totp_last_step: null })
    .where('id', '=', userId)
    .where('totp_enabled_at', 'is', null)
    .returning('email')
    .executeTakeFirst();
  if (!user) throw new AppError('CONFLICT', 'A second factor is already on for this account.');
  return { secret, uri: totpFor(secret, user.email).toString() };
}

/** The secret being enrolled, for showing its QR code again (the page reloads). */
export async function pendingEnrolment(userId: string): Promise<{ secret: string; uri: string } | null> {
  const row = await db.selectFrom('users').select(['email', 'totp_secret', 'totp_enabled_at']).where('id', '=', userId).executeTakeFirstOrThrow();
  if (row.totp_enabled_at || !row.totp_secret) return null;
  return { secret: row.totp_secret, uri: totpFor(row.totp_secret, row.email).toString() };
}

async function replaceRecoveryCodes(trx: typeof db, userId: string): Promise<string[]> {
  const codes = Array.from({ length: RECOVERY_CODE_COUNT }, newRecoveryCode);
  await trx.deleteFrom('recovery_codes').where('user_id', '=', userId).execute();
  await trx
    .insertInto('recovery_codes')
    .values(codes.map((c) => ({ code_hash: hashToken(normaliseRecoveryCode(c)!), user_id: userId })))
    .execute();
  return codes;
}

/** Switches the second factor on once the user types a code from the new secret; returns the recovery codes (shown once). */
export async function confirmEnrolment(userId: string, code: string): Promise<string[]> {
  return db.transaction().execute(async (trx) => {
    const row = await trx.selectFrom('users').select(['totp_secret', 'totp_enabled_at']).where('id', '=', userId).forUpdate().executeTakeFirstOrThrow();
    if (row.totp_enabled_at) throw new AppError('CONFLICT', 'A second factor is already on for this account.');
    if (!row.totp_secret) throw new AppError('CONFLICT', 'Start again: no set-up is in progress.');
    const step = acceptedStep(row.totp_secret, code.trim());
    if (step === null) throw new AppError('BAD_INPUT', 'Check the highlighted field.', { code: ['That code does not match. Type the 6 digits your app shows now.'] });
    await trx.updateTable('users').set({ totp_enabled_at: sql`now()`, totp_last_step: step }).where('id', '=', userId).execute();
    const codes = await replaceRecoveryCodes(trx as unknown as typeof db, userId);
    await trx.insertInto('audit_log').values({ actor_id: userId, action: 'second-factor.on', entity: 'user', entity_id: userId }).execute();
    return codes;
  });
}

/** New recovery codes replace the old ones; asks for a current code first. */
export async function regenerateRecoveryCodes(userId: string, code: string): Promise<string[]> {
  return db.transaction().execute(async (trx) => {
    await useTotpCode(trx as unknown as typeof db, userId, code);
    const codes = await replaceRecoveryCodes(trx as unknown as typeof db, userId);
    await trx.insertInto('audit_log').values({ actor_id: userId, action: 'second-factor.recovery-codes', entity: 'user', entity_id: userId }).execute();
    return codes;
  });
}

/** Turns it off (never for an owner); asks for a current code first. */
export async function turnOffSecondFactor(userId: string, code: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const user = await trx.selectFrom('users').select('role').where('id', '=', userId).executeTakeFirstOrThrow();
    if (user.role === 'owner') throw new AppError('FORBIDDEN', 'The owner account must keep its second factor.');
    await useTotpCode(trx as unknown as typeof db, userId, code);
    await trx.updateTable('users').set({ totp_secret: null, totp_enabled_at: null, totp_last_step: null }).where('id', '=', userId).execute();
    await trx.deleteFrom('recovery_codes').where('user_id', '=', userId).execute();
    await trx.insertInto('audit_log').values({ actor_id: userId, action: 'second-factor.off', entity: 'user', entity_id: userId }).execute();
  });
}

// Accepts a code once: the step is recorded by an UPDATE that only succeeds for a later step, so
// the same code (or an earlier one) cannot pass twice, even from two processes at once.
async function useTotpCode(trx: typeof db, userId: string, code: string): Promise<void> {
  const row = await trx.selectFrom('users').select(['totp_secret', 'totp_enabled_at']).where('id', '=', userId).executeTakeFirstOrThrow();
  if (!row.totp_enabled_at || !row.totp_secret) throw new AppError('CONFLICT', 'This account has no second factor.');
  const step = acceptedStep(row.totp_secret, code.trim());
  const used =
    step !== null &&
    (await trx
      .updateTable('users')
      .set({ totp_last_step: step })
      .where('id', '=', userId)
      .where((eb) => eb.or([eb('totp_last_step', 'is', null), eb('totp_last_step', '<', step)]))
      .returning('id')
      .executeTakeFirst());
  if (!used) {
    throw new AppError('BAD_INPUT', 'Check the highlighted field.', {
      code: [step === null ? 'That code does not match. Type the 6 digits your app shows now.' : 'That code has been used already. Wait for the next one.'],
    });
  }
}

export type SecondFactorResult = { sessionId: string };

/**
 * The second step of signing in. A right code (or an unused recovery code) replaces the
 * password-only session by a full one; a wrong one counts, and the fifth ends the session.
 */
export async function completeSignIn(sessionId: string, input: string): Promise<SecondFactorResult> {
  const session = await db
    .selectFrom('sessions as s')
    .innerJoin('users as u', 'u.id', 's.user_id')
    .select(['s.user_id', 's.second_factor', 's.expires_at', 'u.email', 'u.name'])
    .where('s.id', '=', sessionId)
    .executeTakeFirst();
  if (!session || session.expires_at.getTime() < Date.now()) throw new AppError('UNAUTHENTICATED', 'Sign in again.');
  const typed = input.trim();
  let usedRecovery = false;
  try {
    if (/^\d{6}$/.test(typed.replace(/\s/g, ''))) {
      await useTotpCode(db, session.user_id, typed.replace(/\s/g, ''));
    } else {
      const code = normaliseRecoveryCode(typed);
      const used =
        code &&
        (await db
          .updateTable('recovery_codes')
          .set({ used_at: sql`now()` })
          .where('code_hash', '=', hashToken(code))
          .where('user_id', '=', session.user_id)
          .where('used_at', 'is', null)
          .returning('code_hash')
          .executeTakeFirst());
      if (!used) throw new AppError('BAD_INPUT', 'Check the highlighted field.', { code: ['That is not an unused recovery code of this account.'] });
      usedRecovery = true;
    }
  } catch (err) {
    const after = await db
      .updateTable('sessions')
      .set((eb) => ({ second_factor_failures: eb('second_factor_failures', '+', 1) }))
      .where('id', '=', sessionId)
      .returning('second_factor_failures')
      .executeTakeFirst();
    if (!after || after.second_factor_failures >= MAX_SECOND_FACTOR_FAILURES) {
      await lucia.invalidateSession(sessionId);
      throw new AppError('UNAUTHENTICATED', 'Too many wrong codes. Sign in again with your password.');
    }
    throw err;
  }
  await lucia.invalidateSession(sessionId);
  const full = await lucia.createSession(session.user_id, { second_factor: true, second_factor_failures: 0 });
  if (usedRecovery) {
    const { recoveryCodesLeft } = await secondFactorStatus(session.user_id);
    await db.insertInto('audit_log').values({ actor_id: session.user_id, action: 'second-factor.recovery-used', entity: 'user', entity_id: session.user_id, detail: JSON.stringify({ left: recoveryCodesLeft }) }).execute();
    await sendEmail({
      to: session.email,
      template: 'recovery-code-used',
      subject: 'A recovery code was used on your Ampwright account',
      text: `Hello ${session.name},\n\nA recovery code was just used to sign in to your Ampwright account. ${recoveryCodesLeft} unused code${recoveryCodesLeft === 1 ? '' : 's'} remain${recoveryCodesLeft === 1 ? 's' : ''}.\nIf you have lost your authenticator, set up a new one and print new codes under Account → Second factor:\n${appUrl('/account')}\n`,
    });
  }
  return { sessionId: full.id };
}

/** After enrolment the password-only session is replaced by a full one. */
export async function upgradeSession(sessionId: string, userId: string): Promise<string> {
  await lucia.invalidateSession(sessionId);
  return (await lucia.createSession(userId, { second_factor: true, second_factor_failures: 0 })).id;
}
