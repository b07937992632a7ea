import 'server-only';
// The supervisor's hand on the plan: put a job on a tank and day (it stays there), or give it back
// to the planner; and the owner's or supervisor's figures for what a tank can run.
import { type Kysely, sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertCan, type Actor } from '@/lib/quotes/access';
import { finishTanksOf, HORIZON_DAYS, PLANNED_STATES, shopToday } from './queries';
import { workingDays } from './plan';
import type { CapacityInput, PlacementInput } from './schemas';

type Db = Kysely<Database>;
type ScheduleActor = Pick<Actor, 'id' | 'role'>;

export async function placeJob(actor: ScheduleActor, input: PlacementInput, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'schedule.plan');
  const today = shopToday();
  if (!workingDays(today, HORIZON_DAYS).includes(input.day)) {
    throw new AppError('BAD_INPUT', 'Choose a working day from today on, within the plan.', { day: ['Choose a working day from today on, within the plan.'] });
  }
  await conn.transaction().execute(async (trx) => {
    const wo = await trx.selectFrom('work_orders').select(['id', 'number', 'state', 'finish_id']).where('id', '=', input.workOrderId).forUpdate().executeTakeFirst();
    if (!wo) throw new AppError('NOT_FOUND', 'That work order does not exist.');
    if (!(PLANNED_STATES as readonly string[]).includes(wo.state)) throw new AppError('CONFLICT', `Work order ${wo.number} has run; there is nothing left to plan.`);
    // Only the tanks and their finishes: placing one job reads no other order.
    const finishTanks = await finishTanksOf(trx);
    if (!(finishTanks.get(wo.finish_id) ?? []).includes(input.tankId)) {
      throw new AppError('BAD_INPUT', 'That tank does not run this job\u2019s finish. Choose a tank of the same finish.', { tankId: ['That tank does not run this job\u2019s finish.'] });
    }
    await trx
      .insertInto('schedule_placements')
      .values({ work_order_id: wo.id, tank_id: input.tankId, day: input.day, placed_by: actor.id })
      .onConflict((oc) => oc.column('work_order_id').doUpdateSet({ tank_id: input.tankId, day: input.day, placed_by: actor.id, placed_at: sql`now()` }))
      .execute();
  });
}

export async function unplaceJob(actor: ScheduleActor, workOrderId: string, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'schedule.plan');
  await conn.deleteFrom('schedule_placements').where('work_order_id', '=', workOrderId).execute();
}

export async function setTankCapacity(actor: ScheduleActor, input: CapacityInput, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'tanks.capacity');
  const res = await conn
    .updateTable('tanks')
    .set({ cycle_minutes: input.cycleMinutes, load_area_dm2: input.loadAreaDm2, shifts_per_day: input.shiftsPerDay, shift_hours: input.shiftHours })
    .where('id', '=', input.tankId)
    .executeTakeFirst();
  if (Number(res.numUpdatedRows) === 0) throw new AppError('NOT_FOUND', 'That tank does not exist.');
}
