// The bath analyses in force when a lot was plated: for each tank of its runs, the latest current
// (not superseded) analysis of each active analyte taken before the tank's last run ended, with
// the tank's status then. A tank is "in control" when each of those analyses was within its
// limits and no control rule had fired on it (the bath-control area records both).
import { type Kysely, type Transaction, sql } from 'kysely';
import type { Database } from '@/db/types';
import type { BathAnalysis, BathSnapshot, BathTank } from './content';
import type { LotRun } from '../lot-types';

type Db = Kysely<Database> | Transaction<Database>;

type Row = {
  analyte_name: string;
  frequency_hours: number;
  value: number | null;
  unit: string | null;
  verdict: BathAnalysis['status'] | null;
  severity: number | null;
  rules: string[] | null;
  taken_at: Date | null;
};

async function analysesAsOf(db: Db, tankId: string, asOf: Date): Promise<Row[]> {
  const r = await sql<Row>`
    select ta.name as analyte_name, ta.frequency_hours, a.value, a.unit, a.verdict, a.severity, a.rules, a.taken_at
    from tank_analytes ta
    left join lateral (
      select x.value, x.unit, x.verdict, x.severity, x.rules, x.taken_at from analyses x
      where x.analyte_id = ta.id and x.taken_at <= ${asOf}
        and not exists (select 1 from analyses c where c.supersedes_id = x.id)
      order by x.taken_at desc limit 1
    ) a on true
    where ta.tank_id = ${tankId} and ta.is_active
    order by ta.sort_order, ta.name`.execute(db);
  return r.rows.map((row) => ({ ...row, frequency_hours: Number(row.frequency_hours), value: row.value === null ? null : Number(row.value) }));
}

const hours = (ms: number) => Math.round((ms / 3_600_000) * 10) / 10;

export function tankStatus(code: string, name: string, asOf: Date, rows: readonly Row[]): BathTank {
  const analysed = rows.filter((r) => r.taken_at !== null && r.value !== null);
  const analyses: BathAnalysis[] = analysed.map((r) => ({
    analyte: r.analyte_name,
    value: r.value!,
    unit: r.unit ?? '',
    analysedAt: new Date(r.taken_at!).toISOString(),
    status: r.verdict ?? 'in_range',
    withinSpec: (r.severity ?? 0) < 3,
  }));
  const notes: string[] = [];
  const missing = rows.filter((r) => r.taken_at === null).map((r) => r.analyte_name);
  if (missing.length) notes.push(`No analysis before the run for ${missing.join(', ')}.`);
  const stale = analysed.filter((r) => asOf.getTime() - new Date(r.taken_at!).getTime() > r.frequency_hours * 3_600_000);
  for (const r of stale) {
    notes.push(`${r.analyte_name} was last analysed ${hours(asOf.getTime() - new Date(r.taken_at!).getTime())} h before the run (schedule: every ${r.frequency_hours} h).`);
  }
  // Control rules are the shop's own early warning: shown to the supervisor, not printed for the customer.
  const rulesFired = analysed.filter((r) => (r.rules ?? []).length > 0).map((r) => r.analyte_name);
  const inControl = analysed.length === 0 ? null : analysed.every((r) => r.verdict !== 'out_of_range' && (r.rules ?? []).length === 0);
  const withinSpec = analysed.length === 0 ? null : analyses.every((a) => a.withinSpec);
  return { code, name, inControl, withinSpec, analyses, note: notes.length ? notes.join(' ') : null, rulesFired };
}

export async function bathSnapshot(db: Db, runs: readonly LotRun[]): Promise<BathSnapshot> {
  if (runs.length === 0) return { available: false, note: 'No plating runs are recorded for this lot.' };
  const byTank = new Map<string, { code: string; name: string; end: Date }>();
  for (const r of runs) {
    const seen = byTank.get(r.tankId);
    if (!seen || r.endedAt > seen.end) byTank.set(r.tankId, { code: r.tankCode, name: r.tankName, end: r.endedAt });
  }
  const tanks: BathTank[] = [];
  for (const [tankId, t] of byTank) tanks.push(tankStatus(t.code, t.name, t.end, await analysesAsOf(db, tankId, t.end)));
  return { available: true, tanks };
}
