import 'server-only';
import type { BathAge } from '@/lib/families/electroless-nickel/bath-age';
import { findBathAges } from './bath-age';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { AnalysisVerdict, Database, TankAnalyte } from '@/db/types';
import { getTemplate } from './templates';

// Read side of bath control: the board of every tank, and each tank's analytes with their latest
// current (not superseded) analysis.

type Db = Kysely<Database>;

export type AnalyteStatus = TankAnalyte & {
  last_value: number | null;
  last_verdict: AnalysisVerdict | null;
  last_taken_at: Date | null;
  last_analysis_id: string | null;
  is_overdue: boolean;
};

/** Active analytes of the given tanks (all tanks when omitted) with their latest current analysis. */
export async function findAnalyteStatus(tankIds?: readonly string[], now = new Date(), executor: Db = defaultDb): Promise<AnalyteStatus[]> {
  const rows = await sql<AnalyteStatus>`
    select ta.*, l.value as last_value, l.verdict as last_verdict, l.taken_at as last_taken_at, l.id as last_analysis_id,
      coalesce(l.taken_at, ta.created_at) + ta.frequency_hours * interval '1 hour' < ${now} as is_overdue
    from tank_analytes ta
    left join lateral (
      select a.id, a.value, a.verdict, a.taken_at from analyses a
      where a.analyte_id = ta.id and not exists (select 1 from analyses s where s.supersedes_id = a.id)
      order by a.taken_at desc limit 1
    ) l on true
    where ta.is_active ${tankIds ? sql`and ta.tank_id = any(${sql.val([...tankIds])}::uuid[])` : sql``}
    order by ta.tank_id, ta.sort_order, ta.name`.execute(executor);
  return rows.rows;
}

const VERDICT_RANK: Record<AnalysisVerdict, number> = { in_range: 0, near_limit: 1, out_of_range: 2 };

/** The worst latest verdict among analytes, or null when nothing has been analysed. */
export function worstVerdict(analytes: readonly Pick<AnalyteStatus, 'last_verdict'>[]): AnalysisVerdict | null {
  let worst: AnalysisVerdict | null = null;
  for (const a of analytes) {
    if (a.last_verdict && (worst === null || VERDICT_RANK[a.last_verdict] > VERDICT_RANK[worst])) worst = a.last_verdict;
  }
  return worst;
}

export type TankSummary = {
  id: string;
  code: string;
  name: string;
  lineName: string;
  templateId: string;
  templateName: string;
  volumeL: number;
  hasAhMeter: boolean;
  worst: AnalysisVerdict | null;
  analyteCount: number;
  overdue: number;
  openAlerts: number;
  lastAnalysedAt: Date | null;
  /** An electroless bath's age in metal turnovers; null for baths that have none. */
  age: BathAge | null;
};

export async function findTankSummaries(executor: Db = defaultDb): Promise<TankSummary[]> {
  const tanks = await executor
    .selectFrom('tanks as t')
    .innerJoin('lines as l', 'l.id', 't.line_id')
    .select(['t.id', 't.code', 't.name', 't.template_id', 't.volume_l', 't.has_ah_meter', 'l.name as line_name'])
    .where('t.is_active', '=', true)
    .orderBy('l.name')
    .orderBy('t.code')
    .execute();
  const [analytes, alerts, ages] = await Promise.all([
    findAnalyteStatus(undefined, new Date(), executor),
    executor
      .selectFrom('bath_alerts')
      .select(['tank_id', sql<number>`count(*)::int`.as('n')])
      .where('state', '<>', 'acknowledged')
      .groupBy('tank_id')
      .execute(),
    findBathAges(null, executor),
  ]);
  const alertCount = new Map(alerts.map((a) => [a.tank_id, a.n]));
  return tanks.map((t) => {
    const mine = analytes.filter((a) => a.tank_id === t.id);
    const last = mine.reduce<Date | null>((m, a) => (a.last_taken_at && (!m || a.last_taken_at > m) ? a.last_taken_at : m), null);
    return {
      id: t.id,
      code: t.code,
      name: t.name,
      lineName: t.line_name,
      templateId: t.template_id,
      templateName: getTemplate(t.template_id)?.name ?? t.template_id,
      volumeL: t.volume_l,
      hasAhMeter: t.has_ah_meter,
      worst: worstVerdict(mine),
      analyteCount: mine.length,
      overdue: mine.filter((a) => a.is_overdue).length,
      openAlerts: alertCount.get(t.id) ?? 0,
      lastAnalysedAt: last,
      age: ages.get(t.id) ?? null,
    };
  });
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(s: string): boolean {
  return UUID.test(s);
}

export async function getTank(where: { id: string } | { code: string }, executor: Db = defaultDb) {
  if ('id' in where && !isUuid(where.id)) return null;
  let q = executor
    .selectFrom('tanks as t')
    .innerJoin('lines as l', 'l.id', 't.line_id')
    .selectAll('t')
    .select('l.name as line_name');
  q = 'id' in where ? q.where('t.id', '=', where.id) : q.where('t.code', '=', where.code.toUpperCase());
  return (await q.executeTakeFirst()) ?? null;
}

export type TankRecord = NonNullable<Awaited<ReturnType<typeof getTank>>>;
