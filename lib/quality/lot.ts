// Loads one lot's quality record (work order, part, finish, runs, readings, bakes,
// nonconformances, the active sampling plan, the certificate) for the pure rules.
// Takes the database as an argument and imports neither '@/db' nor 'server-only', like
// lib/orders/states.ts, whose guards call it: a module that imports the state labels stays light.
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '@/db/types';
import type { LotRecord, LotSamplingPlan } from './lot-types';
import { loadFamilyData } from '@/lib/families/shop-data';
import { Z14_LEVEL_II } from './sampling';

type Db = Kysely<Database> | Transaction<Database>;

export const Z14_PLAN_NAME = 'ANSI/ASQ Z1.4 general inspection level II';
export const Z14_SOURCE = 'ANSI/ASQ Z1.4-2008, Table I (general inspection level II) and Table II-A (sample sizes)';

export async function getActiveSamplingPlan(db: Db): Promise<LotSamplingPlan> {
  const plan = await db.selectFrom('sampling_plans').select(['id', 'name', 'source']).where('is_active', '=', true).executeTakeFirst();
  if (!plan) return { id: null, name: Z14_PLAN_NAME, source: Z14_SOURCE, rows: [...Z14_LEVEL_II] };
  const rows = await db
    .selectFrom('sampling_plan_rows')
    .select(['min_lot', 'max_lot', 'code_letter', 'sample_size'])
    .where('plan_id', '=', plan.id)
    .orderBy('position')
    .execute();
  return {
    ...plan,
    rows: rows.map((r) => ({ minLot: r.min_lot, maxLot: r.max_lot, codeLetter: r.code_letter, sampleSize: r.sample_size })),
  };
}

const userName = (db: Db, column: string) =>
  db.selectFrom('users').select('users.name').whereRef('users.id', '=', column as never).limit(1);

