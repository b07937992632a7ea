// Calendar dates as 'YYYY-MM-DD' text. Invoices deal in whole days (issued on, due on, days past
// due), so dates are kept as text and counted in UTC days, free of time zones and clock changes.
import { AppError } from '@/lib/errors';

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const DAY_MS = 86_400_000;

function pad(n: number, width = 2): string {
  return String(n).padStart(width, '0');
}

/** pg returns `date` columns as a Date at local midnight; text stays as it is. */
export function isoDate(value: Date | string): string {
  if (typeof value === 'string') {
    if (!isIsoDate(value)) throw new AppError('BAD_INPUT', `"${value}" is not a date in the form YYYY-MM-DD.`);
    return value;
  }
  return `${value.getFullYear()}-${pad(value.getMonth() + 1)}-${pad(value.getDate())}`;
}

export function isIsoDate(text: string): boolean {
  const m = ISO_DATE.exec(text);
  if (!m) return false;
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return d.getUTCFullYear() === Number(m[1]) && d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3]);
}

/** Today's date where the server runs. */
export function todayIso(now: Date = new Date()): string {
  return isoDate(now);
}

function utcDay(iso: string): number {
  const m = ISO_DATE.exec(isoDate(iso));
  return Date.UTC(Number(m![1]), Number(m![2]) - 1, Number(m![3])) / DAY_MS;
}

export function addDaysIso(iso: string, days: number): string {
  if (!Number.isInteger(days)) throw new AppError('BAD_INPUT', `A number of days must be whole; got ${String(days)}.`);
  const d = new Date((utcDay(iso) + days) * DAY_MS);
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetweenIso(from: string, to: string): number {
  return utcDay(to) - utcDay(from);
}
