// Benchmark of two grid list endpoints under load: requests per second of GET /api/quotes and
// GET /api/work-orders (the grid's first block of 100 rows) from the production build (`next start`
// on loopback, a signed-in estimator's session cookie), against the framework's floor on the same
// server (a Next.js route that validates the same session and permission and answers the same bytes
// from memory, app/api/bench-floor), the same route revalidated with its ETag (304, no body), and a
// bare node:http server in a child process that runs the same SQL through pg and answers the same
// JSON. autocannon drives all with the same connections and duration, after a warm-up, in
// alternating rounds so that the machine's other load falls on each alike. Adds a shop's history
// (quote and work-order rows of year 1999, so the first block is full) and removes it at the end.
// Run alone with `npm run bench -- api-lists`.
import path from 'node:path';
import autocannon from 'autocannon';
import { type CompiledQuery, DummyDriver, Kysely, PostgresAdapter, PostgresIntrospector, PostgresQueryCompiler, sql } from 'kysely';
import type { Database } from '@/db/types';
import { db } from '@/db';
import { gridQueryFrom, runGridQuery, type GridOptions } from '@/lib/grid/server';
import { WORK_ORDER_GRID, workOrderGridSelect } from '@/lib/orders/queries';
import { QUOTE_GRID, quoteGridSelect } from '@/lib/quotes/queries';
import { TestSessions } from '../helpers/sessions';
import type { BareRoutes } from './bare-list-server';
import { ROOT, startApp, startServer } from './next-server';
import { median } from './stats';
import type { BenchRow } from './types';

const BARE_PORT = 3302;
const CONNECTIONS = 10; // the app's pool size (db/pool.ts), and the bare server's
const WARM_UP_S = 5;
const ROUND_S = 5;
const ROUNDS = 3;
const HISTORY = 400; // rows added to each list
// Targets (issue #15 part 4): the route at least 0.7× the framework's own floor on this server (a
// Next.js route with the same session check answering the same bytes from memory), and a 304
// revalidation at least 0.9× that floor. The bare node:http ratio is reported beside them.
const FLOOR_TARGET = 0.7;
const NOT_MODIFIED_TARGET = 0.9;

type Endpoint = { path: string; floor: 'quotes' | 'work-orders'; select: (conn: Kysely<Database>) => Parameters<typeof runGridQuery>[0]; options: GridOptions<unknown> };

// Each as its route handler (app/api/*/route.ts) calls gridResponse; the JSON check below fails if they drift apart.
const ENDPOINTS: Endpoint[] = [
  {
    path: '/api/quotes?offset=0&limit=100',
    floor: 'quotes',
    select: (conn) => quoteGridSelect(conn),
    options: QUOTE_GRID,
  },
  {
    path: '/api/work-orders?offset=0&limit=100',
    floor: 'work-orders',
    select: (conn) => workOrderGridSelect(conn),
    options: WORK_ORDER_GRID,
  },
];

// The statements the grid code runs for one request, compiled by the same code on a Kysely that
// records instead of executing.
async function compiledStatements(e: Endpoint): Promise<BareRoutes[string]> {
  const seen: CompiledQuery[] = [];
  const recorder = new Kysely<Database>({
    dialect: {
      createAdapter: () => new PostgresAdapter(),
      createDriver: () => new DummyDriver(),
      createIntrospector: (k) => new PostgresIntrospector(k),
      createQueryCompiler: () => new PostgresQueryCompiler(),
    },
    log: (event) => void seen.push(event.query),
  });
  const query = gridQueryFrom(new URL(e.path, 'http://bench.invalid'), e.options.columns);
  await runGridQuery(e.select(recorder), { ...e.options, db: recorder }, query);
  const chosen = query.sort ?? e.options.defaultSort ?? null;
  const count = seen.filter((q) => /count\(\*\)::int as "total"/.test(q.sql));
  const page = seen.filter((q) => !count.includes(q));
  if (seen.length !== 2 || count.length !== 1) throw new Error(`expected a page and a count statement for ${e.path}, recorded ${seen.length}`);
  const plain = (q: CompiledQuery) => ({ sql: q.sql, parameters: q.parameters });
  return { page: plain(page[0]!), count: plain(count[0]!), frame: { colId: chosen?.colId ?? null, dir: chosen?.dir ?? 'asc' }, limit: query.limit };
}

