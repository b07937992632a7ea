import 'server-only';
import PgBoss from 'pg-boss';
import { JOBS, type JobDefinition } from './registry';

// Starts pg-boss on our PostgreSQL (schema "pgboss", created by pg-boss itself), creates a queue per
// job, registers the schedules and a worker per queue. A "stately" queue holds at most one queued
// and one running job, so a slow run never piles up copies of itself.

export type Worker = { boss: PgBoss; stop: () => Promise<void> };

export async function startWorker(options: {
  connectionString: string;
  jobs?: readonly JobDefinition[];
  pollingIntervalSeconds?: number;
  log?: (line: string) => void;
}): Promise<Worker> {
  const log = options.log ?? ((line: string) => console.log(line));
  const jobs = options.jobs ?? JOBS;
  const boss = new PgBoss({ connectionString: options.connectionString, schema: 'pgboss', max: 4, application_name: 'ampwright-worker' });
  boss.on('error', (err) => log(`[worker] pg-boss error: ${err.message}`));
  await boss.start();
  for (const job of jobs) {
    await boss.createQueue(job.name, { name: job.name, policy: 'stately', retryLimit: 2, retryDelay: 30, expireInSeconds: 600 });
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
