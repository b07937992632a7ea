import 'server-only';
// Read side of quality: the lots waiting for inspection, nonconformances, issued certificates and
// the measured current efficiency per tank and finish.
import { sql } from 'kysely';
import { db } from '@/db';
import { lotEfficiency } from './efficiency';

/** Plated lots not yet inspected, oldest plating first, with what their records hold so far. */
export async function findLotsAwaitingInspection() {
  return db
    .selectFrom('work_orders as w')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .select(['w.id', 'w.number', 'w.state', 'w.bake_required', 'w.quantity_received', 'c.name as customer_name', 'p.part_number', 'f.code as finish_code'])
    .select([
      sql<Date | null>`(select max(r.ended_at) from plating_runs r where r.work_order_id = w.id)`.as('plated_at'),
      sql<number>`(select count(distinct t.part_no)::int from thickness_readings t where t.work_order_id = w.id and t.voided_at is null)`.as('parts_measured'),
      sql<number>`(select count(*)::int from thickness_readings t where t.work_order_id = w.id and t.voided_at is null and t.status <> 'pass')`.as('failing'),
      sql<number>`(select count(*)::int from nonconformances n where n.work_order_id = w.id and n.disposition is null)`.as('open_ncs'),
      sql<string | null>`(select b.verdict from bake_records b where b.work_order_id = w.id order by b.recorded_at desc limit 1)`.as('bake_verdict'),
    ])
    .where('w.state', 'in', ['in_process', 'plated', 'baked'])
    .where(({ exists, selectFrom }) => exists(selectFrom('plating_runs as r').select('r.id').whereRef('r.work_order_id', '=', 'w.id')))
    .orderBy('plated_at')
    .limit(200)
    .execute();
}

/** Orders inspected or later that have no certificate yet. */
export async function findLotsAwaitingCertificate() {
  return db
    .selectFrom('work_orders as w')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .select(['w.id', 'w.number', 'w.state', 'c.name as customer_name', 'p.part_number', 'w.updated_at'])
    .where('w.state', 'in', ['inspected', 'shipped', 'invoiced'])
    .where(({ not, exists, selectFrom }) => not(exists(selectFrom('certificates as x').select('x.id').whereRef('x.work_order_id', '=', 'w.id'))))
    .orderBy('w.updated_at', 'desc')
    .limit(100)
    .execute();
}

export async function findNonconformances(opts: { openOnly?: boolean } = {}) {
  let q = db
    .selectFrom('nonconformances as n')
    .innerJoin('work_orders as w', 'w.id', 'n.work_order_id')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .leftJoin('users as u', 'u.id', 'n.dispositioned_by')
    .select([
      'n.id', 'n.source', 'n.description', 'n.opened_at', 'n.disposition', 'n.customer_approval_ref', 'n.closed_at',
      'w.id as work_order_id', 'w.number as work_order_number', 'c.name as customer_name', 'u.name as dispositioned_by_name',
    ]);
  if (opts.openOnly) q = q.where('n.disposition', 'is', null);
  return q.orderBy(sql`n.disposition is null`, 'desc').orderBy('n.opened_at', 'desc').limit(300).execute();
}

export async function findIssuedCertificates() {
  return db
    .selectFrom('certificates as x')
    .innerJoin('work_orders as w', 'w.id', 'x.work_order_id')
    .innerJoin('customers as c', 'c.id', 'x.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .select(['x.id', 'x.number', 'x.signed_at', 'x.signed_by_name', 'w.id as work_order_id', 'w.number as work_order_number', 'w.po_number', 'c.name as customer_name', 'p.part_number', 'p.revision'])
    .orderBy('x.signed_at', 'desc')
    .limit(300)
    .execute();
}

export type EfficiencyPoint = { t: string; workOrderNumber: string; efficiency: number; ratioToPredicted: number | null; measuredMeanUm: number };
export type EfficiencySeries = { tankId: string; tankCode: string; tankName: string; assumedEfficiency: number | null; finishCode: string; finishName: string; points: EfficiencyPoint[] };

/** One series per tank and finish: each inspected lot's measured efficiency, in plating order. */
export async function findEfficiencySeries(limitLots = 2000): Promise<{ series: EfficiencySeries[]; skipped: number }> {
  const lots = await db
    .selectFrom('work_orders as w')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .select(['w.id', 'w.number', 'p.area_dm2', 'f.code as finish_code', 'f.name as finish_name', 'f.element', 'f.ion_charge'])
    .select(sql<number>`(select avg(t.thickness_um) from thickness_readings t where t.work_order_id = w.id and t.voided_at is null)`.as('mean_um'))
    .where(({ exists, selectFrom }) => exists(selectFrom('thickness_readings as t').select('t.id').whereRef('t.work_order_id', '=', 'w.id').where('t.voided_at', 'is', null)))
    .orderBy('w.created_at', 'desc')
    .limit(limitLots)
    .execute();
  if (lots.length === 0) return { series: [], skipped: 0 };
  const runs = await db
    .selectFrom('plating_runs as r')
    .innerJoin('tanks as k', 'k.id', 'r.tank_id')
    .select(['r.work_order_id', 'r.tank_id', 'k.code', 'k.name', 'k.element', 'k.efficiency', 'r.amp_hours', 'r.loads', 'r.parts_per_load', 'r.predicted_thickness_um', 'r.ended_at'])
    .where('r.work_order_id', 'in', lots.map((l) => l.id))
    .execute();
  const byOrder = new Map<string, typeof runs>();
  for (const r of runs) byOrder.set(r.work_order_id, [...(byOrder.get(r.work_order_id) ?? []), r]);
  const series = new Map<string, EfficiencySeries>();
  let skipped = 0;
  for (const lot of lots) {
    const lotRuns = byOrder.get(lot.id) ?? [];
    const e = lotEfficiency({
      element: lot.element,
      ionCharge: lot.ion_charge,
      partAreaDm2: lot.area_dm2,
      measuredMeanUm: Number(lot.mean_um),
      runs: lotRuns.map((r) => ({ tankId: r.tank_id, tankElement: r.element, ampHours: r.amp_hours, loads: r.loads, partsPerLoad: r.parts_per_load, predictedThicknessUm: r.predicted_thickness_um })),
    });
    if (!e.ok) {
      skipped++;
      continue;
    }
    const tank = lotRuns.find((r) => r.tank_id === e.tankId)!;
    const key = `${e.tankId}|${lot.finish_code}`;
    const s = series.get(key) ?? { tankId: e.tankId, tankCode: tank.code, tankName: tank.name, assumedEfficiency: tank.efficiency, finishCode: lot.finish_code, finishName: lot.finish_name, points: [] };
    const last = lotRuns.filter((r) => r.tank_id === e.tankId).reduce((a, r) => (r.ended_at > a ? r.ended_at : a), new Date(0));
    s.points.push({ t: last.toISOString(), workOrderNumber: lot.number, efficiency: e.efficiency, ratioToPredicted: e.ratioToPredicted, measuredMeanUm: e.measuredMeanUm });
    series.set(key, s);
  }
  for (const s of series.values()) s.points.sort((a, b) => a.t.localeCompare(b.t));
  return { series: [...series.values()].sort((a, b) => `${a.tankCode}${a.finishCode}`.localeCompare(`${b.tankCode}${b.finishCode}`)), skipped };
}