async function addHistory(): Promise<void> {
  await sql`insert into quotes (number, customer_id, status, rate_set_id, valid_days, total_cents, created_by, created_at, sent_at, expires_at)
     select 'Q1999-' || lpad(g::text, 4, '0'), c.id, case when g % 3 = 0 then 'sent' else 'draft' end, r.id, 30, 10000 + g * 137,
            'demo-estimator-estimator', now() - g * interval '1 day',
            case when g % 3 = 0 then now() - g * interval '1 day' end, case when g % 3 = 0 then now() - g * interval '1 day' + interval '30 days' end
       from generate_series(1, ${HISTORY}) g
       cross join lateral (select id from customers order by code offset (g % (select count(*) from customers)) limit 1) c
       cross join (select id from rate_sets order by effective_from desc limit 1) r`.execute(db);
  await sql`insert into work_orders (number, customer_id, part_id, finish_id, po_number, due_date, quantity_ordered, quantity_received, state, is_rush, unit_price_cents, pricing_basis, total_cents)
     select 'W1999-' || lpad(g::text, 5, '0'), w.customer_id, w.part_id, w.finish_id, 'PO-' || (70000 + g), current_date + (g % 60),
            100 + g, g % 2 * (100 + g), (array['accepted', 'received', 'in_process', 'plated'])[1 + g % 4], g % 7 = 0, w.unit_price_cents, w.pricing_basis, w.total_cents
       from generate_series(1, ${HISTORY}) g
       cross join lateral (select * from work_orders where number not like 'W1999-%' order by number offset (g % 3) limit 1) w`.execute(db);
}

async function removeHistory(): Promise<void> {
  await db.deleteFrom('work_orders').where('number', 'like', 'W1999-%').execute();
  await db.deleteFrom('quotes').where('number', 'like', 'Q1999-%').execute();
}

async function load(url: string, headers: Record<string, string>, seconds: number): Promise<number> {
  const r = await autocannon({ url, connections: CONNECTIONS, duration: seconds, headers });
  // autocannon counts 304 among the non-2xx: for a revalidation it is the expected answer.
  const expected = headers['if-none-match'] ? r.statusCodeStats?.['304']?.count ?? 0 : 0;
  if (r.non2xx - expected > 0 || r.errors > 0) throw new Error(`${url}: ${r.non2xx - expected} unexpected answers and ${r.errors} errors under load`);
  return r.requests.total / r.duration;
}

const perSecond = (x: number) => `${Math.round(x).toLocaleString('en-US')} req/s`;

