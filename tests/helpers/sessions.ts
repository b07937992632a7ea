// Signed-in callers for HTTP tests: a session row per demo user, created directly in the test
// database (the same thing signing in does), sent as the session cookie.
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import type { Role } from '@/db/types';
import { APP_URL } from './browser';
import { TEST_DATABASE_URL } from './test-db';

export type Caller = Role | 'anonymous';
export const CALLERS: Caller[] = ['anonymous', 'owner', 'estimator', 'plater', 'supervisor', 'customer'];
export const DEMO_USER_IDS: Record<Role, string> = {
  owner: 'demo-owner-owner',
  estimator: 'demo-estimator-estimator',
  plater: 'demo-plater-plater',
  supervisor: 'demo-supervisor-supervisor',
  customer: 'demo-customer-buyer',
};

export class TestSessions {
  readonly db = new pg.Client({ connectionString: TEST_DATABASE_URL });
  private readonly cookies = new Map<Caller, string>();

  async open(): Promise<void> {
    await this.db.connect();
    for (const role of Object.keys(DEMO_USER_IDS) as Role[]) {
      const id = randomBytes(20).toString('hex');
      await this.db.query(`insert into sessions (id, user_id, expires_at, second_factor) values ($1, $2, now() + interval '1 hour', true)`, [id, DEMO_USER_IDS[role]]);
      this.cookies.set(role, `ampwright_session=${id}`);
    }
  }

  async close(): Promise<void> {
    await this.db.query(`delete from sessions where id = any($1)`, [[...this.cookies.values()].map((c) => c.split('=')[1])]);
    await this.db.end();
  }

  /** The `cookie` header value that signs `caller` in (opened by open()). */
  cookie(caller: Role): string {
    const cookie = this.cookies.get(caller);
    if (!cookie) throw new Error(`no session for ${caller}: call open() first`);
    return cookie;
  }

  request(caller: Caller, url: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    const cookie = this.cookies.get(caller);
    if (cookie) headers.set('cookie', cookie);
    return fetch(`${APP_URL}${url}`, { ...init, headers, redirect: 'manual' });
  }
}
