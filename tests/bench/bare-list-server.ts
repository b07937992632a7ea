// The baseline of the list-endpoint benchmark: a bare node:http server that answers each list URL
// by running the statements the app runs for it (compiled once by api-lists.bench.ts from the same
// grid code, passed in BARE_LIST_ROUTES) through pg, and sending the same `{ rows, total }` JSON.
// No framework, no session, no permission check: the cost floor of the same work.
// Started by the benchmark as `node --import tsx tests/bench/bare-list-server.ts <port>`.
import http from 'node:http';
import { createPool } from '../../db/pool';

export type BareStatement = { sql: string; parameters: readonly unknown[] };
export type BareRoutes = Record<string, { page: BareStatement; count: BareStatement }>;

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
      const body = JSON.stringify({ rows: page.rows, total: (count.rows[0] as { total: number } | undefined)?.total ?? 0 });
      res.writeHead(200, { 'content-type': 'application/json', 'cache-control': 'no-store' }).end(body);
    },
    (err: unknown) => {
      console.error('[bare] query failed:', err);
      res.writeHead(500).end();
    },
  );
});
server.listen(port, '127.0.0.1');
