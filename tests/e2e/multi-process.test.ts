// Ampwright keeps all of its state in PostgreSQL, so a shop can run several `next start` processes
// behind a load balancer and several background workers on one database. Here: two app processes
// behind a round-robin on loopback and two workers, under the load mix. Sessions hold on both,
// document numbers stay unique and gap-free, each e-mail goes out once, and the rows written are
// exactly the writes the app acknowledged.
process.env.SMTP_PORT ??= '2526'; // the test mail fake

import { sql } from 'kysely';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { addDaysIso, todayIso } from '@/lib/billing/dates';
import { issueInvoice } from '@/lib/billing/mutations';
import { JOB } from '@/lib/jobs/names';
import { actionRequest } from '../helpers/actions';
import { startAppServer, type AppServer } from '../helpers/app-server';
import { E2E_PORT } from '../helpers/e2e-setup';
import { messagesTo } from '../helpers/mailbox';
import { startRoundRobin, type RoundRobin } from '../helpers/round-robin';
import { discoverActions } from '../helpers/routes';
import { TEST_DATABASE_URL } from '../helpers/test-db';
import { startWorkerProcess, type WorkerProcess } from '../helpers/worker-process';
import { customerId, makeOrder, OWNER, sessionUser } from '../integration/billing/fixtures';
import { prepareLoadFixture, rowsWritten, type LoadFixture } from '../load/fixture';
import { formatReport, resendUnacknowledged, runMix, type LoadReport } from '../load/mix';
import { until } from '../helpers/until';

const SECOND_PORT = E2E_PORT + 11;
const REMINDERS = JOB.invoiceReminders;

let second: AppServer;
let balancer: RoundRobin;
let fixture: LoadFixture;
let boss: PgBoss;
const workers: WorkerProcess[] = [];

beforeAll(async () => {
  second = await startAppServer({ port: SECOND_PORT, databaseUrl: TEST_DATABASE_URL, stdio: 'ignore' });
  balancer = await startRoundRobin([E2E_PORT, SECOND_PORT]);
  fixture = await prepareLoadFixture(TEST_DATABASE_URL);
  boss = new PgBoss({ connectionString: TEST_DATABASE_URL, schema: 'pgboss', supervise: false, schedule: false, max: 2 });
  boss.on('error', (err) => console.error('[test boss]', err.message));
  await boss.start();
  await sql`delete from pgboss.job where name = ${REMINDERS} and state < 'completed'`.execute(db);
  for (let i = 0; i < 2; i++) workers.push(await startWorkerProcess({ DATABASE_URL: TEST_DATABASE_URL, WORKER_QUEUES: REMINDERS, WORKER_POLL_SECONDS: '0.5' }));
}, 120_000);

afterAll(async () => {
  for (const w of workers) if (!w.hasExited()) w.child.kill('SIGTERM');
  await Promise.all(workers.map((w) => w.exit));
  await boss?.stop({ graceful: false, wait: true });
  await fixture?.close();
  await balancer?.close();
  await second?.stop();
  await db.destroy();
});

