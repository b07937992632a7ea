// Hostile and malformed input, generated from the code: fast-check sends random and boundary
// values (wrong types, huge strings, unicode, negative and zero amounts, NaN, 1e308) to every
// route handler and every server action, as a caller who is allowed to use it. Expected: a 4xx or
// a form message, never a 500, never the "unexpected error" state, and no NaN or Infinity stored.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Permission, roleCan } from '@/lib/auth/roles';
import type { Role } from '@/db/types';
import { actionRequest, objectInAnswer } from '../helpers/actions';
import { APP_URL } from '../helpers/browser';
import { discoverActions, discoverApiRoutes, sampleUrl } from '../helpers/routes';
import { TestSessions } from '../helpers/sessions';

const RUNS = Number(process.env.HOSTILE_RUNS ?? 12);
const sessions = new TestSessions();
let casesRun = 0;

beforeAll(() => sessions.open());
afterAll(async () => {
  console.log(`[hostile input] ${casesRun} generated cases sent`);
  await sessions.close();
});

function callerFor(permission: string | null): Role {
  if (!permission) return 'owner';
  return (['owner', 'supervisor', 'estimator', 'plater', 'customer'] as Role[]).find((r) => roleCan(r, permission as Permission)) ?? 'owner';
}

const nasty = fc.oneof(
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e308', '-1e308', '-1', '0', '', ' ', '0x10', '1,5', '١٢', '𝟙𝟚', '<script>', "'; drop table users;--", '\u0000', '00000000-0000-4000-8000-000000000000'),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.double().map(String),
  fc.integer().map(String),
  fc.constant('x'.repeat(20_000)),
);
const jsonValue = fc.oneof(
  nasty,
  fc.double(),
  fc.integer(),
  fc.constant(1e308),
  fc.constant(null),
  fc.boolean(),
  fc.array(nasty, { maxLength: 3 }),
);
const KEYS = ['id', 'name', 'email', 'value', 'amount', 'quantity', 'tankId', 'analyteId', 'kind', 'key', 'areaDm2', 'thickness', 'area', 'element', 'charge', 'efficiency', 'poNumber', 'reason', 'unit'];
const jsonBody = fc.oneof(
  fc.dictionary(fc.constantFrom(...KEYS), jsonValue, { maxKeys: 8 }),
  fc.array(jsonValue, { maxLength: 3 }),
  jsonValue,
);
const formFields = fc.dictionary(fc.oneof(fc.constantFrom(...KEYS), fc.string({ minLength: 1, maxLength: 12 }).filter((k) => /^[a-z][a-zA-Z]*$/.test(k))), nasty, { maxKeys: 8 });

describe('route handlers refuse hostile JSON cleanly', () => {
  const writes = discoverApiRoutes().filter((a) => a.method !== 'GET' && !a.pattern.startsWith('/api/webhooks'));
  it.each(writes.map((a) => [`${a.method} ${a.pattern}`, a] as const))('%s', async (_n, api) => {
    const caller = callerFor(api.guard.kind === 'permission' ? api.guard.permission : null);
    await fc.assert(
      fc.asyncProperty(jsonBody, async (body) => {
        casesRun++;
        const res = await sessions.request(caller, sampleUrl(api.pattern), {
          method: api.method,
          body: JSON.stringify(body),
          headers: { 'content-type': 'application/json', origin: APP_URL },
        });
        expect(res.status, `${api.method} ${api.pattern} with ${JSON.stringify(body).slice(0, 200)}`).toBeLessThan(500);
      }),
      { numRuns: RUNS },
    );
  });

  it('list routes refuse hostile query strings cleanly', async () => {
    const lists = discoverApiRoutes().filter((a) => a.method === 'GET' && !a.pattern.includes('['));
    for (const api of lists) {
      const caller = callerFor(api.guard.kind === 'permission' ? api.guard.permission : null);
      await fc.assert(
        fc.asyncProperty(fc.record({ offset: nasty, limit: nasty, sort: nasty, filter: nasty, q: nasty }), async (q) => {
          casesRun++;
          const res = await sessions.request(caller, `${api.pattern}?${new URLSearchParams(q).toString()}`);
          expect(res.status, `GET ${api.pattern}?${JSON.stringify(q).slice(0, 200)}`).toBeLessThan(500);
        }),
        { numRuns: RUNS },
      );
    }
  });
});

