// Sign-in that a stranger cannot turn against an account: delays per account and client, known
// devices and reset links getting in, the holder told, and the second factor (RFC 6238 codes,
// recovery codes) with a password-only session that reaches nothing.
import { sql } from 'kysely';
import { Secret, TOTP } from 'otpauth';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { setPasswordWithToken, signIn } from '@/lib/auth/account';
import { missingStep } from '@/lib/auth/current-user';
import { rememberDevice } from '@/lib/auth/devices';
import { lucia } from '@/lib/auth/lucia';
import {
  acceptedStep,
  beginEnrolment,
  completeSignIn,
  confirmEnrolment,
  MAX_SECOND_FACTOR_FAILURES,
  RECOVERY_CODE_COUNT,
  secondFactorStatus,
  turnOffSecondFactor,
} from '@/lib/auth/second-factor';
import { delayAfterFailures, SIGN_IN_LIMITS, signInWaitSeconds } from '@/lib/auth/throttle';
import { issuePasswordToken } from '@/lib/auth/tokens';
import { AppError } from '@/lib/errors';
import { DEMO_OWNER_TOTP_SECRET, DEMO_PASSWORD } from '@/lib/seed';

afterAll(() => db.destroy());
beforeEach(async () => {
  await db.deleteFrom('sign_in_attempts').execute();
  await db.deleteFrom('sign_in_notices').execute();
});

const PLATER = 'plater@kestrel-plating.test';
const OWNER = 'owner@kestrel-plating.test';

async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'none';
  } catch (e) {
    return e instanceof AppError ? `${e.code}: ${e.message}${e.fieldErrors ? ` ${JSON.stringify(e.fieldErrors)}` : ''}` : String(e);
  }
}

/** Moves every recorded attempt `seconds` into the past, as if that much time had gone by. */
async function timePasses(seconds: number): Promise<void> {
  await db.updateTable('sign_in_attempts').set({ created_at: sql`created_at - make_interval(secs => ${seconds})` }).execute();
}

const totp = (secret: string) => new TOTP({ algorithm: 'SHA1', digits: 6, period: 30, secret: Secret.fromBase32(secret) });
const stepNow = () => Math.floor(Date.now() / 30_000);

describe('the delay schedule', () => {
  it('gives three free tries, then doubles from 15 s up to 15 minutes', () => {
    expect([0, 1, 2].map(delayAfterFailures)).toEqual([0, 0, 0]);
    expect([3, 4, 5, 6, 7, 8, 9].map(delayAfterFailures)).toEqual([15, 30, 60, 120, 240, 480, 900]);
    expect(delayAfterFailures(50)).toBe(SIGN_IN_LIMITS.maxDelaySeconds);
  });
});

