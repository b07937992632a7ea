// PostgreSQL stops in the middle of a load run and comes back. Runs on a cluster and an app
// server of its own (the rest of the suite keeps its database). While the database is down every
// request is answered at once: 503 with a clear message from the API, never a hang or a 500; when it
// returns, the same app process serves again; no write is half done or lost: every entry the
// device would send again (same key) ends as exactly one row, and each alert counts exactly the
// out-of-range analyses that raised it.
import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DATABASE_UNAVAILABLE_MESSAGE } from '@/lib/errors';
import { startAppServer, type AppServer } from '../helpers/app-server';
import { prepareTestDatabase } from '../helpers/test-db';
import { prepareLoadFixture, rowsWritten, type LoadFixture } from '../load/fixture';
import { formatReport, resendUnacknowledged, runMix, type LoadReport } from '../load/mix';

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, '../..');
const PG_PORT = Number(process.env.OUTAGE_PGPORT ?? 54339);
const APP_PORT = Number(process.env.APP_PORT ?? 3100) + 7;
const DATABASE_URL = `postgres://app@127.0.0.1:${PG_PORT}/ampwright_outage`;
const clusterEnv = { ...process.env, PG_CLUSTER: 'outage', PGPORT_APP: String(PG_PORT) };

async function cluster(command: 'start' | 'stop', extra: string[] = []): Promise<void> {
  await run('bash', [path.join(ROOT, 'docker-free-scripts/db.sh'), command, ...extra], { env: clusterEnv });
}
async function admin(sql: string): Promise<void> {
  const c = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${PG_PORT}/postgres` });
  await c.connect();
  await c.query(sql).finally(() => c.end());
}

let server: AppServer;
let fixture: LoadFixture;
let report: LoadReport;
const keyPrefix = `outage-${Date.now().toString(36)}-`;
const marks = { stoppingAt: 0, stoppedAt: 0, startedAt: 0, servedAgainAt: 0 };
const during: Record<string, { status: number; body: string; ms: number }> = {};

beforeAll(async () => {
  await cluster('start');
  await admin('drop database if exists ampwright_outage with (force)');
  await admin('create database ampwright_outage');
  await prepareTestDatabase(DATABASE_URL);
  server = await startAppServer({ port: APP_PORT, databaseUrl: DATABASE_URL });
  fixture = await prepareLoadFixture(DATABASE_URL);

  const started = Date.now();
  const outage = (async () => {
    await new Promise((r) => setTimeout(r, 4000));
    marks.stoppingAt = Date.now() - started;
    await cluster('stop');
    marks.stoppedAt = Date.now() - started;
    // What a customer and a plater see while it is down.
    await new Promise((r) => setTimeout(r, 1000));
    for (const [name, path, init] of [
      ['page', '/portal/invoices', { headers: { cookie: fixture.cookies.customer } }],
      ['health', '/api/health', {}],
    ] as const) {
      const t0 = Date.now();
      const r = await fetch(`${server.url}${path}`, init);
      during[name] = { status: r.status, body: await r.text(), ms: Date.now() - t0 };
    }
    await new Promise((r) => setTimeout(r, 4000));
    await cluster('start');
    marks.startedAt = Date.now() - started;
  })();
  report = await runMix({ url: server.url, fixture, seconds: 16, keyPrefix, connections: { plater: 4, estimator: 1, customer: 1 }, keepErrorBodies: true });
  await outage;
  const firstWriteAfter = report.timeline.find((t) => t.at > marks.startedAt && (t.status === 201 || t.status === 200) && (t.kind === 'analysis' || t.kind === 'meter'));
  marks.servedAgainAt = firstWriteAfter ? firstWriteAfter.at : NaN;
  const refused = report.timeline.filter((t) => t.status === 503).map((t) => t.ms).sort((a, b) => a - b);
  console.log(
    `database outage run: stopped at ${(marks.stoppedAt / 1000).toFixed(1)} s, started at ${(marks.startedAt / 1000).toFixed(1)} s, ` +
      `first write stored again at ${(marks.servedAgainAt / 1000).toFixed(1)} s; ${refused.length} answers 503 in ` +
      `p50 ${refused[Math.floor(refused.length / 2)]?.toFixed(0)} ms, slowest ${refused.at(-1)?.toFixed(0)} ms\n${formatReport(report)}`,
  );
}, 240_000);

afterAll(async () => {
  await fixture?.close().catch(() => undefined);
  await server?.stop();
  await cluster('stop').catch(() => undefined);
});

describe('PostgreSQL stops during a load run', () => {
  it('answers every request at once: the API with success or 503, never a hang or a 500', () => {
    expect(report.total.errors).toBe(0);
    const api = report.timeline.filter((t) => t.kind !== 'invoice list');
    expect(api.filter((t) => ![200, 201, 503].includes(t.status))).toEqual([]);
    expect(api.filter((t) => t.status === 503).length).toBeGreaterThan(0);
  });

  it('shows pages, or an error page only for a page whose rendering the shutdown cut short', () => {
    // A page's status is fixed once it starts to render; one caught half-way by the shutdown ends
    // on the error page ("If the database or the network is down, nothing was saved").
    const pages = report.timeline.filter((t) => t.kind === 'invoice list');
    expect(pages.length).toBeGreaterThan(0);
    for (const t of pages.filter((p) => p.status !== 200)) {
      expect(t.status).toBe(500);
      expect(t.at).toBeGreaterThanOrEqual(marks.stoppingAt);
      expect(t.at - t.ms).toBeLessThanOrEqual(marks.stoppedAt);
    }
  });

  it('says plainly what happened and that nothing was saved', () => {
    const refused = report.timeline.filter((t) => t.status === 503 && t.kind !== 'invoice list');
    expect(refused.length).toBeGreaterThan(0);
    for (const t of refused) expect(JSON.parse(t.body ?? '{}')).toEqual({ error: { code: 'UNAVAILABLE', message: DATABASE_UNAVAILABLE_MESSAGE } });
    // A page cannot carry a status of its own once rendering has begun: it says so in words.
    expect(during.page!.body).toContain('The database is unavailable right now');
    expect(during.health!.status).toBe(503);
    expect(JSON.parse(during.health!.body)).toMatchObject({ ok: false, database: 'down' });
  });

  it('serves again once the database is back, without a restart of the app', async () => {
    expect(marks.servedAgainAt).toBeGreaterThan(marks.startedAt);
    expect(() => process.kill(server.pid, 0)).not.toThrow();
    const health = await fetch(`${server.url}/api/health`);
    expect(health.status).toBe(200);
  });

  it('loses nothing: each entry sent again with its key ends as exactly one row', async () => {
    // What the device's offline queue does with an entry the app did not acknowledge.
    const resend = await resendUnacknowledged(server.url, fixture.cookies.plater, report);
    expect(resend.resent).toBeGreaterThan(0);
    expect(resend.refused).toEqual([]);
    const rows = await rowsWritten(DATABASE_URL, keyPrefix);
    expect(rows.count).toBe(report.writes.size);
    expect([...rows.keys].sort()).toEqual([...report.writes.keys()].sort());
    // A 200 on resend means the first attempt was stored although its answer was lost.
    console.log(`resent ${resend.resent} unacknowledged entries: ${resend.storedBefore} had been stored, ${resend.resent - resend.storedBefore} were stored now`);
  });

  it('leaves no half-written analysis: each alert counts exactly the analyses that raised it', async () => {
    const c = new pg.Client({ connectionString: DATABASE_URL });
    await c.connect();
    try {
      const r = await c.query<{ analyte_id: string; out_of_range: number; with_rules: number; limit_alerts: number; rule_alerts: number }>(
        `select a.analyte_id,
                count(*) filter (where a.verdict = 'out_of_range')::int as out_of_range,
                count(*) filter (where cardinality(a.rules) > 0)::int as with_rules,
                (select coalesce(sum(occurrences), 0)::int from bath_alerts b where b.analyte_id = a.analyte_id and b.kind = 'out_of_limits') as limit_alerts,
                (select coalesce(sum(occurrences), 0)::int from bath_alerts b where b.analyte_id = a.analyte_id and b.kind = 'run_rule') as rule_alerts
           from analyses a where a.tank_id = $1 group by a.analyte_id`,
        [fixture.tankId],
      );
      expect(r.rows.length).toBe(2);
      for (const row of r.rows) {
        expect(row.limit_alerts).toBe(row.out_of_range);
        expect(row.rule_alerts).toBe(row.with_rules);
      }
    } finally {
      await c.end();
    }
  });
});
