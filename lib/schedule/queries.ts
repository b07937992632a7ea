import 'server-only';
// Reads what the line's plan needs from the records (tanks with their capacity, the finishes they
// run, the open work orders with what is left to run, the supervisor's placements) and plans it.
// Only open orders are read, so the plan costs the same in a shop's tenth year as in its first.
import { type Kysely, sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { tanksForFinish } from '@/lib/quotes/process';
import { activeTankFacts } from '@/lib/quotes/pricing-context';
import { shopTimeZone, toLocalInputValue } from '@/lib/quality/shop-time';
import { loadsNeeded, loadsPerDay, planSchedule, turnaroundDays, workingDays, type Plan, type PlanJob, type PlanTank } from './plan';

type Db = Kysely<Database>;

/** States in which a work order still has loads to run. */
export const PLANNED_STATES = ['accepted', 'received', 'in_process'] as const;

/** How far ahead the plan looks, in working days (about two months). */
export const HORIZON_DAYS = 40;

export function shopToday(now: Date = new Date()): string {
  return toLocalInputValue(now, shopTimeZone()).slice(0, 10);
}

export type ScheduleTank = PlanTank & { name: string; cycleMinutes: number; loadAreaDm2: number | null; shiftsPerDay: number; shiftHours: number };
export type ScheduleJob = PlanJob & { customerName: string; partNumber: string; finishCode: string; pieces: number; state: string };

export type LineInput = { today: string; days: string[]; tanks: ScheduleTank[]; jobs: ScheduleJob[]; finishTanks: Map<string, string[]> };

async function loadTanksAndFinishes(conn: Db) {
  const [facts, capacity, finishes] = await Promise.all([
    activeTankFacts(conn),
    conn.selectFrom('tanks').select(['id', 'cycle_minutes', 'load_area_dm2', 'shifts_per_day', 'shift_hours']).where('is_active', '=', true).execute(),
    conn.selectFrom('finishes').select(['id', 'code', 'family', 'family_params', 'element', 'ion_charge', 'method', 'line_id', 'parts_per_load']).where('is_active', '=', true).execute(),
  ]);
  const cap = new Map(capacity.map((c) => [c.id, c]));
  const finishTanks = new Map<string, string[]>();
  for (const f of finishes) {
    const tanks = tanksForFinish({ family: f.family, familyParams: f.family_params, element: f.element, ionCharge: f.ion_charge, method: f.method, lineId: f.line_id }, facts);
    finishTanks.set(f.id, tanks.map((t) => t.id));
  }
  const tanks: ScheduleTank[] = facts
    .map((t) => {
      const c = cap.get(t.id)!;
      const finishIds = finishes.filter((f) => finishTanks.get(f.id)!.includes(t.id)).map((f) => f.id);
      return {
        id: t.id, code: t.code, name: t.name, finishIds,
        cycleMinutes: Number(c.cycle_minutes), loadAreaDm2: c.load_area_dm2 === null ? null : Number(c.load_area_dm2), shiftsPerDay: c.shifts_per_day, shiftHours: Number(c.shift_hours),
        loadsPerDay: loadsPerDay({ cycleMinutes: Number(c.cycle_minutes), shiftHours: Number(c.shift_hours), shiftsPerDay: c.shifts_per_day }),
      };
    })
    .filter((t) => t.finishIds.length > 0)
    .sort((a, b) => a.code.localeCompare(b.code));
  return { tanks, finishTanks, finishes };
}

/** For each active finish, the tanks that run it (preferred first). */
export async function finishTanksOf(conn: Db = defaultDb): Promise<Map<string, string[]>> {
  return (await loadTanksAndFinishes(conn)).finishTanks;
}

/** Everything the planner reads, for the working days from today on. */
export async function loadLineInput(conn: Db = defaultDb, opts: { today?: string; days?: number } = {}): Promise<LineInput> {
  const today = opts.today ?? shopToday();
  const days = workingDays(today, opts.days ?? HORIZON_DAYS);
  const { tanks, finishTanks, finishes } = await loadTanksAndFinishes(conn);
  const perLoad = new Map(finishes.map((f) => [f.id, f.parts_per_load]));
  const rows = await conn
    .selectFrom('work_orders as w')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .leftJoin('schedule_placements as sp', 'sp.work_order_id', 'w.id')
    .select([
      'w.id', 'w.number', 'w.finish_id', 'w.state', 'w.is_rush', 'w.quantity_ordered', 'w.quantity_received', 'c.name as customer_name', 'p.part_number', 'p.area_dm2', 'f.code as finish_code',
      sql<string | null>`to_char(w.due_date, 'YYYY-MM-DD')`.as('due'),
      sql<string | null>`to_char(sp.day, 'YYYY-MM-DD')`.as('placed_day'), 'sp.tank_id as placed_tank_id',
      sql<number>`coalesce((select sum(r.loads * r.parts_per_load) from plating_runs r where r.work_order_id = w.id), 0)`.as('pieces_run'),
    ])
    .where('w.state', 'in', PLANNED_STATES)
    .orderBy('w.number')
    .execute();
  const tankById = new Map(tanks.map((t) => [t.id, t]));
  const jobs: ScheduleJob[] = [];
  for (const w of rows) {
    const base = w.quantity_received > 0 ? w.quantity_received : w.quantity_ordered;
    const pieces = Math.max(0, base - Number(w.pieces_run));
    if (pieces === 0) continue;
    const firstTank = tankById.get(finishTanks.get(w.finish_id)?.[0] ?? '');
    jobs.push({
      id: w.id, number: w.number, finishId: w.finish_id, due: w.due, isRush: w.is_rush, state: w.state,
      loads: loadsNeeded(pieces, Number(w.area_dm2), perLoad.get(w.finish_id) ?? 0, firstTank?.loadAreaDm2 ?? null),
      placed: w.placed_day && w.placed_tank_id ? { tankId: w.placed_tank_id, day: w.placed_day } : null,
      customerName: w.customer_name, partNumber: w.part_number, finishCode: w.finish_code, pieces,
    });
  }
  return { today, days, tanks, jobs, finishTanks };
}

export async function planLine(conn: Db = defaultDb, opts: { today?: string; days?: number } = {}): Promise<{ input: LineInput; plan: Plan }> {
  const input = await loadLineInput(conn, opts);
  return { input, plan: planSchedule(input) };
}

/** One order's planned first and last day on the line (null once it has run, or when nothing plans it). */
export async function plannedDatesOf(workOrderIds: readonly string[], conn: Db = defaultDb): Promise<Map<string, { start: string | null; finish: string | null; isLate: boolean }>> {
  const out = new Map<string, { start: string | null; finish: string | null; isLate: boolean }>();
  if (workOrderIds.length === 0) return out;
  const { plan } = await planLine(conn);
  for (const id of workOrderIds) {
    const p = plan.jobs.get(id);
    if (p) out.set(id, { start: p.start, finish: p.finish, isLate: p.isLate });
  }
  return out;
}

/** The turnaround a quote line would get from today's load on the line, in working days. */
export async function quoteTurnaroundDays(lines: readonly { finishId: string; partAreaDm2: number; quantity: number; partsPerLoad: number }[], conn: Db = defaultDb): Promise<number | null> {
  if (lines.length === 0) return null;
  const input = await loadLineInput(conn);
  let worst: number | null = 0;
  for (const l of lines) {
    const tank = input.tanks.find((t) => t.id === input.finishTanks.get(l.finishId)?.[0]);
    const loads = loadsNeeded(l.quantity, l.partAreaDm2, l.partsPerLoad, tank?.loadAreaDm2 ?? null);
    const days = turnaroundDays(input, input.today, l.finishId, loads);
    if (days === null) return null;
    worst = Math.max(worst ?? 0, days);
  }
  return worst;
}