describe('throttling a stranger, not the account holder', () => {
  it('a guesser at one address waits longer after each failure; the holder at another address is not slowed', async () => {
    const guesser = { key: 'ip:203.0.113.7', ip: '203.0.113.7', known: false };
    for (let i = 0; i < 3; i++) await codeOf(signIn(PLATER, `guess-${i}`, { ip: guesser.ip }));
    const first = await signInWaitSeconds(PLATER, guesser);
    expect(first).toBeGreaterThan(10);
    expect(first).toBeLessThanOrEqual(15);
    expect(await codeOf(signIn(PLATER, DEMO_PASSWORD, { ip: guesser.ip }))).toMatch(/^RATE_LIMITED: .*Wait 1[0-5] seconds/);
    await timePasses(16);
    await codeOf(signIn(PLATER, 'guess-3', { ip: guesser.ip }));
    const second = await signInWaitSeconds(PLATER, guesser);
    expect(second).toBeGreaterThan(25);
    expect(second).toBeLessThanOrEqual(30);
    // the plater, elsewhere, signs in at once
    expect((await signIn(PLATER, DEMO_PASSWORD, { ip: '198.51.100.20' })).role).toBe('plater');
  });

  it('a browser that signed in before gets in from the same address a stranger is hammering', async () => {
    const plater = await db.selectFrom('users').select(['id', 'email', 'name']).where('email', '=', PLATER).executeTakeFirstOrThrow();
    const deviceToken = await rememberDevice(plater, { ip: '192.0.2.50', userAgent: 'test tablet' });
    // a stranger behind the same shop address: failures on this account and a spray over others
    for (let i = 0; i < 12; i++) await codeOf(signIn(PLATER, `guess-${i}`, { ip: '192.0.2.50' }));
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) await codeOf(signIn(`spray${i}@nowhere.test`, 'x', { ip: '192.0.2.50' }));
    expect(await codeOf(signIn(PLATER, DEMO_PASSWORD, { ip: '192.0.2.50' }))).toMatch(/^RATE_LIMITED/);
    expect((await signIn(PLATER, DEMO_PASSWORD, { ip: '192.0.2.50', deviceToken })).role).toBe('plater');
    // a device cookie of another account does not count for this one
    const estimator = await db.selectFrom('users').select(['id', 'email', 'name']).where('email', '=', 'estimator@kestrel-plating.test').executeTakeFirstOrThrow();
    const otherToken = await rememberDevice(estimator, { ip: '192.0.2.50', userAgent: 'x' });
    expect(await codeOf(signIn(PLATER, DEMO_PASSWORD, { ip: '192.0.2.50', deviceToken: otherToken }))).toMatch(/^RATE_LIMITED/);
  });

  it('an account tried from very many addresses slows unknown clients; a reset link lets the holder in', async () => {
    const rows = Array.from({ length: SIGN_IN_LIMITS.perAccountUnknownClients }, (_, i) => ({
      email_key: PLATER,
      ip: `100.64.${Math.floor(i / 250)}.${i % 250}`,
      client_key: `ip:100.64.${Math.floor(i / 250)}.${i % 250}`,
      succeeded: false,
    }));
    await db.insertInto('sign_in_attempts').values(rows).execute();
    expect(await codeOf(signIn(PLATER, DEMO_PASSWORD, { ip: '198.51.100.99' }))).toMatch(/^RATE_LIMITED/);
    const plater = await db.selectFrom('users').select('id').where('email', '=', PLATER).executeTakeFirstOrThrow();
    await setPasswordWithToken(await issuePasswordToken(plater.id, 'reset'), DEMO_PASSWORD);
    expect((await signIn(PLATER, DEMO_PASSWORD, { ip: '198.51.100.99' })).role).toBe('plater');
  });

  it('tells the account holder (and the owner) once of repeated failures', async () => {
    const before = await db.selectFrom('emails').select(['template', 'to_address']).where('template', 'in', ['sign-in-failures', 'sign-in-failures-owner']).execute();
    for (let i = 0; i < SIGN_IN_LIMITS.noticeAt + 4; i++) await codeOf(signIn(PLATER, `guess-${i}`, { ip: `203.0.113.${i}` }));
    const after = await db.selectFrom('emails').select(['template', 'to_address']).where('template', 'in', ['sign-in-failures', 'sign-in-failures-owner']).execute();
    const added = after.slice(before.length);
    expect(added.filter((m) => m.template === 'sign-in-failures').map((m) => m.to_address)).toEqual([PLATER]);
    expect(added.filter((m) => m.template === 'sign-in-failures-owner').map((m) => m.to_address)).toEqual([OWNER]);
    // an address with no account tells nobody
    for (let i = 0; i < SIGN_IN_LIMITS.noticeAt + 1; i++) await codeOf(signIn('ghost@nowhere.test', 'x', { ip: `203.0.113.${i}` }));
    const ghost = await db.selectFrom('emails').select('id').where('to_address', '=', 'ghost@nowhere.test').execute();
    expect(ghost).toHaveLength(0);
  });
});

