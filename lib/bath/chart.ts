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
};

const DAY_MS = 86_400_000;
const MAX_SPAN_DAYS = 366 * 10;

/** Reads `from`/`to` (YYYY-MM-DD or ISO); defaults to the last 120 days; `to` is inclusive of its day. */
export function parseChartRange(fromText: string | null, toText: string | null, now = new Date()): ChartRange {
  const parse = (s: string, field: string) => {
    const d = new Date(/^\d{4}-\d{2}-\d{2}$/.test(s) ? `${s}T00:00:00Z` : s);
    if (Number.isNaN(d.getTime())) throw new AppError('BAD_INPUT', `${field} is not a date.`, { [field]: ['Give a date as YYYY-MM-DD.'] });
    return d;
  };
  const to = toText ? new Date(parse(toText, 'to').getTime() + (/^\d{4}-\d{2}-\d{2}$/.test(toText) ? DAY_MS : 0)) : now;
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
  const points = rows.rows.map((r, i) => ({
    t: r.taken_at.toISOString(),
    value: show(r.value),
    rules: (chart?.points[i]?.rules ?? []).map((id) => RULE_TEXT[id]),
  }));
  const lsl = analyte.lower_spec ?? undefined;
  const usl = analyte.upper_spec ?? undefined;
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
