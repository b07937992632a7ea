import { sql } from 'kysely';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { inviteUser, requestPasswordReset, setPasswordWithToken, signIn, SIGN_IN_FAILED, updateUser } from '@/lib/auth/account';
import { ARGON2_OPTIONS } from '@/lib/auth/password';
import { SIGN_IN_LIMITS } from '@/lib/auth/throttle';
import { hashToken, issuePasswordToken } from '@/lib/auth/tokens';
import { AppError } from '@/lib/errors';
import { DEMO_PASSWORD } from '@/lib/seed';
import type { SessionUser } from '@/lib/auth/current-user';

afterAll(() => db.destroy());
beforeEach(async () => {
  await db.deleteFrom('sign_in_attempts').execute();
});

const OWNER = 'owner@kestrel-plating.test';

async function ownerUser(): Promise<SessionUser> {
  const u = await db.selectFrom('users').selectAll().where('email', '=', OWNER).executeTakeFirstOrThrow();
  return { id: u.id, email: u.email, name: u.name, role: u.role, customerId: u.customer_id, unitSystem: u.unit_system, isActive: u.is_active };
}

async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'none';
  } catch (e) {
    return e instanceof AppError ? `${e.code}: ${e.message}` : String(e);
  }
}

describe('password storage', () => {
  it('uses argon2id at or above the OWASP minimum (m=19 MiB, t=2, p=1)', async () => {
    // Source: OWASP Password Storage Cheat Sheet, Argon2id recommendation.
    expect(ARGON2_OPTIONS.memoryCost).toBeGreaterThanOrEqual(19456);
    expect(ARGON2_OPTIONS.timeCost).toBeGreaterThanOrEqual(2);
    const row = await db.selectFrom('users').select('password_hash').where('email', '=', OWNER).executeTakeFirstOrThrow();
    expect(row.password_hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
  });
});

describe('sign-in', () => {
  it('accepts the right password and creates a session', async () => {
    const r = await signIn(OWNER, DEMO_PASSWORD, { ip: '10.0.0.1' });
    expect(r.role).toBe('owner');
    const s = await db.selectFrom('sessions').select('user_id').where('id', '=', r.sessionId).executeTakeFirst();
    expect(s).toBeDefined();
  });

  it('gives the same message for a wrong password and for an unknown account', async () => {
    const wrong = await codeOf(signIn(OWNER, 'not-the-password', { ip: '10.0.0.2' }));
    const unknown = await codeOf(signIn('nobody@nowhere.test', 'whatever-password', { ip: '10.0.0.2' }));
    expect(wrong).toBe(`UNAUTHENTICATED: ${SIGN_IN_FAILED}`);
    expect(unknown).toBe(wrong);
  });

  it('slows the address that keeps failing, never the account: the right password from elsewhere still gets in', async () => {
    for (let i = 0; i < 8; i++) await codeOf(signIn(OWNER, `bad-${i}`, { ip: '10.1.0.1' }));
    expect(await codeOf(signIn(OWNER, DEMO_PASSWORD, { ip: '10.1.0.1' }))).toMatch(/^RATE_LIMITED: Too many failed sign-in attempts from here/);
    expect((await signIn(OWNER, DEMO_PASSWORD, { ip: '10.1.1.1' })).role).toBe('owner');
    // an unknown account gets the same answers, so nothing reveals which accounts exist
    for (let i = 0; i < 8; i++) await codeOf(signIn('ghost@nowhere.test', `bad-${i}`, { ip: '10.2.0.1' }));
    expect(await codeOf(signIn('ghost@nowhere.test', 'x', { ip: '10.2.0.1' }))).toMatch(/^RATE_LIMITED: Too many failed sign-in attempts from here/);
  });

  it('limits one address trying many accounts', async () => {
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) await codeOf(signIn(`spray${i}@nowhere.test`, 'x', { ip: '10.9.9.9' }));
    expect(await codeOf(signIn(OWNER, DEMO_PASSWORD, { ip: '10.9.9.9' }))).toMatch(/^RATE_LIMITED/);
    // Another address is not affected.
    expect((await signIn(OWNER, DEMO_PASSWORD, { ip: '10.9.9.10' })).role).toBe('owner');
  });
});