describe('two app processes and two workers on one database', () => {
  it('a session started on one process is valid on the other', async () => {
    for (const port of [E2E_PORT, SECOND_PORT]) {
      const r = await fetch(`http://127.0.0.1:${port}/api/quotes?offset=0&limit=1`, { headers: { cookie: fixture.cookies.estimator } });
      expect(r.status, `port ${port}`).toBe(200);
      const anonymous = await fetch(`http://127.0.0.1:${port}/api/quotes?offset=0&limit=1`);
      expect(anonymous.status, `port ${port} without a session`).toBe(401);
    }
  });

  let report: LoadReport;
  const keyPrefix = `load-multi-${Date.now().toString(36)}-`;

  it('answers the load mix through the round-robin with no error, and both processes take part', async () => {
    report = await runMix({ url: balancer.url, fixture, seconds: 8, keyPrefix });
    console.log(`load mix over two app processes (${report.seconds.toFixed(1)} s, connections per process ${balancer.connections.join(' / ')}):\n${formatReport(report)}`);
    expect(report.total.errors).toBe(0);
    for (const k of report.kinds) expect(Object.keys(k.statuses).every((s) => s.startsWith('2')), `${k.role} ${k.kind}: ${JSON.stringify(k.statuses)}`).toBe(true);
    expect(balancer.connections.every((n) => n > 0), `connections ${balancer.connections.join(' / ')}`).toBe(true);
  }, 60_000);

  it('writes one row per acknowledged write, whichever process took it', async () => {
    const cutOff = await resendUnacknowledged(balancer.url, fixture.cookies.plater, report);
    expect(cutOff.refused).toEqual([]);
    const rows = await rowsWritten(TEST_DATABASE_URL, keyPrefix);
    expect(rows.count).toBe(report.writes.size);
    expect([...rows.keys].sort()).toEqual([...report.writes.keys()].sort());
  });

  it('numbers quotes made at once on both processes uniquely and without a gap', async () => {
    const action = discoverActions(process.env.NEXT_DIST_DIR ?? '.next-test').find((a) => a.name === 'createQuoteAction');
    expect(action, 'createQuoteAction is in the build').toBeTruthy();
    const customer = await customerId('NGF');
    const year = new Date().getUTCFullYear();
    const counter = async () =>
      (await db.selectFrom('number_counters').select('last_seq').where('series', '=', 'quote').where('year', '=', year).executeTakeFirst())?.last_seq ?? 0;
    const before = await counter();
    const marker = `multi-process ${Date.now().toString(36)}`;
    // 16 requests at once: the client opens a connection for each, and the round-robin alternates them.
    const answers = await Promise.all(
      Array.from({ length: 16 }, async () => {
        const init = actionRequest(action!.id, { customerId: customer, notes: marker }, balancer.url);
        const r = await fetch(`${balancer.url}/quotes/new`, { ...init, headers: { ...(init.headers as Record<string, string>), cookie: fixture.cookies.estimator }, redirect: 'manual' });
        await r.text();
        return r.status;
      }),
    );
    expect(answers.every((s) => s === 200 || s === 303), `answers ${answers.join(', ')}`).toBe(true);
    const made = await db.selectFrom('quotes').select('number').where('notes', '=', marker).execute();
    expect(made).toHaveLength(16);
    // Q2026-0042 → 42: the sixteen take the next sixteen numbers of the year, each once, none skipped.
    const after = await counter();
    expect(after - before).toBe(16);
    const seqs = made.map((q) => Number(q.number.split('-')[1])).sort((a, b) => a - b);
    expect(seqs).toEqual(Array.from({ length: 16 }, (_, i) => before + 1 + i));
  }, 60_000);

  it('sends each reminder once with both workers polling the reminder queue', async () => {
    const tag = Date.now().toString(36);
    const owner = await sessionUser(OWNER);
    const invoices = [];
    for (let i = 0; i < 4; i++) {
      const o = await makeOrder({ customer: 'HVI' });
      const inv = await issueInvoice(owner.id, { customerId: await customerId('HVI'), orderIds: [o.id], extras: [], issuedOn: addDaysIso(todayIso(), -100 + i) });
      const email = `multi-${i}-${tag}@halvorsen-valve.test`;
      await db.updateTable('invoices').set({ billing_email: email }).where('id', '=', inv.id).execute();
      invoices.push({ ...inv, email });
    }
    // Runs asked for one after another while the workers poll: the queue holds at most one waiting
    // and one running (its 'stately' policy refuses the rest), and whichever worker is free takes it.
    const ids: string[] = [];
    for (let i = 0; i < 6; i++) {
      const id = await boss.send(REMINDERS, {});
      if (id) ids.push(id);
      await new Promise((r) => setTimeout(r, 150));
    }
    expect(ids.length, 'the queue took at least two runs').toBeGreaterThanOrEqual(2);
    for (const id of ids) {
      await until(`job ${id} to finish`, async () => {
        const job = await boss.getJobById(REMINDERS, id);
        return job?.state === 'completed' || job?.state === 'failed' ? job : undefined;
      }, 60_000);
    }
    const runsBy = workers.map((w) => w.lines.filter((l) => l.includes(`${REMINDERS} done`)).length);
    console.log(`reminder runs taken by each worker: ${runsBy.join(' / ')}`);
    for (const inv of invoices) {
      const inbox = await messagesTo(inv.email);
      expect(inbox, inv.email).toHaveLength(1);
      const claims = await db.selectFrom('invoice_reminders').select('stage').where('invoice_id', '=', inv.id).execute();
      expect(claims).toHaveLength(1);
    }
    const took = (await sql<{ n: number }>`select count(*)::int as n from pgboss.job where id = any(${ids}::uuid[]) and state = 'completed'`.execute(db)).rows[0]!;
    expect(took.n).toBe(ids.length);
  }, 120_000);
});