export async function run(): Promise<BenchRow[]> {
  const sessions = new TestSessions();
  await sessions.open();
  const servers: { stop: () => Promise<void> }[] = [];
  try {
    await removeHistory();
    await addHistory();
    const routes: BareRoutes = {};
    for (const e of ENDPOINTS) routes[e.path] = await compiledStatements(e);
    const bare = await startServer({
      label: 'bench-bare-lists',
      cwd: ROOT,
      args: ['--import', 'tsx', path.join(__dirname, 'bare-list-server.ts'), String(BARE_PORT)],
      port: BARE_PORT,
      env: { ...process.env, NODE_ENV: 'production', BARE_LIST_ROUTES: JSON.stringify(routes) },
      readyPath: '/',
    });
    servers.push(bare);
    const cookie = sessions.cookie('estimator');
    // The floor answers the very bytes the bare server (and so the route) answers, from memory.
    const floorBodies: Record<string, string> = {};
    for (const e of ENDPOINTS) floorBodies[e.floor] = await (await fetch(`${bare.url}${e.path}`, { headers: { cookie } })).text();
    const app = await startApp({ BENCH_FLOOR_BODIES: JSON.stringify(floorBodies) });
    servers.push(app);
    const rows: BenchRow[] = [];
    for (const e of ENDPOINTS) {
      const floorPath = `/api/bench-floor/${e.floor}`;
      const [fromApp, fromBare, fromFloor] = await Promise.all([`${app.url}${e.path}`, `${bare.url}${e.path}`, `${app.url}${floorPath}`].map((u) => fetch(u, { headers: { cookie }, redirect: 'manual' })));
      const [appBody, bareBody, floorBody] = await Promise.all([fromApp!.text(), fromBare!.text(), fromFloor!.text()]);
      if (fromApp!.status !== 200 || fromBare!.status !== 200 || fromFloor!.status !== 200) {
        throw new Error(`${e.path}: app answered ${fromApp!.status}, bare server ${fromBare!.status}, floor ${fromFloor!.status}`);
      }
      if (appBody !== bareBody || appBody !== floorBody) throw new Error(`${e.path}: the bare server's or the floor's JSON differs from the app's; the benchmark no longer mirrors the route`);
      const etag = fromApp!.headers.get('etag');
      if (!etag) throw new Error(`${e.path}: the route sent no ETag`);
      const conditional = await fetch(`${app.url}${e.path}`, { headers: { cookie, 'if-none-match': etag } });
      if (conditional.status !== 304) throw new Error(`${e.path}: a revalidation with its ETag answered ${conditional.status}, not 304`);
      const { rows: listed, total } = JSON.parse(appBody) as { rows: unknown[]; total: number };

      const targets = {
        bare: { url: `${bare.url}${e.path}`, headers: { cookie } },
        floor: { url: `${app.url}${floorPath}`, headers: { cookie } },
        app: { url: `${app.url}${e.path}`, headers: { cookie } },
        notModified: { url: `${app.url}${e.path}`, headers: { cookie, 'if-none-match': etag } },
      };
      const rates: Record<keyof typeof targets, number[]> = { bare: [], floor: [], app: [], notModified: [] };
      for (const t of Object.values(targets)) await load(t.url, t.headers, WARM_UP_S);
      // Alternating rounds, so the machine's other load falls on every variant alike.
      for (let i = 0; i < ROUNDS; i++) for (const [k, t] of Object.entries(targets)) rates[k as keyof typeof targets].push(await load(t.url, t.headers, ROUND_S));
      const m = Object.fromEntries(Object.entries(rates).map(([k, v]) => [k, median(v)])) as Record<keyof typeof targets, number>;
      const what = `GET ${e.path.split('?')[0]} (${listed.length} of ${total} rows, ${(appBody.length / 1024).toFixed(1)} KB), ${CONNECTIONS} connections, median of ${ROUNDS} × ${ROUND_S} s`;
      const floor = `Next.js route, same session check, same rows from memory: ${perSecond(m.floor)}`;
      rows.push(
        { area: 'web', what, value: perSecond(m.app), baseline: floor, ratio: m.app / m.floor, target: `≥ ${FLOOR_TARGET.toFixed(2)}×`, met: m.app / m.floor >= FLOOR_TARGET },
        {
          area: 'web',
          what: `${what.split(' (')[0]} revalidated with If-None-Match: 304, no body`,
          value: perSecond(m.notModified),
          baseline: floor,
          ratio: m.notModified / m.floor,
          target: `≥ ${NOT_MODIFIED_TARGET.toFixed(2)}×`,
          met: m.notModified / m.floor >= NOT_MODIFIED_TARGET,
        },
        { area: 'web', what: `${what.split(' (')[0]} against bare node:http (reported)`, value: perSecond(m.app), baseline: `bare node:http + pg, same SQL and JSON: ${perSecond(m.bare)}`, ratio: m.app / m.bare, target: 'reported', met: null },
      );
    }
    return rows;
  } finally {
    for (const s of servers.reverse()) await s.stop();
    await sessions.close();
    await removeHistory();
  }
}
