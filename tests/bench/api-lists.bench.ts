// Benchmark of two grid list endpoints under load: requests per second of GET /api/quotes and
// GET /api/work-orders (the grid's first block of 100 rows) from the production build (`next start`
// on loopback, a signed-in estimator's session cookie), against a bare node:http server in a child
// process that runs the same SQL through pg and answers the same JSON. autocannon drives both with
// the same connections and duration, after a warm-up, in alternating rounds so that the machine's
// other load falls on both alike. Adds a shop's history (quote and work-order rows of year 1999, so
// the first block is full) and removes it at the end. Run alone with
// `npm run bench -- api-lists`.
import path from 'node:path';
import autocannon from 'autocannon';
import { type CompiledQuery, DummyDriver, Kysely, PostgresAdapter, PostgresIntrospector, PostgresQueryCompiler, sql } from 'kysely';
import type { Database } from '@/db/types';
import { db } from '@/db';
import { gridQueryFrom, runGridQuery, type GridOptions } from '@/lib/grid/server';
import { WORK_ORDER_GRID_COLUMNS, workOrderGridSelect } from '@/lib/orders/queries';
import { QUOTE_GRID_COLUMNS, quoteGridSelect } from '@/lib/quotes/queries';
import { TestSessions } from '../helpers/sessions';
import type { BareRoutes, BareStatement } from './bare-list-server';
import { ROOT, startApp, startServer } from './next-server';
import { median } from './stats';
import type { BenchRow } from './types';

const BARE_PORT = 3302;
const CONNECTIONS = 10; // the app's pool size (db/pool.ts), and the bare server's
const WARM_UP_S = 5;
const ROUND_S = 5;
const ROUNDS = 3;
const HISTORY = 400; // rows added to each list
const TARGET_RATIO = 0.5; // our own target: the framework, session and permission check cost at most half

type Endpoint = { path: string; select: (conn: Kysely<Database>) => Parameters<typeof runGridQuery>[0]; options: GridOptions<unknown> };

// Each as its route handler (app/api/*/route.ts) calls gridResponse; the JSON check below fails if they drift apart.
const ENDPOINTS: Endpoint[] = [
  {
    path: '/api/quotes?offset=0&limit=100',
    select: (conn) => quoteGridSelect(conn),
    options: { columns: QUOTE_GRID_COLUMNS, key: 'q.id', defaultSort: { colId: 'number', dir: 'desc' } },
  },
  {
    path: '/api/work-orders?offset=0&limit=100',
    select: (conn) => workOrderGridSelect(conn),
    options: { columns: WORK_ORDER_GRID_COLUMNS, key: 'w.number', defaultSort: { colId: 'number', dir: 'desc' } },
  },
];

// The statements the grid code runs for one request, compiled by the same code on a Kysely that
// records instead of executing.
async function compiledStatements(e: Endpoint): Promise<{ page: BareStatement; count: BareStatement }> {
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
  await runGridQuery(e.select(recorder), e.options, gridQueryFrom(new URL(e.path, 'http://bench.invalid'), e.options.columns));
  const count = seen.filter((q) => /count\(\*\)::int as "total"/.test(q.sql));
  const page = seen.filter((q) => !count.includes(q));
  if (seen.length !== 2 || count.length !== 1) throw new Error(`expected a page and a count statement for ${e.path}, recorded ${seen.length}`);
  const plain = (q: CompiledQuery) => ({ sql: q.sql, parameters: q.parameters });
  return { page: plain(page[0]!), count: plain(count[0]!) };
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

async function load(url: string, cookie: string, seconds: number): Promise<number> {
  const r = await autocannon({ url, connections: CONNECTIONS, duration: seconds, headers: { cookie } });
  if (r.non2xx > 0 || r.errors > 0) throw new Error(`${url}: ${r.non2xx} answers other than 2xx and ${r.errors} errors under load`);
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
    const app = await startApp();
    servers.push(app);
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
    const rows: BenchRow[] = [];
    for (const e of ENDPOINTS) {
      const [fromApp, fromBare] = await Promise.all([app, bare].map((s) => fetch(`${s.url}${e.path}`, { headers: { cookie }, redirect: 'manual' })));
      const [appBody, bareBody] = await Promise.all([fromApp!.text(), fromBare!.text()]);
      if (fromApp!.status !== 200 || fromBare!.status !== 200) throw new Error(`${e.path}: app answered ${fromApp!.status}, bare server ${fromBare!.status}`);
      if (appBody !== bareBody) throw new Error(`${e.path}: the bare server's JSON differs from the app's; the benchmark no longer mirrors the route`);
      const { rows: listed, total } = JSON.parse(appBody) as { rows: unknown[]; total: number };

      await load(`${bare.url}${e.path}`, cookie, WARM_UP_S);
      await load(`${app.url}${e.path}`, cookie, WARM_UP_S);
      const bareRates: number[] = [];
      const appRates: number[] = [];
      for (let i = 0; i < ROUNDS; i++) {
        bareRates.push(await load(`${bare.url}${e.path}`, cookie, ROUND_S));
        appRates.push(await load(`${app.url}${e.path}`, cookie, ROUND_S));
      }
      const a = median(appRates);
      const b = median(bareRates);
      rows.push({
        area: 'web',
        what: `GET ${e.path.split('?')[0]} (${listed.length} of ${total} rows, ${(appBody.length / 1024).toFixed(1)} KB), ${CONNECTIONS} connections, median of ${ROUNDS} × ${ROUND_S} s`,
        value: perSecond(a),
        baseline: `bare node:http + pg, same SQL and JSON: ${perSecond(b)}`,
        ratio: a / b,
        target: `≥ ${TARGET_RATIO.toFixed(2)}×`,
        met: a / b >= TARGET_RATIO,
      });
    }
    return rows;
  } finally {
    for (const s of servers.reverse()) await s.stop();
    await sessions.close();
    await removeHistory();
  }
}
