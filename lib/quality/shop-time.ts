// Wall-clock times on the shop floor and the instants they stand for. Platers type local times
// ("plating ended 23:40"); the app stores instants, so a bake window that crosses midnight or a
// daylight-saving change is measured in real elapsed time. Pure; uses the IANA zone data of Intl.
import { badInput } from '../bath/checks';

/** The demo shop is in Ohio; a real shop sets SHOP_TIME_ZONE to its IANA zone. */
export const DEFAULT_SHOP_TIME_ZONE = 'America/New_York';

// Making an Intl.DateTimeFormat costs some 0.15 ms, formatting with one a microsecond: a list of a
// hundred dates builds none of its own. Each formatter is made once (dateFormat) and kept.
const zoneChecks = new Map<string, boolean>();

export function isTimeZone(tz: string): boolean {
  let ok = zoneChecks.get(tz);
  if (ok === undefined) {
    try {
      new Intl.DateTimeFormat('en-US', { timeZone: tz });
      ok = true;
    } catch {
      ok = false;
    }
    if (zoneChecks.size < 1000) zoneChecks.set(tz, ok);
  }
  return ok;
}

const keptFormats = new Map<string, Intl.DateTimeFormat>();

/** An Intl.DateTimeFormat made once per locale and options (the zone among them) and kept; a zone that is not real throws and is never kept. */
export function dateFormat(locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${locale}|${JSON.stringify(options)}`;
  let f = keptFormats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, options);
    keptFormats.set(key, f);
  }
  return f;
}

export function shopTimeZone(): string {
  const tz = process.env.SHOP_TIME_ZONE?.trim();
  return tz && isTimeZone(tz) ? tz : DEFAULT_SHOP_TIME_ZONE;
}

function partsFormatter(tz: string): Intl.DateTimeFormat {
  return dateFormat('en-US', { timeZone: tz, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit' });
}

type Wall = { year: number; month: number; day: number; hour: number; minute: number; second: number };

function wallOf(ms: number, tz: string): Wall {
  const p: Record<string, number> = {};
  for (const part of partsFormatter(tz).formatToParts(new Date(ms))) {
    if (part.type !== 'literal') p[part.type] = Number(part.value);
  }
  return { year: p.year!, month: p.month!, day: p.day!, hour: p.hour!, minute: p.minute!, second: p.second! };
}

const wallMs = (w: Wall) => Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);

/** The zone's offset from UTC at an instant, in milliseconds (east positive). */
export function zoneOffsetMs(ms: number, tz: string): number {
  return wallMs(wallOf(ms, tz)) - Math.floor(ms / 1000) * 1000;
}

const LOCAL = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?$/;
const WITH_OFFSET = /(Z|[+-]\d{2}:?\d{2})$/i;

/**
 * The instant a local wall-clock time names in `tz`. A string that already carries an offset
 * ("…Z", "…-05:00") is taken as is. A time skipped when clocks go forward is refused; a time that
 * happens twice when clocks go back resolves to the first occurrence (the earlier instant).
 */
export function zonedLocalToInstant(local: string, tz: string, field = 'time', label = 'Time'): Date {
  const text = String(local ?? '').trim();
  if (!text) throw badInput(field, `${label} is required.`);
  if (WITH_OFFSET.test(text)) {
    const d = new Date(text);
    if (Number.isNaN(d.getTime())) throw badInput(field, `${label} is not a valid date and time.`);
    return d;
  }
  if (!isTimeZone(tz)) throw badInput('timeZone', `Unknown time zone "${tz}".`);
  const m = LOCAL.exec(text);
  if (!m) throw badInput(field, `${label} must look like 2026-03-08T14:30.`);
  const w: Wall = { year: +m[1]!, month: +m[2]!, day: +m[3]!, hour: +m[4]!, minute: +m[5]!, second: m[6] ? +m[6] : 0 };
  const wall = wallMs(w);
  const check = new Date(wall);
  if (check.getUTCMonth() !== w.month - 1 || check.getUTCDate() !== w.day || w.hour > 23 || w.minute > 59 || w.second > 59) {
    throw badInput(field, `${label} is not a real date and time.`);
  }
  // The offsets a day either side cover every zone's transitions (none moves more than a day).
  const offsets = new Set([zoneOffsetMs(wall - 86_400_000, tz), zoneOffsetMs(wall, tz), zoneOffsetMs(wall + 86_400_000, tz)]);
  const hits = [...offsets].map((o) => wall - o).filter((t) => wallMs(wallOf(t, tz)) === wall).sort((a, b) => a - b);
  if (hits.length === 0) {
    throw badInput(field, `${label} ${text} does not exist in ${tz}: the clocks went forward then. Enter the time as the clock showed it.`);
  }
  return new Date(hits[0]!);
}

const pad = (n: number) => String(n).padStart(2, '0');

/** "2026-03-08T14:30" in `tz`: the value a datetime-local input shows. */
export function toLocalInputValue(at: Date | string | number, tz: string): string {
  const w = wallOf(new Date(at).getTime(), tz);
  return `${w.year}-${pad(w.month)}-${pad(w.day)}T${pad(w.hour)}:${pad(w.minute)}`;
}

/** The zone's short name at that instant as US English writes it ("EDT"), else "GMT+1"-style. */
function zoneAbbreviation(d: Date, tz: string): string {
  const part = dateFormat('en-US', { timeZone: tz, timeZoneName: 'short' }).formatToParts(d).find((p) => p.type === 'timeZoneName');
  return part?.value ?? tz;
}

/** "8 Mar 2026, 14:30 EDT" in `tz`, the same text on server and browser. */
export function formatShopTime(at: Date | string | number, tz: string): string {
  const d = new Date(at);
  if (Number.isNaN(d.getTime())) return '—';
  const w = wallOf(d.getTime(), tz);
  return `${formatShopDate(d, tz)}, ${pad(w.hour)}:${pad(w.minute)} ${zoneAbbreviation(d, tz)}`;
}

/** "8 Mar 2026" in `tz`. */
export function formatShopDate(at: Date | string | number, tz: string): string {
  const d = new Date(at);
  if (Number.isNaN(d.getTime())) return '—';
  return dateFormat('en-GB', { timeZone: tz, day: 'numeric', month: 'short', year: 'numeric' }).format(d);
}
