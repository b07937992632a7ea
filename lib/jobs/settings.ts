import { z } from 'zod';

// The worker's settings from its environment, each optional (startWorker has the defaults):
//   WORKER_QUEUES               comma-separated queue names this worker runs (default: every job)
//   WORKER_EXPIRE_SECONDS       how long a run may take, for every queue here, before pg-boss counts
//                               its worker dead and retries it (default: each job's own, 600 s)
//   WORKER_RETRY_DELAY_SECONDS  wait before such a retry (default 30)
//   WORKER_SUPERVISE_SECONDS    how often pg-boss looks for expired runs (default 120)
//   WORKER_POLL_SECONDS         how often each queue is polled for work (default 5)

export type WorkerSettings = {
  queues?: string[];
  expireInSeconds?: number;
  retryDelaySeconds?: number;
  superviseIntervalSeconds?: number;
  pollingIntervalSeconds?: number;
};

// pg-boss refuses an expiry or interval of 24 hours or more, and polling more often than every 0.5 s.
const DAY = 86_400;
const blankIsUnset = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const seconds = (min: number, max: number, whole = true) =>
  z.preprocess(
    blankIsUnset,
    z.coerce
      .number({ message: 'must be a number of seconds' })
      .refine((n) => !whole || Number.isInteger(n), 'must be a whole number of seconds')
      .refine((n) => n >= min && n <= max, `must be from ${min} to ${max} seconds`)
      .optional(),
  );

export function workerSettingsFromEnv(env: Record<string, string | undefined>, knownQueues: readonly string[]): WorkerSettings {
  const schema = z.object({
    WORKER_QUEUES: z.preprocess(
      blankIsUnset,
      z
        .string()
        .transform((s) => [...new Set(s.split(',').map((q) => q.trim()).filter(Boolean))])
        .refine((qs) => qs.length > 0, 'name at least one queue')
        .refine((qs) => qs.every((q) => knownQueues.includes(q)), { message: `unknown queue; known: ${knownQueues.join(', ')}` })
        .optional(),
    ),
    WORKER_EXPIRE_SECONDS: seconds(1, DAY - 1),
    WORKER_RETRY_DELAY_SECONDS: seconds(0, DAY - 1),
    WORKER_SUPERVISE_SECONDS: seconds(1, DAY - 1),
    WORKER_POLL_SECONDS: seconds(0.5, 3600, false),
  });
  const parsed = schema.safeParse(env);
  if (!parsed.success) throw new Error(parsed.error.issues.map((i) => `${i.path.join('.')} ${i.message}`).join('; '));
  const s = parsed.data;
  return {
    queues: s.WORKER_QUEUES,
    expireInSeconds: s.WORKER_EXPIRE_SECONDS,
    retryDelaySeconds: s.WORKER_RETRY_DELAY_SECONDS,
    superviseIntervalSeconds: s.WORKER_SUPERVISE_SECONDS,
    pollingIntervalSeconds: s.WORKER_POLL_SECONDS,
  };
}
