import 'server-only';
import PgBoss from 'pg-boss';
import { JOBS, type JobDefinition } from './registry';
import type { WorkerSettings } from './settings';

// Starts pg-boss on our PostgreSQL (schema "pgboss", created by pg-boss itself), creates a queue per
// job, registers the schedules and a worker per queue. A "stately" queue holds at most one queued
// and one running job, so a slow run never piles up copies of itself.
//
// A worker that dies mid-run (killed, machine lost) leaves its job "active". pg-boss's supervisor
// (every superviseIntervalSeconds, one instance at a time) fails a job active longer than its
// queue's expiry and puts it back after retryDelay, for another worker to run again; the handlers
// are idempotent, so the run that follows sends only what the dead one had not. The expiry is also
// pg-boss's time limit on a run that is still going, so it must exceed the longest honest run.

/** A run's time limit; a dead worker's job is retried once it has been active this long. */
export const DEFAULT_EXPIRE_SECONDS = 600;

export type Worker = { boss: PgBoss; stop: () => Promise<void> };

export async function startWorker(
  options: Omit<WorkerSettings, 'queues'> & { connectionString: string; jobs?: readonly JobDefinition[]; log?: (line: string) => void },
): Promise<Worker> {
  const log = options.log ?? ((line: string) => console.log(line));
  const jobs = options.jobs ?? JOBS;
  const boss = new PgBoss({
    connectionString: options.connectionString,
    schema: 'pgboss',
    max: 4,
    application_name: 'ampwright-worker',
    maintenanceIntervalSeconds: options.superviseIntervalSeconds ?? 120,
  });
  // Database gone: pg-boss reports each failed poll here and tries again at the next interval.
  boss.on('error', (err) => log(`[worker] pg-boss error: ${err.message}`));
  await boss.start();
  for (const job of jobs) {
    const queue = {
      name: job.name,
      policy: 'stately',
      retryLimit: 2,
      retryDelay: options.retryDelaySeconds ?? 30,
      expireInSeconds: options.expireInSeconds ?? job.expireInSeconds ?? DEFAULT_EXPIRE_SECONDS,
    } as const;
    // createQueue leaves an existing queue as it was; updateQueue applies changed settings to it.
    await boss.createQueue(job.name, queue);
    await boss.updateQueue(job.name, queue);
    if (job.cron) await boss.schedule(job.name, job.cron, {}, { tz: 'UTC' });
    else await boss.unschedule(job.name).catch(() => undefined);
    await boss.work(job.name, { pollingIntervalSeconds: options.pollingIntervalSeconds ?? 5 }, async ([j]) => {
      const started = Date.now();
      try {
        const result = await job.handler(j?.data ?? {});
        log(`[worker] ${job.name} done in ${Date.now() - started} ms ${JSON.stringify(result ?? null)}`);
        return result;
      } catch (err) {
        log(`[worker] ${job.name} failed: ${err instanceof Error ? err.message : String(err)}`);
        throw err;
      }
    });
  }
  log(`[worker] started: ${jobs.map((j) => `${j.name}${j.cron ? ` (${j.cron})` : ''}`).join(', ')}`);
  return { boss, stop: () => boss.stop({ graceful: true, wait: true, timeout: 10_000 }) };
}
