import 'server-only';
// Recording an embrittlement-relief bake at the oven, and a supervisor's disposition of a bake
// that failed. Times arrive as the shop's wall-clock times and are stored as instants, so the
// window is real elapsed time across midnight and daylight-saving changes.
import type { Kysely } from 'kysely';
import { db } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { getFileInfo } from '@/lib/files/store';
import { type Actor, audit, lockOrder, requireActor } from '../access';
import { judgeBake } from '.';
import { lotBake } from '../lot-checks';
import { loadLot } from '../lot';
import { shopTimeZone, zonedLocalToInstant } from '../shop-time';

export type BakeInput = {
  workOrderId: string;
  /** Local wall-clock time ("2026-11-01T00:30") in `timeZone`, or an ISO instant with offset. */
  platingEnded: string;
  bakeStarted: string;
  oven: string;
  tempMinC: number;
  tempMaxC: number;
  durationH: number;
  chartFileId?: string | null;
  notes?: string;
  /** Defaults to the shop's zone. */
  timeZone?: string;
};

export type BakeResult = { id: string; verdict: 'pass' | 'fail'; deadline: Date; messages: string[] };

const BAKE_STATES = new Set(['in_process', 'plated']);
// A clock a few minutes fast on a phone should not refuse an honest entry.
const FUTURE_SLACK_MS = 10 * 60_000;

export async function recordBake(actor: Actor, input: BakeInput, now: Date = new Date(), database: Kysely<Database> = db): Promise<BakeResult> {
  requireActor(actor, 'quality.record', 'You are not allowed to record a bake.');
  const tz = input.timeZone ?? shopTimeZone();
  const platingEnd = zonedLocalToInstant(input.platingEnded, tz, 'platingEnded', 'Plating end');
  const bakeStart = zonedLocalToInstant(input.bakeStarted, tz, 'bakeStarted', 'Bake start');
  const oven = input.oven?.trim() ?? '';
  if (!oven || oven.length > 60) throw new AppError('BAD_INPUT', 'Name the oven.', { oven: ['Name the oven (up to 60 characters).'] });
  if (platingEnd.getTime() > now.getTime() + FUTURE_SLACK_MS) throw new AppError('BAD_INPUT', 'The plating end is in the future.', { platingEnded: ['The plating end is in the future.'] });
  if (bakeStart.getTime() > now.getTime() + FUTURE_SLACK_MS) throw new AppError('BAD_INPUT', 'The bake start is in the future.', { bakeStarted: ['The bake start is in the future.'] });
  const notes = (input.notes ?? '').trim();
  if (notes.length > 1000) throw new AppError('BAD_INPUT', 'Notes are limited to 1000 characters.', { notes: ['At most 1000 characters.'] });

  return database.transaction().execute(async (trx) => {
    const order = await lockOrder(trx, input.workOrderId);
    if (!BAKE_STATES.has(order.state)) {
      throw new AppError('CONFLICT', `A bake is recorded after plating and before the order is marked baked; this order is ${order.state.replace('_', ' ')}.`);
    }
    const lot = (await loadLot(trx, order.id))!;
    const req = lotBake(lot);
    if (!req.required) throw new AppError('CONFLICT', 'This order does not require an embrittlement-relief bake.');
    const firstStart = lot.runs[0]?.startedAt;
    if (firstStart && platingEnd < firstStart) {
      throw new AppError('BAD_INPUT', 'The plating end is before the first plating run started.', { platingEnded: ['Before the first run started.'] });
    }
    if (input.chartFileId && !(await getFileInfo(input.chartFileId, trx))) {
      throw new AppError('BAD_INPUT', 'The oven chart upload was not found; upload it again.', { chart: ['Upload the chart again.'] });
    }
    const verdict = judgeBake({ platingEnd, bakeStart, tempC: { min: input.tempMinC, max: input.tempMaxC }, durationH: input.durationH, requirement: req });
    const reasons = verdict.ok ? [] : verdict.reasons.map((r) => ({ code: r.code, message: r.message }));
    const row = await trx
      .insertInto('bake_records')
      .values({
        work_order_id: order.id,
        plating_ended_at: platingEnd,
        oven,
        bake_started_at: bakeStart,
        temp_min_c: input.tempMinC,
        temp_max_c: input.tempMaxC,
        duration_h: input.durationH,
        chart_file_id: input.chartFileId || null,
        required_min_hours: req.minHours,
        required_min_temp_c: req.minTempC,
        required_max_temp_c: req.maxTempC,
        window_hours: req.windowHours,
        deadline_at: verdict.deadline,
        verdict: verdict.ok ? 'pass' : 'fail',
        reasons: JSON.stringify(reasons),
        notes,
        recorded_by: actor.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await audit(trx, actor, 'quality.bake.record', 'work_order', order.id, { bakeId: row.id, verdict: verdict.ok ? 'pass' : 'fail', reasons: reasons.map((r) => r.code) });
    return { id: row.id, verdict: verdict.ok ? 'pass' : 'fail', deadline: verdict.deadline, messages: reasons.map((r) => r.message) };
  });
}

/** A supervisor accepts a failed bake with a reason (e.g. the customer's written concession). */
export async function dispositionBake(actor: Actor, input: { bakeId: string; reason: string }): Promise<void> {
  requireActor(actor, 'quality.disposition', "Only a supervisor may record a disposition for a bake that failed.");
  const reason = input.reason?.trim() ?? '';
  if (reason.length < 3) throw new AppError('BAD_INPUT', 'Give the reason for the disposition.', { reason: ['Give the reason for the disposition.'] });
  if (reason.length > 1000) throw new AppError('BAD_INPUT', 'The reason is limited to 1000 characters.', { reason: ['At most 1000 characters.'] });
  await db.transaction().execute(async (trx) => {
    const bake = /^[0-9a-f-]{36}$/i.test(input.bakeId)
      ? await trx.selectFrom('bake_records').select(['id', 'work_order_id', 'verdict', 'disposition_at', 'recorded_at']).where('id', '=', input.bakeId).executeTakeFirst()
      : undefined;
    if (!bake) throw new AppError('NOT_FOUND', 'That bake record does not exist.');
    const order = await lockOrder(trx, bake.work_order_id);
    if (bake.verdict === 'pass') throw new AppError('CONFLICT', 'That bake passed; no disposition is needed.');
    if (bake.disposition_at) throw new AppError('CONFLICT', 'That bake already has a disposition.');
    const later = await trx
      .selectFrom('bake_records')
      .select('id')
      .where('work_order_id', '=', order.id)
      .where('id', '<>', bake.id)
      // Compared in the database: a JS Date drops the microseconds PostgreSQL keeps.
      .where('recorded_at', '>=', (eb) => eb.selectFrom('bake_records as me').select('me.recorded_at').where('me.id', '=', bake.id))
      .executeTakeFirst();
    if (later) throw new AppError('CONFLICT', 'A later bake was recorded for this order; that record is the one that counts.');
    await trx
      .updateTable('bake_records')
      .set({ disposition_reason: reason, disposition_by: actor.id, disposition_at: new Date() })
      .where('id', '=', bake.id)
      .execute();
    await audit(trx, actor, 'quality.bake.disposition', 'work_order', order.id, { bakeId: bake.id, reason });
  });
}
