// API tokens and /api/v1: a token is hashed at rest, acts with its role and, for a customer, for
// that customer only; revoked tokens and strangers get 401; each token has its own minute's
// budget; pages by key cover a list exactly once; a lab's result goes in once per key; the
// OpenAPI document names every /api/v1 route there is.
import { randomUUID } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { db } from '@/db';
import { createApiToken, revokeApiToken, listApiTokens } from '@/lib/api/tokens';
import { openApiDocument } from '@/lib/api/v1/openapi';
import { GET as getParts } from '@/app/api/v1/parts/route';
import { GET as getQuotes } from '@/app/api/v1/quotes/route';
import { GET as getWorkOrders } from '@/app/api/v1/work-orders/route';
import { GET as getShipments } from '@/app/api/v1/shipments/route';
import { GET as getCertificates } from '@/app/api/v1/certificates/route';
import { GET as getCertificatePdf } from '@/app/api/v1/certificates/[certificateId]/pdf/route';
import { GET as getInvoices } from '@/app/api/v1/invoices/route';
import { GET as getAnalyses, POST as postAnalysis } from '@/app/api/v1/bath-analyses/route';
import { dockCustomer, dockOrder, type DockCustomer } from '../dock/fixtures';
import { makeTank, removeTank, type TestTank } from '../bath/fixtures';

vi.mock('next/headers', async () => (await import('../estimating/cookie-jar')).nextHeadersStandIn());
vi.mock('next/server', async (orig) => ({ ...(await orig<typeof import('next/server')>()), after: () => undefined }));

type Handler = (req: Request, ctx: { params: Promise<any> }) => Promise<Response>;

async function call(handler: Handler, token: string | null, url: string, init: RequestInit = {}, params: Record<string, string> = {}) {
  const headers = new Headers(init.headers);
  if (token) headers.set('authorization', `Bearer ${token}`);
  const res = await handler(new Request(`http://127.0.0.1:3100${url}`, { ...init, headers }), { params: Promise.resolve(params) });
  const type = res.headers.get('content-type') ?? '';
  return { status: res.status, headers: res.headers, json: type.includes('json') ? await res.json() : null };
}

let owner: { id: string; role: 'owner'; customerId: null };
let a: DockCustomer;
let b: DockCustomer;
let adminA: { id: string; role: 'customer'; customerId: string };
let tank: TestTank;
let tokenA: string;
let tokenB: string;
let labToken: string;
const users: string[] = [];

async function customerUser(c: DockCustomer, isAdmin: boolean) {
  const id = `api-test-${randomUUID()}`;
  await db.insertInto('users').values({ id, email: `${id}@customer.test`, name: 'Buyer system owner', role: 'customer', customer_id: c.id, password_hash: null, is_customer_admin: isAdmin }).execute();
  users.push(id);
  return { id, role: 'customer' as const, customerId: c.id };
}

beforeAll(async () => {
  const o = await db.selectFrom('users').select('id').where('email', '=', 'owner@kestrel-plating.test').executeTakeFirstOrThrow();
  owner = { id: o.id, role: 'owner', customerId: null };
  a = await dockCustomer(db);
  b = await dockCustomer(db);
  await dockOrder(db, a, { state: 'received', received: 100 });
  await dockOrder(db, b, { state: 'received', received: 100 });
  adminA = await customerUser(a, true);
  tank = await makeTank();
  tokenA = (await createApiToken(adminA, { name: 'Purchasing system A', role: 'owner', perMinute: 9999 })).token;
  tokenB = (await createApiToken(owner, { name: 'Purchasing system B', role: 'customer', customerId: b.id, perMinute: 500 })).token;
  labToken = (await createApiToken(owner, { name: 'Outside lab', role: 'plater', perMinute: 500 })).token;
});

afterAll(async () => {
  await removeTank(tank);
  await db.deleteFrom('api_tokens').where('user_id', 'in', [...users, owner.id]).execute();
  await db.deleteFrom('users').where('id', 'in', users).execute();
  await db.destroy();
});

