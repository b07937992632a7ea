import { NodePostgresAdapter } from '@lucia-auth/adapter-postgresql';
import { afterAll, describe, expect, it } from 'vitest';
import { db, pool } from '@/db';
import { lucia, sessionAdapter } from '@/lib/auth/lucia';

const ESTIMATOR = 'demo-estimator-estimator';
const stock = new NodePostgresAdapter(pool, { user: 'users', session: 'sessions' });
const made: string[] = [];

afterAll(async () => {
  await db.deleteFrom('sessions').where('id', 'in', made).execute();
  await db.destroy();
});

async function sessionFor(userId: string, expiresAt: Date): Promise<string> {
  const id = `session-test-${made.length}-${Date.now().toString(36)}`;
  await db.insertInto('sessions').values({ id, user_id: userId, expires_at: expiresAt }).execute();
  made.push(id);
  return id;
}

describe('session validation (one query per request)', () => {
  it('reads the same session and user as the stock adapter, without the password hash', async () => {
    const id = await sessionFor(ESTIMATOR, new Date(Date.now() + 20 * 86_400_000));
    const [session, user] = await sessionAdapter.getSessionAndUser(id);
    const [stockSession, stockUser] = await stock.getSessionAndUser(id);
    expect(session).toEqual({ id, userId: ESTIMATOR, expiresAt: stockSession!.expiresAt, attributes: { second_factor: false, second_factor_failures: 0, two_factor: false } });
    expect(user!.id).toBe(stockUser!.id);
    expect(Object.keys(user!.attributes).sort()).toEqual(['customer_id', 'email', 'is_active', 'name', 'role', 'unit_system']);
    expect(session!.attributes.two_factor).toBe((stockUser!.attributes as Record<string, unknown>).totp_enabled_at !== null);
    for (const [k, v] of Object.entries(user!.attributes)) expect(v).toEqual((stockUser!.attributes as Record<string, unknown>)[k]);
    expect(stockUser!.attributes).toHaveProperty('password_hash');
  });

  it('answers nothing for an unknown session id', async () => {
    expect(await sessionAdapter.getSessionAndUser('no-such-session')).toEqual([null, null]);
    expect((await lucia.validateSession('no-such-session')).user).toBeNull();
  });

  it('lucia accepts a live session as it is, and refuses and removes an expired one', async () => {
    const live = await sessionFor(ESTIMATOR, new Date(Date.now() + 20 * 86_400_000));
    const ok = await lucia.validateSession(live);
    expect(ok.user).toMatchObject({ id: ESTIMATOR, role: 'estimator', isActive: true });
    expect(ok.session?.fresh).toBe(false);

    const old = await sessionFor(ESTIMATOR, new Date(Date.now() - 1000));
    expect((await lucia.validateSession(old)).user).toBeNull();
    expect(await db.selectFrom('sessions').select('id').where('id', '=', old).executeTakeFirst()).toBeUndefined();
  });
});
