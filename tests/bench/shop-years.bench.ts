// Benchmark at ten shop-years: the same requests against the demo database and against a database
// holding the demo plus ten years of a busy shop (lib/seed/shop-years.ts: ≈ 5 million analysis
// values, 50,000 quotes, work orders and invoices), each served by the production build on its own
// port, in one run. For each request the p50 of sequential requests at ten years is set against
// the p50 on the demo data, the two sides asked in turn: the target is within 1.5×. Lists are asked
// for their first page, a filtered page and a deep page (90 % of the way down); the control chart
// for five years; the receivables (aging) page; a customer's portal lists; search by part number
// and by order number; and the CSV export of every quote, whose server memory is sampled while it
// streams. The ten-year database is generated once (minutes) and kept; BENCH_YEARS_SCALE makes it
// smaller. Run alone with `npm run bench -- shop-years`.
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { createDb } from '@/db/kysely';
import { migrateToLatest } from '@/db/migrate';
import { createPool } from '@/db/pool';
import { seedDemo } from '@/lib/seed';
import { alreadyGenerated, generateShopYears } from '@/lib/seed/shop-years';
import { DEMO_USER_IDS } from '../helpers/sessions';
import { databaseNamed } from '../helpers/test-db';
import { BENCH_DIST_DIR, buildApp, ROOT, startNext, type RunningServer } from './next-server';
import { quantile } from './stats';
import type { BenchRow } from './types';

const DEMO_PORT = 3320;
const YEARS_PORT = 3321;
const RUNS = 41;
const WARM = 5;
const TARGET = 1.5;
const MEMORY_TARGET_MB = 64;

async function query<T>(url: string, text: string, values: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return (await c.query(text, values)).rows as T[];
  } finally {
    await c.end();
  }
}

async function prepareYears(baseUrl: string): Promise<{ url: string; seconds: number | null }> {
  const url = databaseNamed(baseUrl, 'ampwright_bench_years');
  const exists = await query(databaseNamed(baseUrl, 'postgres'), `select 1 from pg_database where datname = 'ampwright_bench_years'`);
  if (!exists.length) await query(databaseNamed(baseUrl, 'postgres'), 'create database ampwright_bench_years');
  const db = createDb(createPool(url));
  try {
    const { error } = await migrateToLatest(db);
    if (error) throw error;
    await seedDemo(db);
    if (await alreadyGenerated(db)) return { url, seconds: null };
    const scale = Number(process.env.BENCH_YEARS_SCALE ?? 1);
    const started = Date.now();
    console.error(`[bench] generating ten shop-years at scale ${scale} into ampwright_bench_years (minutes; kept for later runs)`);
    await generateShopYears(db, url, { seed: 1, scale, log: (l) => console.error(`[bench] shop-years: ${l}`) });
    return { url, seconds: (Date.now() - started) / 1000 };
  } finally {
    await db.destroy();
  }
}

async function sessionCookie(url: string, role: 'estimator' | 'customer' | 'owner'): Promise<{ cookie: string; id: string }> {
  const id = randomBytes(20).toString('hex');
  await query(url, `insert into sessions (id, user_id, expires_at, second_factor) values ($1, $2, now() + interval '2 hours', true)`, [id, DEMO_USER_IDS[role]]);
  return { cookie: `ampwright_session=${id}`, id };
}

type Target = { url: string; cookie: string };

async function timed(t: Target, path: string): Promise<{ ms: number; bytes: number }> {
  const t0 = performance.now();
  const r = await fetch(`${t.url}${path}`, { headers: { cookie: t.cookie } });
  const body = await r.arrayBuffer();
  if (r.status !== 200) throw new Error(`${t.url}${path} answered ${r.status}`);
  return { ms: performance.now() - t0, bytes: body.byteLength };
}

/**
 * The p50 of the same request on both sides, asked in turn (demo, ten years, demo, …) so that the
 * machine's other load in any moment falls on both alike.
 */
async function pairedP50(a: { t: Target; path: string }, b: { t: Target; path: string }): Promise<[{ ms: number; bytes: number }, { ms: number; bytes: number }]> {
  const times: [number[], number[]] = [[], []];
  const bytes = [0, 0];
  for (let i = 0; i < WARM + RUNS; i++) {
    for (const [side, x] of [a, b].entries()) {
      const r = await timed(x.t, x.path);
      if (i >= WARM) times[side]!.push(r.ms);
      bytes[side] = r.bytes;
    }
  }
  const p = (xs: number[]) => quantile(xs.sort((m, n) => m - n), 0.5);
  return [
    { ms: p(times[0]), bytes: bytes[0]! },
    { ms: p(times[1]), bytes: bytes[1]! },
  ];
}

function rssMb(pid: number): number {
  const out = execFileSync('ps', ['-o', 'rss=', '-g', String(pid)], { encoding: 'utf8' });
  return out.split('\n').reduce((s, l) => s + (Number(l.trim()) || 0), 0) / 1024;
}