describe('one-time password links', () => {
  it('a reset link works once, then fails', async () => {
    const owner = await ownerUser();
    const token = await issuePasswordToken(owner.id, 'reset');
    await setPasswordWithToken(token, 'a-brand-new-password');
    expect((await signIn(OWNER, 'a-brand-new-password', { ip: '10.3.0.1' })).role).toBe('owner');
    expect(await codeOf(setPasswordWithToken(token, 'yet-another-password'))).toMatch(/^CONFLICT: This link has already been used/);
    // restore the demo password for the other tests
    await setPasswordWithToken(await issuePasswordToken(owner.id, 'reset'), DEMO_PASSWORD);
  });

  it('an expired link is refused and changes nothing', async () => {
    const owner = await ownerUser();
    const token = await issuePasswordToken(owner.id, 'reset');
    await db.updateTable('password_tokens').set({ expires_at: sql`now() - interval '1 second'` }).where('token_hash', '=', hashToken(token)).execute();
    const before = await db.selectFrom('users').select('password_hash').where('id', '=', owner.id).executeTakeFirstOrThrow();
    expect(await codeOf(setPasswordWithToken(token, 'too-late-password'))).toMatch(/^CONFLICT: This link has expired/);
    const after = await db.selectFrom('users').select('password_hash').where('id', '=', owner.id).executeTakeFirstOrThrow();
    expect(after.password_hash).toBe(before.password_hash);
  });

  it('only the hash of a token is stored', async () => {
    const owner = await ownerUser();
    const token = await issuePasswordToken(owner.id, 'reset');
    const rows = await db.selectFrom('password_tokens').select('token_hash').where('user_id', '=', owner.id).execute();
    expect(rows.map((r) => r.token_hash)).toContain(hashToken(token));
    expect(rows.map((r) => r.token_hash)).not.toContain(token);
  });

  it('asking for a reset of an unknown address writes nothing', async () => {
    const before = await db.selectFrom('password_tokens').select(sql<number>`count(*)::int`.as('n')).executeTakeFirstOrThrow();
    await requestPasswordReset('nobody@nowhere.test');
    const after = await db.selectFrom('password_tokens').select(sql<number>`count(*)::int`.as('n')).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });
});

describe('invitations and roles', () => {
  it('an invited user has no password until they follow the link, then can sign in', async () => {
    const owner = await ownerUser();
    const email = `new.estimator.${Date.now()}@kestrel-plating.test`;
    const { userId } = await inviteUser(owner, { email, name: 'New Estimator', role: 'estimator' });
    expect(await codeOf(signIn(email, 'anything-at-all', { ip: '10.4.0.1' }))).toBe(`UNAUTHENTICATED: ${SIGN_IN_FAILED}`);
    const token = await issuePasswordToken(userId, 'invite');
    await setPasswordWithToken(token, 'estimator-password-1');
    expect((await signIn(email, 'estimator-password-1', { ip: '10.4.0.2' })).role).toBe('estimator');
  });

  it('refuses a duplicate e-mail with a field message and writes nothing', async () => {
    const owner = await ownerUser();
    const before = await db.selectFrom('users').select(sql<number>`count(*)::int`.as('n')).executeTakeFirstOrThrow();
    const err = await inviteUser(owner, { email: OWNER, name: 'Dup', role: 'plater' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).fieldErrors?.email?.[0]).toMatch(/already exists/);
    const after = await db.selectFrom('users').select(sql<number>`count(*)::int`.as('n')).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  it('an owner cannot demote or deactivate themselves, and a customer contact cannot become staff', async () => {
    const owner = await ownerUser();
    expect(await codeOf(updateUser(owner, owner.id, 'plater', true))).toMatch(/^CONFLICT/);
    const buyer = await db.selectFrom('users').select('id').where('email', '=', 'buyer@northgate-fastener.test').executeTakeFirstOrThrow();
    expect(await codeOf(updateUser(owner, buyer.id, 'estimator', true))).toMatch(/^CONFLICT: A customer contact cannot become staff/);
  });

  it('deactivating a user ends their sessions and blocks sign-in', async () => {
    const owner = await ownerUser();
    const email = `temp.plater.${Date.now()}@kestrel-plating.test`;
    const { userId } = await inviteUser(owner, { email, name: 'Temp Plater', role: 'plater' });
    await setPasswordWithToken(await issuePasswordToken(userId, 'invite'), 'temp-plater-password');
    await signIn(email, 'temp-plater-password', { ip: '10.5.0.1' });
    await updateUser(owner, userId, 'plater', false);
    const sessions = await db.selectFrom('sessions').select('id').where('user_id', '=', userId).execute();
    expect(sessions).toHaveLength(0);
    expect(await codeOf(signIn(email, 'temp-plater-password', { ip: '10.5.0.2' }))).toBe(`UNAUTHENTICATED: ${SIGN_IN_FAILED}`);
  });
});
