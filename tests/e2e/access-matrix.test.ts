// The access matrix, generated from the code: every page, route handler and server action ×
// every role and a signed-out visitor → allowed or refused, asserted over HTTP against `next start`.
// Permissions come from the code itself (requirePageUser / withPermission / formAction); a route
// that asks for none must be listed in PUBLIC below, or this test fails.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { actionRequest } from '../helpers/actions';
import { APP_URL } from '../helpers/browser';
import { type Caller, CALLERS, TestSessions } from '../helpers/sessions';
import { type ActionRoute, type ApiRoute, type Guard, type PageRoute, discoverActions, discoverApiRoutes, discoverPages, guardAllows, sampleUrl } from '../helpers/routes';

// Routes that deliberately ask for no permission, and what everyone gets from them.
const PUBLIC: Record<string, 'page' | 'redirect' | 'json' | 'signature' | 'any-session'> = {
  'page /': 'redirect',
  'page /sign-in': 'page',
  'page /reset': 'page',
  'page /set-password/[token]': 'page',
  'GET /api/health': 'json',
  'GET /api/v1/openapi.json': 'json',
  'POST /api/webhooks/stripe': 'signature',
  'action signOutAction': 'any-session',
  // The second step of signing in: they answer only a session that has passed the password.
  'page /two-factor': 'redirect',
  'page /two-factor/setup': 'redirect',
};

const pages = discoverPages();
const apis = discoverApiRoutes();
const actions = discoverActions(process.env.NEXT_DIST_DIR ?? '.next-test');
const sessions = new TestSessions();

beforeAll(() => sessions.open());
afterAll(() => sessions.close());

function allowed(guard: Guard, caller: Caller): boolean {
  return caller !== 'anonymous' && guardAllows(guard, (p) => roleCan(caller, p as Permission));
}

const request = (caller: Caller, url: string, init?: RequestInit) => sessions.request(caller, url, init);

describe('every route is in the matrix', () => {
  it('finds routes of all three kinds', () => {
    expect(pages.length).toBeGreaterThan(5);
    expect(apis.length).toBeGreaterThan(0);
    expect(actions.length).toBeGreaterThan(3);
  });
  it('no route is unguarded unless it is listed as public', () => {
    const unlisted = [
      ...pages.filter((p) => p.guard.kind === 'unguarded' && !PUBLIC[`page ${p.pattern}`]).map((p) => `page ${p.pattern} (${p.file})`),
      ...apis.filter((a) => a.guard.kind === 'unguarded' && !PUBLIC[`${a.method} ${a.pattern}`]).map((a) => `${a.method} ${a.pattern} (${a.file})`),
      ...actions.filter((a) => a.guard.kind === 'unguarded' && !PUBLIC[`action ${a.name}`]).map((a) => `action ${a.name} (${a.file})`),
    ];
    expect(unlisted).toEqual([]);
  });
});

describe('pages', () => {
  it.each(pages.filter((p) => p.guard.kind === 'permission').map((p) => [p.pattern, p] as const))('%s', async (_pattern, page: PageRoute) => {
    const url = sampleUrl(page.pattern);
    for (const caller of CALLERS) {
      const res = await request(caller, url);
      const where = `${caller} GET ${url}`;
      if (caller === 'anonymous') {
        expect(res.status, where).toBe(307);
        expect(res.headers.get('location') ?? '', where).toMatch(/\/sign-in/);
      } else if (allowed(page.guard, caller)) expect([200, 404], where).toContain(res.status);
      else expect(res.status, where).toBe(403);
    }
  });

  it.each(pages.filter((p) => p.guard.kind !== 'permission').map((p) => [p.pattern, p] as const))('%s (public)', async (_pattern, page: PageRoute) => {
    for (const caller of CALLERS) {
      const res = await request(caller, sampleUrl(page.pattern));
      expect(res.status, `${caller} ${page.pattern}`).toBeLessThan(500);
    }
  });
});

describe('route handlers', () => {
  it.each(apis.map((a) => [`${a.method} ${a.pattern}`, a] as const))('%s', async (_name, api: ApiRoute) => {
    const url = sampleUrl(api.pattern);
    const init: RequestInit =
      api.method === 'GET' ? {} : { method: api.method, body: '{}', headers: { 'content-type': 'application/json', origin: APP_URL } };
    for (const caller of CALLERS) {
      const res = await request(caller, url, init);
      const where = `${caller} ${api.method} ${url}`;
      expect(res.status, where).toBeLessThan(500);
      const kind = PUBLIC[`${api.method} ${api.pattern}`];
      if (kind === 'signature') expect(res.status, where).toBe(400);
      else if (kind) expect(res.status, where).toBe(200);
      else if (caller === 'anonymous') expect(res.status, where).toBe(401);
      else if (allowed(api.guard, caller)) expect([401, 403], where).not.toContain(res.status);
      else expect(res.status, where).toBe(403);
    }
  });
});

describe('server actions', () => {
  it.each(actions.filter((a) => a.guard.kind === 'permission').map((a) => [`${a.name} (${a.file})`, a] as const))('%s', async (_name, action: ActionRoute) => {
    for (const caller of CALLERS) {
      const res = await request(caller, sampleUrl(action.pagePattern), actionRequest(action.id, { probe: 'x' }, APP_URL));
      const body = await res.text();
      const where = `${caller} → ${action.name}`;
      expect(res.status, where).toBeLessThan(500);
      if (caller === 'anonymous') expect(body, where).toContain('Please sign in.');
      else if (allowed(action.guard, caller)) {
        expect(body, where).not.toContain('You are not allowed to do this.');
        expect(body, where).not.toContain('Please sign in.');
      } else expect(body, where).toContain('You are not allowed to do this.');
    }
  });
});