describe('second factor', () => {
  it('codes match the RFC 6238 test vector and one step of drift either way', () => {
    // RFC 6238 Appendix B: SHA-1 key "12345678901234567890", T = 59 s, 8 digits → 94287082.
    const rfc = new TOTP({ algorithm: 'SHA1', digits: 8, period: 30, secret: Secret.fromLatin1('12345678901234567890') });
    expect(rfc.generate({ timestamp: 59_000 })).toBe('94287082');
    const t = totp(DEMO_OWNER_TOTP_SECRET);
    const now = 1_800_000_000_000;
    expect(acceptedStep(DEMO_OWNER_TOTP_SECRET, t.generate({ timestamp: now - 30_000 }), now)).toBe(now / 30_000 - 1);
    expect(acceptedStep(DEMO_OWNER_TOTP_SECRET, t.generate({ timestamp: now + 30_000 }), now)).toBe(now / 30_000 + 1);
    expect(acceptedStep(DEMO_OWNER_TOTP_SECRET, t.generate({ timestamp: now + 90_000 }), now)).toBeNull();
    expect(acceptedStep(DEMO_OWNER_TOTP_SECRET, 'abcdef', now)).toBeNull();
  });

  it('the owner must give a code; a password-only session reaches nothing', async () => {
    const r = await signIn(OWNER, DEMO_PASSWORD, { ip: '10.20.0.1' });
    expect(r.next).toBe('verify');
    const { session, user } = await lucia.validateSession(r.sessionId);
    expect(missingStep(user!, session!)).toBe('verify');
    // without an enrolled factor the owner would have to set one up first
    expect(missingStep({ role: 'owner' }, { secondFactor: false, userHasTwoFactor: false })).toBe('enrol');
    expect(missingStep({ role: 'plater' }, { secondFactor: false, userHasTwoFactor: false })).toBeNull();
    await lucia.invalidateSession(r.sessionId);
  });

  it('enrols, refuses a wrong or reused code, takes a recovery code once, and ends the session after five wrong codes', async () => {
    const user = await db.selectFrom('users').select(['id']).where('email', '=', 'supervisor@kestrel-plating.test').executeTakeFirstOrThrow();
    await db.updateTable('users').set({ totp_secret: null, totp_enabled_at: null, totp_last_step: null }).where('id', '=', user.id).execute();
    const { secret, uri } = await beginEnrolment(user.id);
    expect(uri).toMatch(/^otpauth:\/\/totp\/Ampwright:supervisor%40kestrel-plating\.test\?.*secret=/);
    expect(await codeOf(confirmEnrolment(user.id, '000000'))).toMatch(/^BAD_INPUT/);
    expect((await secondFactorStatus(user.id)).enabled).toBe(false);
    const enrolCode = totp(secret).generate();
    const codes = await confirmEnrolment(user.id, enrolCode);
    expect(codes).toHaveLength(RECOVERY_CODE_COUNT);
    expect(new Set(codes).size).toBe(RECOVERY_CODE_COUNT);
    expect(await secondFactorStatus(user.id)).toMatchObject({ enabled: true, recoveryCodesLeft: 10 });
    const stored = await db.selectFrom('recovery_codes').select('code_hash').where('user_id', '=', user.id).execute();
    expect(stored.map((s) => s.code_hash)).not.toContain(codes[0]);

    const first = await signIn('supervisor@kestrel-plating.test', DEMO_PASSWORD, { ip: '10.20.0.2' });
    expect(first.next).toBe('verify');
    // the code used to enrol is spent: the same code again is refused
    expect(await codeOf(completeSignIn(first.sessionId, enrolCode))).toMatch(/used already|does not match/);
    // a recovery code works, once
    const full = await completeSignIn(first.sessionId, codes[0]!.toUpperCase());
    const { session } = await lucia.validateSession(full.sessionId);
    expect(session?.secondFactor).toBe(true);
    expect(await db.selectFrom('sessions').select('id').where('id', '=', first.sessionId).executeTakeFirst()).toBeUndefined();
    expect((await secondFactorStatus(user.id)).recoveryCodesLeft).toBe(9);
    const again = await signIn('supervisor@kestrel-plating.test', DEMO_PASSWORD, { ip: '10.20.0.2' });
    expect(await codeOf(completeSignIn(again.sessionId, codes[0]!))).toMatch(/not an unused recovery code/);
    // a fresh code from the app (next step, as the app would show in 30 s) works
    const next = totp(secret).generate({ timestamp: (stepNow() + 1) * 30_000 });
    await completeSignIn(again.sessionId, next);
    expect(await codeOf(completeSignIn((await signIn('supervisor@kestrel-plating.test', DEMO_PASSWORD, { ip: '10.20.0.2' })).sessionId, next))).toMatch(/used already/);

    // five wrong codes end a password-only session
    const victim = await signIn('supervisor@kestrel-plating.test', DEMO_PASSWORD, { ip: '10.20.0.3' });
    for (let i = 1; i < MAX_SECOND_FACTOR_FAILURES; i++) expect(await codeOf(completeSignIn(victim.sessionId, '123456'))).toMatch(/^BAD_INPUT/);
    expect(await codeOf(completeSignIn(victim.sessionId, '123456'))).toMatch(/^UNAUTHENTICATED: Too many wrong codes/);
    expect(await db.selectFrom('sessions').select('id').where('id', '=', victim.sessionId).executeTakeFirst()).toBeUndefined();

    // turned off with a current code; the owner may not turn theirs off
    const step = stepNow() + 1;
    await db.updateTable('users').set({ totp_last_step: step - 2 }).where('id', '=', user.id).execute();
    await turnOffSecondFactor(user.id, totp(secret).generate({ timestamp: step * 30_000 }));
    expect((await secondFactorStatus(user.id)).enabled).toBe(false);
    expect(await db.selectFrom('recovery_codes').select('code_hash').where('user_id', '=', user.id).execute()).toHaveLength(0);
    const owner = await db.selectFrom('users').select('id').where('email', '=', OWNER).executeTakeFirstOrThrow();
    expect(await codeOf(turnOffSecondFactor(owner.id, '123456'))).toMatch(/^FORBIDDEN: The owner account must keep its second factor/);
  });
});
