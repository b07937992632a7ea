import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, ProcessFamilyId, RateSet } from '@/db/types';
import { familyParams, getFamily } from '@/lib/families';
import type { LinePrice } from '@/lib/quotes/pricing';
import { rateSetInForce, ratesFromRow } from '@/lib/quotes/pricing-context';
import { bathMetalGPerL, DEFAULT_DRAG_OUT_L_PER_M2, DEFAULT_RECTIFIER_EFFICIENCY } from '@/lib/quotes/process';
import { actualCost, compareCosts, type CostComparison, type CostedRun } from './costing';

// Actual cost of work orders from their runs, priced at the rates the quote used (so the variance
// shows the process, not a rate change), with the current rates for orders without a quote.

type Db = Kysely<Database>;

type CostRow = {
  work_order_id: string;
  amp_hours: number;
  predicted_thickness_um: number;
  volume_l: number;
  family_settings: Record<string, unknown>;
  loads: number;
  parts_per_load: number;
  hours: number;
  tank_efficiency: number | null;
  template_id: string;
};

type OrderFacts = {
  id: string;
  total_cents: number;
  quoted_cost: unknown;
  quantity_received: number;
  bake_required: boolean;
  area_dm2: number;
  element: string;
  ion_charge: number;
  family: ProcessFamilyId;
  family_params: Record<string, unknown>;
  method: 'rack' | 'barrel';
  tank_volts: number;
  handling_minutes_per_load: number;
  masking_per_piece_cents: number;
  rate_set_id: string | null;
};

function runsOf(rows: CostRow[], o: OrderFacts): CostedRun[] {
  const family = getFamily(o.family);
  const params = familyParams(family.id, o.family_params);
  return rows.map((r) => ({
    ampHours: r.amp_hours,
    loads: r.loads,
    partsPerLoad: r.parts_per_load,
    hours: r.hours,
    tankEfficiency: r.tank_efficiency ?? 1,
    bathMetalGPerL: bathMetalGPerL(r.template_id, o.element),
    used: family.runCost(
      {
        areaDm2: r.loads * r.parts_per_load * o.area_dm2, ampHours: r.amp_hours, predictedThicknessUm: r.predicted_thickness_um, tankEfficiency: r.tank_efficiency,
        tank: { volumeL: r.volume_l, settings: r.family_settings }, finish: { element: o.element, ionCharge: o.ion_charge },
      },
      params,
    ),
  }));
}

function compare(o: OrderFacts, runs: CostRow[], rates: RateSet): CostComparison {
  const actual = actualCost(
    {
      element: o.element, ionCharge: o.ion_charge, method: o.method, tankVolts: o.tank_volts, handlingMinutesPerLoad: o.handling_minutes_per_load,
      maskingPerPieceCents: o.masking_per_piece_cents, areaPerPartDm2: o.area_dm2, quantityReceived: o.quantity_received,
      bakeApplies: o.bake_required,
      rectifierEfficiency: DEFAULT_RECTIFIER_EFFICIENCY, dragOutLPerM2: DEFAULT_DRAG_OUT_L_PER_M2[o.method],
    },
    runsOf(runs, o),
    ratesFromRow(rates),
  );
  const quoted = o.quoted_cost as Partial<LinePrice>;
  return compareCosts(o.total_cents, Array.isArray(quoted.components) ? (quoted as LinePrice) : null, actual);
}

function orderFacts(conn: Db) {
  return conn
    .selectFrom('work_orders as w')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .leftJoin('quote_lines as l', 'l.id', 'w.quote_line_id')
    .leftJoin('quotes as q', 'q.id', 'l.quote_id')
    .select([
      'w.id', 'w.total_cents', 'w.quoted_cost', 'w.quantity_received', 'w.bake_required', 'p.area_dm2', 'f.element', 'f.ion_charge', 'f.family', 'f.family_params', 'f.method',
      'f.tank_volts', 'f.handling_minutes_per_load', 'f.masking_per_piece_cents', 'q.rate_set_id',
    ]);
}

function costRows(conn: Db) {
  return conn
    .selectFrom('plating_runs as r')
    .innerJoin('tanks as t', 't.id', 'r.tank_id')
    .select([
      'r.work_order_id', sql<number>`coalesce(r.amp_hours, 0)`.as('amp_hours'), 'r.loads', 'r.parts_per_load', 'r.predicted_thickness_um', 't.efficiency as tank_efficiency', 't.template_id',
      't.volume_l', 't.family_settings',
      sql<number>`extract(epoch from (r.ended_at - r.started_at)) / 3600.0`.as('hours'),
    ]);
}

async function ratesById(conn: Db, ids: (string | null)[]): Promise<(id: string | null) => RateSet> {
  const wanted = [...new Set(ids.filter((x): x is string => x !== null))];
  const rows = wanted.length ? await conn.selectFrom('rate_sets').selectAll().where('id', 'in', wanted).execute() : [];
  const current = await rateSetInForce(conn);
  const map = new Map(rows.map((r) => [r.id, r]));
  return (id) => (id ? (map.get(id) ?? current) : current);
}

export async function getJobCost(workOrderId: string, conn: Db = defaultDb): Promise<CostComparison | null> {
  const o = await orderFacts(conn).where('w.id', '=', workOrderId).executeTakeFirst();
  if (!o) return null;
  const runs = await costRows(conn).where('r.work_order_id', '=', workOrderId).execute();
  const rates = await ratesById(conn, [o.rate_set_id]);
  return compare(o, runs, rates(o.rate_set_id));
}

export type VarianceRow = {
  workOrderId: string;
  number: string;
  customer: string;
  finish: string;
  month: string;
  comparison: CostComparison;
};

/** Every work order with runs that finished in the period, costed; grouping is left to the caller. */
export async function findCostedOrders(range: { from: string; to: string }, conn: Db = defaultDb): Promise<VarianceRow[]> {
  const orders = await orderFacts(conn)
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .select(['w.number', 'c.name as customer', 'f.code as finish'])
    .select(sql<string>`to_char((select max(ended_at) from plating_runs where work_order_id = w.id), 'YYYY-MM')`.as('month'))
    .where(sql<boolean>`exists (select 1 from plating_runs r where r.work_order_id = w.id and r.ended_at >= ${range.from}::date and r.ended_at < (${range.to}::date + 1))`)
    .where('w.state', 'in', ['plated', 'baked', 'inspected', 'shipped', 'invoiced'])
    .orderBy('w.number')
    .limit(5000)
    .execute();
  if (orders.length === 0) return [];
  const runs = await costRows(conn).where('r.work_order_id', 'in', orders.map((o) => o.id)).execute();
  const byOrder = new Map<string, CostRow[]>();
  for (const r of runs) byOrder.set(r.work_order_id, [...(byOrder.get(r.work_order_id) ?? []), r]);
  const rates = await ratesById(conn, orders.map((o) => o.rate_set_id));
  return orders.map((o) => ({
    workOrderId: o.id,
    number: o.number,
    customer: o.customer,
    finish: o.finish,
    month: o.month,
    comparison: compare(o, byOrder.get(o.id) ?? [], rates(o.rate_set_id)),
  }));
}