describe('server actions refuse hostile form fields cleanly', () => {
  const actions = discoverActions(process.env.NEXT_DIST_DIR ?? '.next-test').filter((a) => a.guard.kind === 'permission');
  const withOwnFields = new Set<string>();
  const delivered = new Set<string>();
  it.each(actions.map((a) => [`${a.name} (${a.file})`, a] as const))('%s', async (_n, action) => {
    const caller = callerFor(action.guard.kind === 'permission' ? action.guard.permission : null);
    const url = sampleUrl(action.pagePattern);
    // The action's own field names: an empty form is answered with a message for each required one.
    const probe = await (await sessions.request(caller, url, actionRequest(action.id, {}, APP_URL))).text();
    const own = Object.keys(objectInAnswer(probe, 'fieldErrors') ?? {});
    if (own.length > 0) {
      withOwnFields.add(action.name);
      // The same fields filled in change the answer, which shows that the form reaches the action.
      const filled = await (await sessions.request(caller, url, actionRequest(action.id, Object.fromEntries(own.map((k) => [k, 'x'])), APP_URL))).text();
      if (JSON.stringify(objectInAnswer(filled, 'fieldErrors')) !== JSON.stringify(objectInAnswer(probe, 'fieldErrors'))) delivered.add(action.name);
    }
    const fields = own.length > 0 ? fc.tuple(fc.record(Object.fromEntries(own.map((k) => [k, nasty])), { requiredKeys: [] }), formFields).map(([a, b]) => ({ ...b, ...a }) as Record<string, string>) : formFields;
    await fc.assert(
      fc.asyncProperty(fields, async (sent) => {
        casesRun++;
        const res = await sessions.request(caller, url, actionRequest(action.id, sent, APP_URL));
        const text = await res.text();
        const where = `${action.name} with ${JSON.stringify(sent).slice(0, 200)}`;
        expect(res.status, where).toBeLessThan(500);
        expect(text, where).not.toContain('Something went wrong and nothing was saved');
      }),
      { numRuns: RUNS },
    );
  });

  it('reaches the actions with their own field names', () => {
    // Most actions have required fields, and filling them in changes most answers; were the form
    // lost on the way, every answer would stay that of an empty form.
    console.log(`[hostile input] ${withOwnFields.size} of ${actions.length} actions named their fields; filling them changed the answer of ${delivered.size}`);
    expect(withOwnFields.size).toBeGreaterThan(actions.length / 2);
    expect(delivered.size).toBeGreaterThan(withOwnFields.size / 2);
  });
});

describe('no NaN or Infinity stored', () => {
  it('no numeric or floating column in any table holds NaN or ±Infinity', async () => {
    const cols = await sessions.db.query<{ table_name: string; column_name: string }>(
      `select table_name, column_name from information_schema.columns
        where table_schema = 'public' and data_type in ('numeric', 'double precision', 'real')`,
    );
    const bad: string[] = [];
    for (const c of cols.rows) {
      const r = await sessions.db.query(
        `select count(*)::int as n from "${c.table_name}" where "${c.column_name}" in ('NaN'::numeric::float8, 'Infinity'::float8, '-Infinity'::float8)`,
      );
      if (r.rows[0].n > 0) bad.push(`${c.table_name}.${c.column_name}: ${r.rows[0].n}`);
    }
    expect(cols.rows.length).toBeGreaterThan(10);
    expect(bad).toEqual([]);
  });
});