describe('making tokens', () => {
  it('keeps only a hash: the token itself is in no column', async () => {
    const row = await db.selectFrom('api_tokens').selectAll().where('name', '=', 'Outside lab').where('user_id', '=', owner.id).orderBy('created_at', 'desc').executeTakeFirstOrThrow();
    expect(JSON.stringify(row)).not.toContain(labToken);
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(labToken.startsWith(row.prefix)).toBe(true);
  });

  it('a customer administrator’s token is for their own company, whatever the form asked', async () => {
    const row = await db.selectFrom('api_tokens').select(['role', 'customer_id', 'per_minute']).where('user_id', '=', adminA.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ role: 'customer', customer_id: a.id, per_minute: 120 });
  });

  it('a contact who is not an administrator, and staff other than the owner, cannot make one', async () => {
    const plain = await customerUser(a, false);
    await expect(createApiToken(plain, { name: 'x', role: 'customer', perMinute: 10 })).rejects.toMatchObject({ code: 'FORBIDDEN' });
    const sup = await db.selectFrom('users').select('id').where('email', '=', 'supervisor@kestrel-plating.test').executeTakeFirstOrThrow();
    await expect(createApiToken({ id: sup.id, role: 'supervisor', customerId: null }, { name: 'x', role: 'plater', perMinute: 10 })).rejects.toMatchObject({ code: 'FORBIDDEN' });
  });

  it('the owner’s customer token must name a customer, and nothing is written when it does not', async () => {
    const before = await db.selectFrom('api_tokens').select((e) => e.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
    await expect(createApiToken(owner, { name: 'no company', role: 'customer', perMinute: 10 })).rejects.toMatchObject({ code: 'BAD_INPUT' });
    const after = await db.selectFrom('api_tokens').select((e) => e.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });
});

describe('who a token is', () => {
  it('answers 401 to no token, a made-up token and a malformed header', async () => {
    expect((await call(getParts, null, '/api/v1/parts')).status).toBe(401);
    expect((await call(getParts, `amp_${'x'.repeat(43)}`, '/api/v1/parts')).status).toBe(401);
    const r = await getParts(new Request('http://127.0.0.1:3100/api/v1/parts', { headers: { authorization: 'Basic abc' } }), { params: Promise.resolve({}) });
    expect(r.status).toBe(401);
  });

  it('a customer’s token sees its own company’s records and none of another’s', async () => {
    const lists: [Handler, string][] = [[getParts, '/api/v1/parts?limit=200'], [getQuotes, '/api/v1/quotes?limit=200'], [getWorkOrders, '/api/v1/work-orders?limit=200'], [getShipments, '/api/v1/shipments'], [getCertificates, '/api/v1/certificates'], [getInvoices, '/api/v1/invoices']];
    for (const [h, url] of lists) {
      for (const [token, self] of [[tokenA, a], [tokenB, b]] as const) {
        const r = await call(h, token, url);
        expect(r.status, url).toBe(200);
        for (const row of r.json.data) expect(row.customerId, url).toBe(self.id);
      }
    }
    const parts = await call(getParts, tokenA, '/api/v1/parts');
    expect(parts.json.data.map((p: { partNumber: string }) => p.partNumber)).toEqual([`${a.code}-BRKT`]);
    const wos = await call(getWorkOrders, tokenB, '/api/v1/work-orders');
    expect(wos.json.data).toHaveLength(1);
    expect(wos.json.data[0].quantities.received).toBe(100);
    // Planned dates come from the line's plan for an open order.
    expect(wos.json.data[0]).toHaveProperty('planned');
  });

  it('a customer’s token is refused the bath records, and another company’s certificate reads as not found', async () => {
    expect((await call(getAnalyses, tokenA, '/api/v1/bath-analyses')).status).toBe(403);
    const anyCert = await db.selectFrom('certificates').select('id').where('customer_id', '!=', a.id).executeTakeFirst();
    const id = anyCert?.id ?? randomUUID();
    const r = await call(getCertificatePdf, tokenA, `/api/v1/certificates/${id}/pdf`, {}, { certificateId: id });
    expect(r.status).toBe(404);
  });

  it('a plater’s token may post analyses but not read invoices', async () => {
    expect((await call(getInvoices, labToken, '/api/v1/invoices')).status).toBe(403);
  });

  it('a revoked token gets 401 at once, and the list shows when each was last used', async () => {
    const t = await createApiToken(owner, { name: 'Short-lived', role: 'estimator', perMinute: 50 });
    expect((await call(getQuotes, t.token, '/api/v1/quotes?limit=1')).status).toBe(200);
    const listed = (await listApiTokens(owner)).find((x) => x.id === t.id)!;
    expect(listed.lastUsedAt).toBeInstanceOf(Date);
    await revokeApiToken(owner, t.id);
    expect((await call(getQuotes, t.token, '/api/v1/quotes?limit=1')).status).toBe(401);
    // A customer's administrator cannot revoke another company's token.
    const bRow = await db.selectFrom('api_tokens').select('id').where('customer_id', '=', b.id).executeTakeFirstOrThrow();
    await expect(revokeApiToken(adminA, bRow.id)).rejects.toMatchObject({ code: 'NOT_FOUND' });
  });
});

describe('rate limits', () => {
  it('each token has its own budget a minute: past it, 429 with Retry-After; another token is untouched', { timeout: 20_000 }, async () => {
    const t = await createApiToken(owner, { name: 'Tight', role: 'estimator', perMinute: 3 });
    // Start well inside a minute, so the five calls share one window.
    const intoMinute = Date.now() % 60_000;
    if (intoMinute > 55_000) await new Promise((r) => setTimeout(r, 60_500 - intoMinute));
    const statuses: number[] = [];
    let last: Headers | null = null;
    for (let i = 0; i < 5; i++) {
      const r = await call(getParts, t.token, '/api/v1/parts?limit=1');
      statuses.push(r.status);
      last = r.headers;
    }
    expect(statuses).toEqual([200, 200, 200, 429, 429]);
    expect(Number(last!.get('retry-after'))).toBeGreaterThan(0);
    expect(last!.get('ratelimit-limit')).toBe('3');
    expect((await call(getParts, tokenB, '/api/v1/parts')).status).toBe(200);
  });
});

describe('paging by key', () => {
  it('following next with limit=1 visits every quote once, in number order', async () => {
    const staff = (await createApiToken(owner, { name: 'Pager', role: 'estimator', perMinute: 10000 })).token;
    const seen: string[] = [];
    let after: string | null = null;
    for (let i = 0; i < 500; i++) {
      const r = await call(getQuotes, staff, `/api/v1/quotes?limit=7${after ? `&after=${after}` : ''}`);
      expect(r.status).toBe(200);
      seen.push(...r.json.data.map((q: { number: string }) => q.number));
      after = r.json.next;
      if (!after) break;
    }
    const all = await db.selectFrom('quotes').select('number').orderBy('number', 'desc').orderBy('id', 'desc').execute();
    expect(seen).toEqual(all.map((q) => q.number));
  });

  it('a bad limit or a forged after is a 400 naming the field', async () => {
    const r = await call(getParts, tokenA, '/api/v1/parts?limit=NaN');
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toContain('limit');
    const f = await call(getParts, tokenA, '/api/v1/parts?after=bm90LWEta2V5');
    expect(f.status).toBe(400);
  });
});

describe('bath analyses in and out', () => {
  it('a lab result is judged and stored once per key; a bad body stores nothing', async () => {
    const analyte = Object.values(tank.analytes)[0]!;
    const key = `lab-${randomUUID()}`;
    const body = { key, tankId: tank.id, analyteId: analyte.id, value: 12.5, takenAt: new Date(Date.now() - 3600_000).toISOString(), note: 'Report 4471' };
    const first = await call(postAnalysis, labToken, '/api/v1/bath-analyses', { method: 'POST', body: JSON.stringify(body), headers: { 'content-type': 'application/json' } });
    expect(first.status).toBe(201);
    expect(first.json.analysis).toMatchObject({ tankId: tank.id, value: 12.5, source: 'lab', unit: analyte.unit });
    const again = await call(postAnalysis, labToken, '/api/v1/bath-analyses', { method: 'POST', body: JSON.stringify(body), headers: { 'content-type': 'application/json' } });
    expect(again.status).toBe(200);
    expect(again.json.duplicate).toBe(true);
    expect(again.json.analysis.id).toBe(first.json.analysis.id);
    const count = async () => (await db.selectFrom('analyses').select((e) => e.fn.countAll<string>().as('n')).where('tank_id', '=', tank.id).executeTakeFirstOrThrow()).n;
    const before = await count();
    for (const bad of [{ ...body, key: `k-${randomUUID()}`, value: 'lots' }, { ...body, key: `k-${randomUUID()}`, takenAt: new Date(Date.now() + 86400_000).toISOString() }, { ...body, key: `k-${randomUUID()}`, tankId: randomUUID() }]) {
      const r = await call(postAnalysis, labToken, '/api/v1/bath-analyses', { method: 'POST', body: JSON.stringify(bad), headers: { 'content-type': 'application/json' } });
      expect([400, 404], JSON.stringify(bad)).toContain(r.status);
    }
    expect(await count()).toBe(before);
    const out = await call(getAnalyses, labToken, `/api/v1/bath-analyses?tankId=${tank.id}`);
    expect(out.json.data.map((x: { id: string }) => x.id)).toContain(first.json.analysis.id);
  });

  it('a customer’s token cannot post one', async () => {
    const analyte = Object.values(tank.analytes)[0]!;
    const r = await call(postAnalysis, tokenA, '/api/v1/bath-analyses', { method: 'POST', body: JSON.stringify({ key: `c-${randomUUID()}`, tankId: tank.id, analyteId: analyte.id, value: 1, takenAt: new Date().toISOString() }) });
    expect(r.status).toBe(403);
  });
});

describe('the OpenAPI document', () => {
  it('is OpenAPI 3.1 and documents every /api/v1 route handler and method, and nothing else', async () => {
    const doc = openApiDocument();
    expect(doc.openapi).toBe('3.1.0');
    const root = path.resolve(__dirname, '../../../app/api/v1');
    const found: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const p = path.join(dir, name);
        if (statSync(p).isDirectory()) walk(p);
        else if (name === 'route.ts') {
          const rel = path.relative(root, dir).split(path.sep).map((s) => s.replace(/^\[(.+)\]$/, '{$1}')).join('/');
          if (rel === 'openapi.json') continue;
          const src = readFileSync(p, 'utf8');
          for (const m of src.matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) found.push(`${m[1]!.toLowerCase()} /api/v1/${rel}`);
        }
      }
    };
    walk(root);
    const documented = Object.entries(doc.paths ?? {}).flatMap(([p, item]) => Object.keys(item as object).map((m) => `${m} ${p}`));
    expect(documented.sort()).toEqual(found.sort());
    // Every list names its paging parameters; the schemas carry their own names.
    expect(JSON.stringify(doc.paths!['/api/v1/work-orders'])).toContain('"after"');
    expect(Object.keys(doc.components!.schemas!)).toEqual(expect.arrayContaining(['WorkOrder', 'Invoice', 'AnalysisIn', 'Error']));
  });
});