async function exportWithMemory(server: RunningServer, cookie: string, path: string): Promise<{ ms: number; mb: number; rows: number; growthMb: number }> {
  const before = rssMb(server.pid);
  let peak = before;
  const sampler = setInterval(() => (peak = Math.max(peak, rssMb(server.pid))), 50);
  const t0 = performance.now();
  const r = await fetch(`${server.url}${path}`, { headers: { cookie } });
  let bytes = 0;
  let lines = 0;
  for await (const chunk of r.body as unknown as AsyncIterable<Uint8Array>) {
    bytes += chunk.byteLength;
    for (const b of chunk) if (b === 10) lines++;
  }
  const ms = performance.now() - t0;
  clearInterval(sampler);
  peak = Math.max(peak, rssMb(server.pid));
  return { ms, mb: bytes / 2 ** 20, rows: Math.max(0, lines - 1), growthMb: peak - before };
}

const ms = (x: number) => `${x.toFixed(1)} ms`;
const grid = (path: string, params: Record<string, string>) => `${path}?${new URLSearchParams(params).toString()}`;

export async function run(): Promise<BenchRow[]> {
  const demoUrl = process.env.BENCH_DATABASE_URL ?? process.env.DATABASE_URL!;
  const years = await prepareYears(demoUrl);
  await buildApp();
  const sessions: { url: string; id: string }[] = [];
  const servers: RunningServer[] = [];
  try {
    // The lists' kept answers are off: the same request repeated would be answered from memory at
    // any size, and these rows time what the database does at ten years (list-cache.ts).
    const start = (port: number, databaseUrl: string, label: string) =>
      startNext({ label, dir: ROOT, port, env: { NEXT_DIST_DIR: BENCH_DIST_DIR, DATABASE_URL: databaseUrl, APP_URL: `http://127.0.0.1:${port}`, AMPWRIGHT_LIST_CACHE: 'off' }, readyPath: '/api/health' });
    const demo = await start(DEMO_PORT, demoUrl, 'bench-years-demo');
    servers.push(demo);
    const big = await start(YEARS_PORT, years.url, 'bench-years-ten');
    servers.push(big);
    const sides = [
      { name: 'demo', server: demo, db: demoUrl },
      { name: 'ten years', server: big, db: years.url },
    ];
    const cookies: Record<'estimator' | 'customer' | 'owner', { cookie: string; id: string }>[] = [];
    for (const s of sides) {
      const c = { estimator: await sessionCookie(s.db, 'estimator'), customer: await sessionCookie(s.db, 'customer'), owner: await sessionCookie(s.db, 'owner') };
      for (const x of Object.values(c)) sessions.push({ url: s.db, id: x.id });
      cookies.push(c);
    }

    // Per side: the totals (for the deep page), the chart's tank and analyte, a part number and an order number to search.
    const facts: { totals: { quotes: number; orders: number; customers: number; parts: number }; chart: { tank_id: string; id: string }; part: string; order: string }[] = [];
    for (const s of sides) {
      const [t] = await query<{ quotes: number; orders: number; customers: number; parts: number }>(
        s.db,
        `select (select count(*)::int from quotes) as quotes, (select count(*)::int from work_orders) as orders, (select count(*)::int from customers) as customers, (select count(*)::int from parts) as parts`,
      );
      const [chart] = await query<{ tank_id: string; id: string }>(s.db, `select a.tank_id, a.id from tank_analytes a join tanks t on t.id = a.tank_id where t.code = 'N-NI1' and a.key = 'nickel'`);
      const [part] = await query<{ part_number: string }>(s.db, `select part_number from parts order by created_at desc, part_number limit 1`);
      const [order] = await query<{ number: string }>(s.db, `select number from work_orders order by number limit 1 offset (select count(*) / 2 from work_orders)`);
      facts.push({ totals: t!, chart: chart!, part: part!.part_number, order: order!.number });
    }
    const fiveYearsAgo = new Date(Date.now() - 5 * 365.25 * 86_400_000).toISOString().slice(0, 10);
    const today = new Date().toISOString().slice(0, 10);

    type Case = { what: string; role: 'estimator' | 'customer' | 'owner'; path: (i: number) => string | Promise<string>; reported?: boolean };
    const targets = (i: number, role: Case['role']): Target => ({ url: sides[i]!.server.url, cookie: cookies[i]![role].cookie });
    // The page after the one ending at `offset`, asked for by key, as the grid does when the reader scrolls down to it.
    const byKey = async (i: number, api: string, offset: number): Promise<string> => {
      if (offset === 0) return grid(api, { offset: '0', limit: '100' });
      const before = Math.max(0, offset - 100);
      const r = await fetch(`${targets(i, 'owner').url}${grid(api, { offset: String(before), limit: String(offset - before) })}`, { headers: { cookie: targets(i, 'owner').cookie } });
      const { next } = (await r.json()) as { next: string | null };
      if (!next) throw new Error(`${api} gave no cursor at ${offset}`);
      return grid(api, { offset: String(offset), limit: '100', after: next });
    };
    const list = (api: string, total: (i: number) => number, what: string): Case[] => [
      { what: `${what}, first page`, role: 'owner', path: () => grid(api, { offset: '0', limit: '100' }) },
      { what: `${what}, deep page (90 %, by key from the page before)`, role: 'owner', path: (i) => byKey(i, api, Math.floor(total(i) * 0.9)) },
      // Dragging the scroll bar straight to the far end has no page before it: that one counts rows.
      { what: `${what}, deep page (90 %, jumped to by offset)`, role: 'owner', path: (i) => grid(api, { offset: String(Math.floor(total(i) * 0.9)), limit: '100' }), reported: true },
    ];
    const cases: Case[] = [
      ...list('/api/quotes', (i) => facts[i]!.totals.quotes, 'GET /api/quotes'),
      { what: 'GET /api/quotes, filtered (status accepted)', role: 'owner', path: () => grid('/api/quotes', { offset: '0', limit: '100', filter: JSON.stringify({ status: { filterType: 'text', type: 'equals', filter: 'accepted' } }) }) },
      ...list('/api/work-orders', (i) => facts[i]!.totals.orders, 'GET /api/work-orders'),
      { what: 'GET /api/work-orders, filtered (state invoiced)', role: 'owner', path: () => grid('/api/work-orders', { offset: '0', limit: '100', filter: JSON.stringify({ state: { filterType: 'text', type: 'equals', filter: 'invoiced' } }) }) },
      { what: 'GET /api/work-orders, search by part number', role: 'owner', path: (i) => grid('/api/work-orders', { offset: '0', limit: '100', q: facts[i]!.part }) },
      { what: 'GET /api/work-orders, search by order (lot) number', role: 'owner', path: (i) => grid('/api/work-orders', { offset: '0', limit: '100', q: facts[i]!.order }) },
      ...list('/api/customers', (i) => facts[i]!.totals.customers, 'GET /api/customers'),
      ...list('/api/parts', (i) => facts[i]!.totals.parts, 'GET /api/parts'),
      { what: 'control chart data, 5 years of one analyte', role: 'owner', path: (i) => `/api/baths/${facts[i]!.chart.tank_id}/analytes/${facts[i]!.chart.id}/chart?from=${fiveYearsAgo}&to=${today}` },
      { what: 'receivables (aging) page', role: 'owner', path: () => '/invoices/receivables' },
      { what: 'quote list page', role: 'owner', path: () => '/quotes' },
      { what: "customer's portal: invoices", role: 'customer', path: () => '/portal/invoices' },
      { what: "customer's portal: orders", role: 'customer', path: () => '/portal/orders' },
    ];

    const rows: BenchRow[] = [];
    const size = facts[1]!.totals;
    const [analyses] = await query<{ n: number }>(years.url, 'select count(*)::int as n from analyses');
    const sizeNote = `${analyses!.n.toLocaleString('en-US')} analyses, ${size.quotes.toLocaleString('en-US')} quotes, ${size.orders.toLocaleString('en-US')} work orders`;
    for (const c of cases) {
      const [a, b] = await pairedP50({ t: targets(0, c.role), path: await c.path(0) }, { t: targets(1, c.role), path: await c.path(1) });
      rows.push({
        area: 'ten years',
        what: `${c.what}, p50 of ${RUNS}`,
        value: `${ms(b.ms)} (${(b.bytes / 1024).toFixed(0)} KB)`,
        baseline: `demo data ${ms(a.ms)}`,
        ratio: b.ms / a.ms,
        target: c.reported ? 'reported' : `≤ ${TARGET}×`,
        met: c.reported ? null : b.ms / a.ms <= TARGET,
      });
    }
    const exported = await exportWithMemory(big, cookies[1]!.owner.cookie, '/api/quotes?format=csv');
    const exportedDemo = await exportWithMemory(demo, cookies[0]!.owner.cookie, '/api/quotes?format=csv');
    rows.push({
      area: 'ten years',
      what: `CSV export of every quote (${exported.rows.toLocaleString('en-US')} rows, ${exported.mb.toFixed(1)} MB, streamed): server memory growth`,
      value: `${exported.growthMb.toFixed(1)} MB in ${(exported.ms / 1000).toFixed(1)} s`,
      baseline: `demo (${exportedDemo.rows} rows): ${exportedDemo.growthMb.toFixed(1)} MB`,
      ratio: null,
      target: `≤ ${MEMORY_TARGET_MB} MB`,
      met: exported.growthMb <= MEMORY_TARGET_MB,
    });
    rows.push({
      area: 'ten years',
      what: `size of the ten-year database: ${sizeNote}`,
      value: years.seconds === null ? 'generated in an earlier run' : `generated in ${years.seconds.toFixed(0)} s`,
      baseline: '—',
      ratio: null,
      target: 'reported',
      met: null,
    });
    return rows;
  } finally {
    for (const s of servers.reverse()) await s.stop();
    for (const s of sessions) await query(s.url, 'delete from sessions where id = $1', [s.id]).catch(() => undefined);
  }
}
