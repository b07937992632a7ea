import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import type { UnitSystem } from '@/lib/plating/units';
import { convertSymbol, displayUnitOf } from './display';
import { capabilityFromValues, individualsChart, RULE_TEXT } from './spc';

// The individuals control chart of one analyte over a date range: the current (not superseded)
// analyses, limits from the data (phase I, MR̄/d2 sigma), the Western Electric rules at each point,
// the specification limits and Cpk where they exist. One indexed range scan serves years of points.

export type ChartRange = { from: Date; to: Date };

/**
 * Where the control limits come from: all analyses shown (phase I), or a baseline of the first
 * BASELINE_POINTS shown, against which the later ones are judged (phase II). A drift late in a
 * long range pulls phase I limits towards itself; a baseline shows it plainly.
 */
export type LimitBasis = 'all' | 'baseline';
export const BASELINE_POINTS = 30;

export type ChartData = {
  analyte: { id: string; key: string; name: string; tankCode: string; tankName: string };
  unit: string;
  points: { t: string; value: number; rules: string[] }[];
  limits: { cl: number; ucl: number; lcl: number; lsl?: number; usl?: number } | null;
  capability: { cp: number | null; cpk: number } | null;
  sigmaBasis: string | null;
  limitBasis: LimitBasis;
  warnings: string[];
  /** Readings in the range, and how many of them `points` holds (fewer when a long range is thinned). */
  readings: { total: number; shown: number };
};

/** More readings than this in a range are thinned for the screen (a chart is some 1,000 pixels wide). */
export const MAX_CHART_POINTS = 1500;

/**
 * The readings a chart draws when there are more than `max`: every reading a control rule fired on
 * or outside a specification limit, and of the rest, each period's lowest and highest, so no
 * excursion disappears. Limits and capability are always worked out from every reading.
 */
export function thinForChart<P extends { value: number; rules: string[] }>(points: readonly P[], max: number, outside: (p: P) => boolean): P[] {
  if (points.length <= max) return [...points];
  const keep = new Set<number>();
  points.forEach((p, i) => {
    if (p.rules.length || outside(p)) keep.add(i);
  });
  const buckets = Math.max(1, Math.floor((max - Math.min(keep.size, max / 2)) / 2));
  const size = points.length / buckets;
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor(b * size);
    const to = Math.min(points.length, Math.floor((b + 1) * size));
    let lo = from;
    let hi = from;
    for (let i = from; i < to; i++) {
      if (points[i]!.value < points[lo]!.value) lo = i;
      if (points[i]!.value > points[hi]!.value) hi = i;
    }
    if (to > from) keep.add(lo).add(hi);
  }
  return [...keep].sort((a, b) => a - b).map((i) => points[i]!);
}

const DAY_MS = 86_400_000;
/** A calendar day as the chart's range takes it, YYYY-MM-DD. */
export const CHART_DAY = /^\d{4}-\d{2}-\d{2}$/;
const MAX_SPAN_DAYS = 366 * 10;

/** Reads `from`/`to` (YYYY-MM-DD or ISO); defaults to the last 120 days; `to` is inclusive of its day. */
export function parseChartRange(fromText: string | null, toText: string | null, now = new Date()): ChartRange {
  const parse = (s: string, field: string) => {
    const d = new Date(CHART_DAY.test(s) ? `${s}T00:00:00Z` : s);
    if (Number.isNaN(d.getTime())) throw new AppError('BAD_INPUT', `${field} is not a date.`, { [field]: ['Give a date as YYYY-MM-DD.'] });
    return d;
  };
  const to = toText ? new Date(parse(toText, 'to').getTime() + (CHART_DAY.test(toText) ? DAY_MS : 0)) : now;
  const from = fromText ? parse(fromText, 'from') : new Date(to.getTime() - 120 * DAY_MS);
  if (from >= to) throw new AppError('BAD_INPUT', 'The start date must be before the end date.', { from: ['Start before the end date.'] });
  if (to.getTime() - from.getTime() > MAX_SPAN_DAYS * DAY_MS) throw new AppError('BAD_INPUT', 'Choose at most ten years.', { from: ['At most ten years.'] });
  return { from, to };
}

