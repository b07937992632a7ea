import 'server-only';
import { Lucia } from 'lucia';
import { NodePostgresAdapter } from '@lucia-auth/adapter-postgresql';
import { pool } from '@/db';
import type { Role, UnitSystem } from '@/db/types';

const adapter = new NodePostgresAdapter(pool, { user: 'users', session: 'sessions' });

export const lucia = new Lucia(adapter, {
  sessionCookie: {
    name: 'ampwright_session',
    expires: false,
    // Lucia always sets httpOnly; SameSite=Lax; Secure only when the app is served over https.
    attributes: { secure: (process.env.APP_URL ?? '').startsWith('https://'), sameSite: 'lax' },
  },
  // The adapter returns every column, the password hash included: pass on only what pages need.
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
  }
}
