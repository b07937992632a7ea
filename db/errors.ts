// Recognises "the database cannot be reached" among errors thrown by pg, so callers can answer 503.
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  '57P01', // admin_shutdown
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now
  '08000',
  '08001',
  '08003',
  '08006',
]);

export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err as { code?: string; message?: string; cause?: unknown } | undefined, i = 0; e && i < 5; i++) {
    if (e.code && UNAVAILABLE_CODES.has(e.code)) return true;
    const m = e.message ?? '';
    if (/timeout exceeded when trying to connect|Connection terminated|connect ECONNREFUSED|not queryable|Client was closed/i.test(m)) return true;
    if (e instanceof AggregateError) return e.errors.some(isDatabaseUnavailable);
    e = e.cause as typeof e;
  }
  return false;
}