export async function getChartData(
  tankId: string,
  analyteId: string,
  range: ChartRange,
  system: UnitSystem,
  executor: Kysely<Database> = defaultDb,
  basis: LimitBasis = 'all',
  /** Every reading (the CSV export) rather than the screen's thinned set. */
  allPoints = false,
): Promise<ChartData> {
  const analyte = await executor
    .selectFrom('tank_analytes as a')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .select(['a.id', 'a.key', 'a.name', 'a.unit', 'a.lower_spec', 'a.upper_spec', 't.code', 't.name as tank_name'])
    .where('a.id', '=', analyteId)
    .where('a.tank_id', '=', tankId)
    .executeTakeFirst();
  if (!analyte) throw new AppError('NOT_FOUND', 'That analyte does not belong to this tank.');
  // Index range scan on (analyte_id, taken_at); the anti-join uses the unique supersedes_id index.
  const rows = await sql<{ taken_at: Date; value: number }>`
    select a.taken_at, a.value from analyses a
    where a.analyte_id = ${analyteId} and a.taken_at >= ${range.from} and a.taken_at < ${range.to}
      and not exists (select 1 from analyses s where s.supersedes_id = a.id)
    order by a.taken_at`.execute(executor);
  const unit = displayUnitOf(analyte.unit, system);
  const show = (v: number) => convertSymbol(v, analyte.unit, unit);
  const values = rows.rows.map((r) => r.value);
  const base = {
    analyte: { id: analyte.id, key: analyte.key, name: analyte.name, tankCode: analyte.code, tankName: analyte.tank_name },
    unit,
  };
  let chart: ReturnType<typeof individualsChart> | null = null;
  const warnings: string[] = [];
  const useBaseline = basis === 'baseline' && values.length > BASELINE_POINTS;
  if (values.length >= 2) {
    try {
      const base = useBaseline ? individualsChart(values.slice(0, BASELINE_POINTS)) : null;
      chart = base ? individualsChart(values, { centre: base.centre, sigma: base.sigma }) : individualsChart(values);
      if (base) chart.sigmaBasis = base.sigmaBasis;
      warnings.push(...chart.warnings);
    } catch (e) {
      if (!(e instanceof AppError)) throw e;
      warnings.push(e.message);
    }
  } else {
    warnings.push('At least two analyses are needed for control limits.');
  }
  const every = rows.rows.map((r, i) => ({
    t: r.taken_at.toISOString(),
    value: show(r.value),
    raw: r.value,
    rules: (chart?.points[i]?.rules ?? []).map((id) => RULE_TEXT[id]),
  }));
  const lsl = analyte.lower_spec ?? undefined;
  const usl = analyte.upper_spec ?? undefined;
  const outsideSpec = (p: { raw: number }) => (lsl !== undefined && p.raw < lsl) || (usl !== undefined && p.raw > usl);
  const points = (allPoints ? every : thinForChart(every, MAX_CHART_POINTS, outsideSpec)).map(({ t, value, rules }) => ({ t, value, rules }));
  if (points.length < every.length) {
    warnings.push(`${every.length.toLocaleString('en-US')} readings in this range: the chart draws ${points.length.toLocaleString('en-US')} of them (every one a rule fired on or outside specification, and each period's highest and lowest); the limits use them all, and the CSV holds every reading.`);
  }
  const hasSpec = lsl !== undefined || usl !== undefined;
  // Capability of the analyses shown: their mean and within (moving-range) sigma, whatever the limit basis.
  let cap: ReturnType<typeof capabilityFromValues> | null = null;
  if (chart && hasSpec) {
    try {
      cap = capabilityFromValues(values, { lsl, usl });
    } catch (e) {
      if (!(e instanceof AppError)) throw e;
    }
  }
  return {
    ...base,
    points,
    limits: chart
      ? {
          cl: show(chart.centre),
          ucl: show(chart.ucl),
          lcl: show(chart.lcl),
          ...(lsl !== undefined ? { lsl: show(lsl) } : {}),
          ...(usl !== undefined ? { usl: show(usl) } : {}),
        }
      : null,
    capability: cap ? { cp: cap.cp, cpk: cap.cpk } : null,
    sigmaBasis: chart?.sigmaBasis ?? null,
    limitBasis: useBaseline ? 'baseline' : 'all',
    warnings,
    readings: { total: every.length, shown: points.length },
  };
}

function csvCell(s: string): string {
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function chartCsv(data: ChartData): string {
  const head = ['taken_at', `${data.analyte.name} (${data.unit})`, 'rules_fired'];
  const lines = data.points.map((p) => [p.t, String(p.value), p.rules.join('; ')].map(csvCell).join(','));
  return `${[head.map(csvCell).join(','), ...lines].join('\r\n')}\r\n`;
}
