// The background worker under faults, as its own process on the test database and the test mail
// fake: killed in the middle of a job (the job runs again on the next worker and no e-mail goes out
// twice), and cut off from its database for a while (it keeps running and finishes the job).
process.env.SMTP_PORT ??= '2526'; // the test mail fake

import { sql } from 'kysely';
import PgBoss from 'pg-boss';
import { afterAll, afterEach, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { db } from '@/db';
import { databaseUrl } from '@/db/pool';
import { addDaysIso, todayIso } from '@/lib/billing/dates';
import { issueInvoice } from '@/lib/billing/mutations';
import type { ReminderRun } from '@/lib/billing/reminders';
import { raiseAlert } from '@/lib/bath/alerts';
import { JOB } from '@/lib/jobs/names';
import { heldMail, holdMail, messagesTo, releaseMail } from '../../helpers/mailbox';
import { startTcpProxy, type TcpProxy } from '../../helpers/tcp-proxy';
import { startWorkerProcess, type WorkerProcess } from '../../helpers/worker-process';
import { makeTank, removeTank } from '../bath/fixtures';
import { customerId, makeOrder, OWNER, sessionUser } from '../billing/fixtures';
import { until } from '../../helpers/until';

const QUEUE = JOB.invoiceReminders;
// Short settings, so that a dead worker's job expires, is noticed and retried within seconds
// (the product defaults: 600 s expiry, supervised every 120 s, retried after 30 s). The expiry is
// also pg-boss's limit on a live run: long enough for a run on a busy machine.
const FAST = {
  WORKER_QUEUES: QUEUE,
  WORKER_EXPIRE_SECONDS: '10',
  WORKER_SUPERVISE_SECONDS: '1',
  WORKER_RETRY_DELAY_SECONDS: '1',
  WORKER_POLL_SECONDS: '0.5',
};

let boss: PgBoss;
const workers: WorkerProcess[] = [];
let proxy: TcpProxy | undefined;

async function worker(env: Record<string, string> = {}): Promise<WorkerProcess> {
  const w = await startWorkerProcess({ ...FAST, ...env });
  workers.push(w);
  onTestFailed(() => console.error(`worker ${w.child.pid} logged:\n${w.lines.join('\n')}`));
  return w;
}

beforeAll(async () => {
  boss = new PgBoss({ connectionString: databaseUrl(), schema: 'pgboss', supervise: false, schedule: false, max: 2 });
  boss.on('error', (err) => console.error('[test boss]', err.message));
  await boss.start();
  // An aborted earlier run may have left a job behind, and a stately queue would refuse a new one.
  await sql`delete from pgboss.job where name = ${QUEUE} and state < 'completed'`.execute(db);
});
afterEach(async () => {
  for (const w of workers.splice(0)) if (!w.hasExited()) w.child.kill('SIGKILL');
  await proxy?.close();
  proxy = undefined;
  await releaseMail();
});
afterAll(async () => {
  await boss?.stop({ graceful: false, wait: true });
  await db.destroy();
});

/** An invoice issued `daysAgo` on Halvorsen's net 45 terms, with a billing address of its own. */
async function overdueInvoice(daysAgo: number, email: string) {
  const o = await makeOrder({ customer: 'HVI' });
  const inv = await issueInvoice((await sessionUser(OWNER)).id, { customerId: await customerId('HVI'), orderIds: [o.id], extras: [], issuedOn: addDaysIso(todayIso(), -daysAgo) });
  await db.updateTable('invoices').set({ billing_email: email }).where('id', '=', inv.id).execute();
  return { ...inv, email };
}

const remindersOf = (invoiceId: string) => db.selectFrom('invoice_reminders').select(['stage', 'sent_to']).where('invoice_id', '=', invoiceId).execute();
const loggedSends = (address: string) => db.selectFrom('emails').select('status').where('to_address', '=', address).execute();

const jobState = async (id: string, queue: string = QUEUE) => (await boss.getJobById(queue, id))?.state;
const completed = (id: string, queue: string = QUEUE) =>
  until(`job ${id} to complete`, async () => {
    const job = await boss.getJobById(queue, id);
    return job?.state === 'completed' ? job : undefined;
  });

/** SIGKILL while the message to `address` is in the middle of its SMTP conversation. */
async function killWhileSending(w: WorkerProcess, address: string): Promise<void> {
  await until(`a message to ${address} to be held`, async () => (await heldMail()).get(address) === 1);
  w.child.kill('SIGKILL');
  expect(await w.exit).toEqual({ code: null, signal: 'SIGKILL' });
  // The fake saw its client go before the reply: the message was never accepted.
  await until('the fake to drop the held message', async () => (await heldMail()).get(address) === 0);
  await releaseMail(address);
}

describe('background worker under faults', () => {
  it('killed while sending the second of two reminders: the next worker runs the job again and each goes out once', async () => {
    const tag = Date.now().toString(36);
    // Due 55 and 54 days ago: the 30-day stage for both, the earlier one first.
    const first = await overdueInvoice(100, `crash-first-${tag}@halvorsen-valve.test`);
    const second = await overdueInvoice(99, `crash-second-${tag}@halvorsen-valve.test`);
    await holdMail(second.email);
    const dying = await worker();
    const jobId = await boss.send(QUEUE, {});
    expect(jobId, 'the queue took the job').toBeTruthy();

    // Killed once the first reminder is out and the second is in the middle of being sent.
    await until('the second reminder to be held', async () => (await heldMail()).get(second.email) === 1);
    expect(await messagesTo(first.email)).toHaveLength(1);
    expect(await jobState(jobId!)).toBe('active');
    await killWhileSending(dying, second.email);
    expect(await messagesTo(second.email)).toEqual([]);
    // The first claim committed with its send; the second died with its transaction.
    expect(await remindersOf(first.id)).toHaveLength(1);
    expect(await remindersOf(second.id)).toEqual([]);
    expect(await jobState(jobId!)).toBe('active');

    const next = await worker();
    const job = await completed(jobId!);
    expect(job.retryCount).toBe(1);
    const run = job.output as ReminderRun;
    expect(run.sent).toContain(`${second.number} (overdue_30)`);
    expect(run.sent.join()).not.toContain(first.number);
    expect(run.failed).toEqual([]);

    for (const inv of [first, second]) {
      const inbox = await messagesTo(inv.email);
      expect(inbox, inv.email).toHaveLength(1);
      expect(inbox[0]!.subject).toMatch(new RegExp(`^Reminder: invoice ${inv.number} is \\d+ days past due`));
      expect(await remindersOf(inv.id)).toEqual([{ stage: 'overdue_30', sent_to: inv.email }]);
      expect(await loggedSends(inv.email)).toEqual([{ status: 'sent' }]);
    }
    next.child.kill('SIGTERM');
    expect((await next.exit).code).toBe(0);
  }, 90_000);

  it('killed while sending owed bath-alert e-mails: the next worker sends the rest, none twice', async () => {
    const tag = Date.now().toString(36);
    const tank = await makeTank();
    const supervisors = ['a', 'b'].map((x) => ({ id: `crash-${x}-${tag}`, email: `crash-${x}-${tag}@kestrel-plating.test`, name: `Crash test ${x}`, role: 'supervisor' as const }));
    await db.insertInto('users').values(supervisors).execute();
    try {
      const alert = await raiseAlert(db, { tankId: tank.id, analyteId: tank.analytes.nickel!.id, kind: 'out_of_limits', dedupeKey: `crash:${tag}`, message: 'Nickel metal below the lower limit (test).' });
      const [a, b] = supervisors.map((u) => u.email) as [string, string];
      const claims = (recipient: string, alertId?: string) =>
        db
          .selectFrom('bath_alert_emails')
          .select(['status'])
          .where('recipient', '=', recipient)
          .$if(!!alertId, (q) => q.where('alert_id', '=', alertId!))
          .execute();
      const mine = async (address: string) => (await messagesTo(address)).filter((m) => m.subject.includes(tank.code));
      const queue = JOB.bathAlertEmails;
      await holdMail(b);
      const dying = await worker({ WORKER_QUEUES: queue });
      await boss.send(queue, {}); // its schedule (every minute) may have queued one already
      await until('a message to b to be held', async () => (await heldMail()).get(b) === 1);
      const [active] = (await sql<{ id: string }>`select id from pgboss.job where name = ${queue} and state = 'active'`.execute(db)).rows;
      await killWhileSending(dying, b);
      // The dead sender left no claim on the message it was sending (for this or another open
      // alert) to stop the next run from sending it.
      expect((await claims(b)).filter((c) => c.status !== 'sent')).toEqual([]);

      const next = await worker({ WORKER_QUEUES: queue });
      expect((await completed(active!.id, queue)).retryCount).toBe(1);
      for (const address of [a, b]) {
        expect(await mine(address), address).toHaveLength(1);
        expect(await claims(address, alert.id)).toEqual([{ status: 'sent' }]);
      }
      // Every message b got, for any open alert, matches one sent claim: nothing twice, nothing lost.
      const all = await claims(b);
      expect(all.filter((c) => c.status !== 'sent')).toEqual([]);
      expect(await messagesTo(b)).toHaveLength(all.length);
      next.child.kill('SIGTERM');
      expect((await next.exit).code).toBe(0);
    } finally {
      await removeTank(tank);
      await db.deleteFrom('users').where('id', 'in', supervisors.map((u) => u.id)).execute();
    }
  }, 90_000);

  it('cut off from its database in the middle of a job: keeps running without spinning, and finishes the job once it is back', async () => {
    const target = new URL(databaseUrl());
    proxy = await startTcpProxy({ host: target.hostname, port: Number(target.port || 5432) });
    const viaProxy = new URL(target);
    viaProxy.host = `127.0.0.1:${proxy.port}`;

    const inv = await overdueInvoice(100, `outage-${Date.now().toString(36)}@halvorsen-valve.test`);
    // The relay will refuse this one (451) while the database is away: the handler then fails,
    // and pg-boss cannot record that.
    await holdMail(inv.email, { outcome: 'reject' });
    const w = await worker({ DATABASE_URL: viaProxy.toString() });
    const jobId = await boss.send(QUEUE, {});
    await until('the reminder to be held', async () => (await heldMail()).get(inv.email) === 1);

    await proxy.cut();
    const cutAt = w.lines.length;
    await releaseMail(inv.email);
    const outageMs = 6000;
    await new Promise((r) => setTimeout(r, outageMs));
    expect(w.hasExited(), w.lines.join('\n')).toBe(false);
    const logged = w.lines.slice(cutAt);
    expect(logged.some((l) => l.startsWith('[worker] pg-boss error:')), logged.join('\n')).toBe(true);
    // Each queue, the schedule and the supervisor retry at their own intervals: a few lines a
    // second at these settings, where a busy loop would log thousands.
    expect(logged.length, logged.join('\n')).toBeLessThan((outageMs / 1000) * 10);

    await proxy.restore();
    const job = await completed(jobId!);
    expect(job.retryCount).toBeGreaterThanOrEqual(1);
    expect(await messagesTo(inv.email)).toHaveLength(1);
    expect(await remindersOf(inv.id)).toEqual([{ stage: 'overdue_30', sent_to: inv.email }]);
    w.child.kill('SIGTERM');
    expect((await w.exit).code).toBe(0);
  }, 90_000);
});
