import 'server-only';
import { type DatabaseSession, type DatabaseUser, Lucia } from 'lucia';
import { NodePostgresAdapter } from '@lucia-auth/adapter-postgresql';
import { sql } from 'kysely';
import { db, pool } from '@/db';
import type { Role, UnitSystem } from '@/db/types';

// Every signed-in request validates its session. The stock adapter reads it in two queries (the
// session, then `users.*` joined again by session id); one join that reads only the columns
// getUserAttributes passes on does it in one round trip and never loads the password hash.
class SessionAdapter extends NodePostgresAdapter {
  override async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = await db
      .selectFrom('sessions as s')
      .innerJoin('users as u', 'u.id', 's.user_id')
      .select(['s.id', 's.user_id', 's.expires_at', 's.second_factor', 's.second_factor_failures', 'u.email', 'u.name', 'u.role', 'u.customer_id', 'u.unit_system', 'u.is_active'])
      .select(sql<boolean>`u.totp_enabled_at is not null`.as('two_factor'))
      .where('s.id', '=', sessionId)
      .executeTakeFirst();
    if (!row) return [null, null];
    const { id, user_id, expires_at, second_factor, second_factor_failures, two_factor, ...attributes } = row;
    return [
      { id, userId: user_id, expiresAt: expires_at, attributes: { second_factor, second_factor_failures, two_factor } },
      { id: user_id, attributes },
    ];
  }
}

export const sessionAdapter = new SessionAdapter(pool, { user: 'users', session: 'sessions' });

export const lucia = new Lucia(sessionAdapter, {
  sessionCookie: {
    name: 'ampwright_session',
    expires: false,
    // Lucia always sets httpOnly; SameSite=Lax; Secure only when the app is served over https.
    attributes: { secure: (process.env.APP_URL ?? '').startsWith('https://'), sameSite: 'lax' },
  },
  getSessionAttributes: (a) => ({ secondFactor: a.second_factor, userHasTwoFactor: !!a.two_factor }),
  // Pass on only what pages need.
  getUserAttributes: (a) => ({
    email: a.email,
    name: a.name,
    role: a.role,
    customerId: a.customer_id,
    unitSystem: a.unit_system,
    isActive: a.is_active,
  }),
});

declare module 'lucia' {
  interface Register {
    Lucia: typeof lucia;
    DatabaseUserAttributes: {
      email: string;
      name: string;
      role: Role;
      customer_id: string | null;
      unit_system: UnitSystem;
      is_active: boolean;
    };
    // A session opened by the password alone has second_factor false (lib/auth/current-user.ts).
    DatabaseSessionAttributes: { second_factor: boolean; second_factor_failures: number; two_factor?: boolean };
  }
}