export async function loadLot(db: Db, workOrderId: string): Promise<LotRecord | null> {
  if (!/^[0-9a-f-]{36}$/i.test(workOrderId)) return null;
  const o = await db
    .selectFrom('work_orders as w')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .select([
      'w.id', 'w.number', 'w.state', 'w.po_number', 'w.quantity_ordered', 'w.quantity_received', 'w.quantity_shipped', 'w.bake_required',
      'w.customer_id', 'c.name as customer_name', 'c.code as customer_code',
      'p.part_number', 'p.revision', 'p.description', 'p.substrate', 'p.tensile_mpa', 'p.hardness_hrc', 'p.area_dm2', 'p.corrosivity_category',
      'f.family', 'f.family_params',
      'f.code as finish_code', 'f.name as finish_name', 'f.spec_text', 'f.element', 'f.ion_charge', 'f.min_thickness_um', 'f.max_thickness_um',
      'f.bake_required as finish_bake_required', 'f.bake_threshold_hrc', 'f.bake_window_hours', 'f.bake_temp_c', 'f.bake_hours',
    ])
    .where('w.id', '=', workOrderId)
    .executeTakeFirst();
  if (!o) return null;

  const [runs, readings, voided, bakes, ncs, samplingPlan, cert, records] = await Promise.all([
    db
      .selectFrom('plating_runs as r')
      .innerJoin('tanks as t', 't.id', 'r.tank_id')
      .select(['r.id', 'r.tank_id', 't.code', 't.name', 't.element', 'r.started_at', 'r.ended_at', 'r.amp_hours', 'r.conditions', 'r.loads', 'r.parts_per_load', 'r.predicted_thickness_um'])
      .where('r.work_order_id', '=', workOrderId)
      .orderBy('r.ended_at')
      .execute(),
    db
      .selectFrom('thickness_readings as tr')
      .select(['tr.id', 'tr.part_no', 'tr.location', 'tr.method', 'tr.thickness_um', 'tr.minimum_um', 'tr.maximum_um', 'tr.status', 'tr.entry', 'tr.recorded_at'])
      .select((eb) => userName(eb as never, 'tr.recorded_by').as('recorded_by_name'))
      .where('tr.work_order_id', '=', workOrderId)
      .where('tr.voided_at', 'is', null)
      .orderBy('tr.part_no')
      .orderBy('tr.recorded_at')
      .execute(),
    db
      .selectFrom('thickness_readings')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .where('work_order_id', '=', workOrderId)
      .where('voided_at', 'is not', null)
      .executeTakeFirstOrThrow(),
    db
      .selectFrom('bake_records as b')
      .selectAll('b')
      .select((eb) => [userName(eb as never, 'b.recorded_by').as('recorded_by_name'), userName(eb as never, 'b.disposition_by').as('disposition_by_name')])
      .where('b.work_order_id', '=', workOrderId)
      .orderBy('b.recorded_at')
      .execute(),
    db
      .selectFrom('nonconformances as n')
      .selectAll('n')
      .select((eb) => [userName(eb as never, 'n.opened_by').as('opened_by_name'), userName(eb as never, 'n.dispositioned_by').as('dispositioned_by_name')])
      .where('n.work_order_id', '=', workOrderId)
      .orderBy('n.opened_at')
      .execute(),
    getActiveSamplingPlan(db),
    db.selectFrom('certificates').select(['id', 'number', 'signed_at', 'signed_by_name']).where('work_order_id', '=', workOrderId).executeTakeFirst(),
    db
      .selectFrom('process_records as pr')
      .select(['pr.id', 'pr.kind', 'pr.method', 'pr.values', 'pr.verdict', 'pr.reasons', 'pr.notes', 'pr.recorded_at'])
      .select((eb) => userName(eb as never, 'pr.recorded_by').as('recorded_by_name'))
      .where('pr.work_order_id', '=', workOrderId)
      .where('pr.voided_at', 'is', null)
      .orderBy('pr.recorded_at')
      .execute(),
  ]);

  return {
    familyData: await loadFamilyData(db, o.family),
    order: {
      id: o.id, number: o.number, state: o.state, poNumber: o.po_number, quantityOrdered: o.quantity_ordered, quantityReceived: o.quantity_received,
      quantityShipped: o.quantity_shipped, bakeRequired: o.bake_required, customerId: o.customer_id, customerName: o.customer_name, customerCode: o.customer_code,
    },
    part: {
      partNumber: o.part_number, revision: o.revision, description: o.description, substrate: o.substrate,
      tensileMpa: o.tensile_mpa, hardnessHrc: o.hardness_hrc, areaDm2: o.area_dm2, corrosivityCategory: o.corrosivity_category,
    },
    finish: {
      family: o.family, familyParams: o.family_params,
      code: o.finish_code, name: o.finish_name, specText: o.spec_text, element: o.element, ionCharge: o.ion_charge,
      minThicknessUm: o.min_thickness_um, maxThicknessUm: o.max_thickness_um, bakeRequired: o.finish_bake_required,
      bakeThresholdHrc: o.bake_threshold_hrc, bakeWindowHours: o.bake_window_hours, bakeTempC: o.bake_temp_c, bakeHours: o.bake_hours,
    },
    runs: runs.map((r) => ({
      id: r.id, tankId: r.tank_id, tankCode: r.code, tankName: r.name, tankElement: r.element, startedAt: r.started_at, endedAt: r.ended_at,
      ampHours: r.amp_hours, conditions: r.conditions, loads: r.loads, partsPerLoad: r.parts_per_load, predictedThicknessUm: r.predicted_thickness_um,
    })),
    readings: readings.map((r) => ({
      id: r.id, partNo: r.part_no, location: r.location, method: r.method, thicknessUm: r.thickness_um, minimumUm: r.minimum_um,
      maximumUm: r.maximum_um, status: r.status, entry: r.entry, recordedAt: r.recorded_at, recordedByName: r.recorded_by_name ?? null,
    })),
    voidedReadingCount: Number(voided.n),
    bakes: bakes.map((b) => ({
      id: b.id, platingEndedAt: b.plating_ended_at, oven: b.oven, bakeStartedAt: b.bake_started_at, tempMinC: b.temp_min_c, tempMaxC: b.temp_max_c,
      durationH: b.duration_h, hasChart: b.chart_file_id !== null, chartFileId: b.chart_file_id, requiredMinHours: b.required_min_hours,
      requiredMinTempC: b.required_min_temp_c, requiredMaxTempC: b.required_max_temp_c, windowHours: b.window_hours, deadlineAt: b.deadline_at,
      verdict: b.verdict, reasons: b.reasons, notes: b.notes, recordedAt: b.recorded_at, recordedByName: b.recorded_by_name ?? null,
      dispositionReason: b.disposition_reason, dispositionAt: b.disposition_at, dispositionByName: b.disposition_by_name ?? null,
    })),
    nonconformances: ncs.map((n) => ({
      id: n.id, source: n.source, description: n.description, openedAt: n.opened_at, openedByName: n.opened_by_name ?? null,
      disposition: n.disposition, customerApprovalRef: n.customer_approval_ref, dispositionNote: n.disposition_note,
      dispositionedAt: n.dispositioned_at, dispositionedByName: n.dispositioned_by_name ?? null, closedAt: n.closed_at,
    })),
    samplingPlan,
    processRecords: records.map((r) => ({
      id: r.id, kind: r.kind, method: r.method, values: r.values, verdict: r.verdict, reasons: r.reasons, notes: r.notes, recordedAt: r.recorded_at,
      recordedByName: r.recorded_by_name ?? null,
    })),
    certificate: cert ? { id: cert.id, number: cert.number, signedAt: cert.signed_at, signedByName: cert.signed_by_name } : null,
  };
}
