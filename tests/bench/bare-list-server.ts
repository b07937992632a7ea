// The baseline of the list-endpoint benchmark: a bare node:http server that answers each list URL
// by running the statements the app runs for it (compiled once by api-lists.bench.ts from the same
// grid code, passed in BARE_LIST_ROUTES) through pg, and sending the same `{ rows, total, next }` JSON.
// No framework, no session, no permission check: the cost floor of the same work.
// Started by the benchmark as `node --import tsx tests/bench/bare-list-server.ts <port>`.
import http from 'node:http';
import { createPool } from '../../db/pool';
import { encodeCursor } from '../../lib/grid/query';

export type BareStatement = { sql: string; parameters: readonly unknown[] };
/** `frame` is the page's order and `limit` its size, for the cursor of its last row as the route makes it. */
export type BareRoutes = Record<string, { page: BareStatement; count: BareStatement; frame: { colId: string | null; dir: 'asc' | 'desc' }; limit: number }>;

const port = Number(process.argv[2]);
const routes = JSON.parse(process.env.BARE_LIST_ROUTES ?? '{}') as BareRoutes;
// The same pool settings as the app's (db/pool.ts), on the same database.
const pool = createPool();

const server = http.createServer((req, res) => {
  const route = routes[req.url ?? ''];
  if (!route) {
    res.writeHead(404).end();
    return;
  }
  Promise.all([pool.query(route.page.sql, [...route.page.parameters]), pool.query(route.count.sql, [...route.count.parameters])]).then(
    ([page, count]) => {
      const rows = page.rows.map(({ __grid_sort: _s, __grid_key: _k, ...row }) => row);
      const last = page.rows.at(-1) as { __grid_sort: string | null; __grid_key: string } | undefined;
      const next = last && page.rows.length === route.limit ? encodeCursor({ ...route.frame, value: last.__grid_sort, key: String(last.__grid_key) }) : null;
      const body = JSON.stringify({ rows, total: (count.rows[0] as { total: number } | undefined)?.total ?? 0, next });
      res.writeHead(200, { 'content-type': 'application/json', 'cache-control': 'no-store' }).end(body);
    },
    (err: unknown) => {
      console.error('[bare] query failed:', err);
      res.writeHead(500).end();
    },
  );
});
server.listen(port, '127.0.0.1');
