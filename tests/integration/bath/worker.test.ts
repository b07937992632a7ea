import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { databaseUrl } from '@/db/pool';
import { DEFAULT_EXPIRE_SECONDS, startWorker } from '@/lib/jobs/boss';
import { JOBS } from '@/lib/jobs/registry';

afterAll(() => db.destroy());

describe('background worker (pg-boss on our PostgreSQL)', () => {
  it('lists each job once with a five-field cron', () => {
    const names = JOBS.map((j) => j.name);
    expect(new Set(names).size).toBe(names.length);
    for (const j of JOBS) if (j.cron) expect(j.cron.split(' '), j.name).toHaveLength(5);
    expect(names).toEqual(expect.arrayContaining(['bath-overdue-check', 'bath-alert-escalation', 'bath-addition-check', 'bath-alert-emails']));
  });

  // Fixed queue names: the queues stay between runs (pg-boss 10 cannot drop a queue that has kept jobs).
  it('creates the queues, registers the schedules and runs a job sent to it', async () => {
    const ran: unknown[] = [];
    const lines: string[] = [];
    const worker = await startWorker({
      connectionString: databaseUrl(),
      pollingIntervalSeconds: 0.5,
      log: (l) => lines.push(l),
      jobs: [
        { name: `test-worker-on-demand`, description: 'test', handler: async (data) => void ran.push(data) },
        { name: `test-worker-scheduled`, cron: '0 3 * * *', description: 'test', handler: async () => undefined },
      ],
    });
    try {
      const schedules = await worker.boss.getSchedules();
      expect(schedules.map((s) => s.name)).toContain(`test-worker-scheduled`);
      await worker.boss.send(`test-worker-on-demand`, { hello: 'tank' });
      const end = Date.now() + 15_000;
      while (ran.length === 0 && Date.now() < end) await new Promise((r) => setTimeout(r, 200));
      expect(ran).toEqual([{ hello: 'tank' }]);
      expect(lines.some((l) => l.includes(`test-worker-on-demand done`))).toBe(true);
    } finally {
      await worker.boss.unschedule(`test-worker-scheduled`);
      await worker.stop();
    }
  }, 60_000);

  it('applies a job\'s expiry, or the worker\'s override, to a queue that already exists', async () => {
    const job = { name: 'test-worker-expiry', description: 'test', handler: async () => undefined };
    const queueOf = async (options: { expireInSeconds?: number; retryDelaySeconds?: number }, jobExpiry?: number) => {
      const worker = await startWorker({ connectionString: databaseUrl(), log: () => undefined, jobs: [{ ...job, expireInSeconds: jobExpiry }], ...options });
      try {
        return await worker.boss.getQueue(job.name);
      } finally {
        await worker.stop();
      }
    };
    expect(await queueOf({})).toMatchObject({ expireInSeconds: DEFAULT_EXPIRE_SECONDS, retryDelay: 30, policy: 'stately' });
    expect(await queueOf({}, 90)).toMatchObject({ expireInSeconds: 90 });
    expect(await queueOf({ expireInSeconds: 5, retryDelaySeconds: 1 }, 90)).toMatchObject({ expireInSeconds: 5, retryDelay: 1 });
  }, 60_000);
});
