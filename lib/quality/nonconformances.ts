import 'server-only';
// Nonconformances: a failed lot's record, open until a supervisor dispositions it. Invoicing leaves
// out orders with an open one (hasOpenNonconformance / openNonconformanceExists below).
import { type Expression, type Kysely, type SqlBool, type Transaction, sql } from 'kysely';
import { db as appDb } from '@/db';
import type { Database } from '@/db/types';
import type { Disposition, NonconformanceSource } from '@/db/types/quality';
import { AppError } from '@/lib/errors';
import { type Actor, audit, lockOrder, requireActor } from './access';
import { DISPOSITION_LABELS, DISPOSITIONS_LIST } from './lot-types';


export async function openNonconformance(
  actor: Actor,
  input: { workOrderId: string; source: NonconformanceSource; description: string },
): Promise<string> {
  requireActor(actor, 'quality.record', 'You are not allowed to open a nonconformance.');
  const description = input.description?.trim() ?? '';
  if (description.length < 3 || description.length > 2000) {
    throw new AppError('BAD_INPUT', 'Describe what does not conform.', { description: ['Describe what does not conform (3 to 2000 characters).'] });
  }
  return appDb.transaction().execute(async (trx) => {
    const order = await lockOrder(trx, input.workOrderId);
    if (order.state === 'invoiced') throw new AppError('CONFLICT', 'This order is already invoiced.');
    const row = await trx
      .insertInto('nonconformances')
      .values({ work_order_id: order.id, source: input.source, description, opened_by: actor.id })
      .returning('id')
      .executeTakeFirstOrThrow();
    await audit(trx, actor, 'quality.nonconformance.open', 'work_order', order.id, { nonconformanceId: row.id, source: input.source });
    return row.id;
  });
}

export type DispositionInput = { nonconformanceId: string; disposition: Disposition; customerApprovalRef?: string | null; note?: string | null };

// Rework and strip-and-replate make the lot's earlier readings obsolete: they are voided (kept on
// record) so the lot is measured again.
const REMEASURE: ReadonlySet<Disposition> = new Set(['rework', 'strip_and_replate']);

export async function dispositionNonconformance(actor: Actor, input: DispositionInput, now: Date = new Date()): Promise<void> {
  requireActor(actor, 'quality.disposition', 'Only a supervisor may disposition a nonconformance.');
  if (!DISPOSITIONS_LIST.includes(input.disposition)) throw new AppError('BAD_INPUT', 'Choose a disposition.', { disposition: ['Choose a disposition.'] });
  const ref = input.customerApprovalRef?.trim() || null;
  if (input.disposition === 'use_as_is' && !ref) {
    throw new AppError('BAD_INPUT', "Use as is needs the customer's approval reference.", { customerApprovalRef: ["Enter the customer's approval reference."] });
  }
  if (ref && ref.length > 120) throw new AppError('BAD_INPUT', 'The approval reference is limited to 120 characters.', { customerApprovalRef: ['At most 120 characters.'] });
  const note = input.note?.trim() || null;
  if (note && note.length > 2000) throw new AppError('BAD_INPUT', 'The note is limited to 2000 characters.', { note: ['At most 2000 characters.'] });
  await appDb.transaction().execute(async (trx) => {
    const nc = /^[0-9a-f-]{36}$/i.test(input.nonconformanceId)
      ? await trx.selectFrom('nonconformances').select(['id', 'work_order_id', 'disposition']).where('id', '=', input.nonconformanceId).executeTakeFirst()
      : undefined;
    if (!nc) throw new AppError('NOT_FOUND', 'That nonconformance does not exist.');
    const order = await lockOrder(trx, nc.work_order_id);
    if (nc.disposition) throw new AppError('CONFLICT', 'That nonconformance is already dispositioned and closed.');
    await trx
      .updateTable('nonconformances')
      .set({
        disposition: input.disposition,
        customer_approval_ref: ref,
        disposition_note: note,
        dispositioned_by: actor.id,
        dispositioned_at: now,
        closed_at: now,
      })
      .where('id', '=', nc.id)
      .execute();
    let voided = 0;
    if (REMEASURE.has(input.disposition)) {
      const r = await trx
        .updateTable('thickness_readings')
        .set({ voided_at: now, voided_by: actor.id, void_reason: `Superseded: ${DISPOSITION_LABELS[input.disposition].toLowerCase()} after a nonconformance.` })
        .where('work_order_id', '=', order.id)
        .where('voided_at', 'is', null)
        .executeTakeFirst();
      voided = Number(r.numUpdatedRows);
    }
    await audit(trx, actor, 'quality.nonconformance.disposition', 'work_order', order.id, {
      nonconformanceId: nc.id,
      disposition: input.disposition,
      customerApprovalRef: ref,
      voidedReadings: voided,
    });
  });
}

/** For invoicing: whether the order has a nonconformance still awaiting disposition. */
export async function hasOpenNonconformance(workOrderId: string, db: Kysely<Database> | Transaction<Database> = appDb): Promise<boolean> {
  const row = await db
    .selectFrom('nonconformances')
    .select('id')
    .where('work_order_id', '=', workOrderId)
    .where('disposition', 'is', null)
    .executeTakeFirst();
  return row !== undefined;
}

/** A WHERE condition for queries over work orders: `.where(({ not }) => not(openNonconformanceExists(sql.ref('work_orders.id'))))`. */
export function openNonconformanceExists(workOrderId: Expression<unknown>) {
  return sql<SqlBool>`exists (select 1 from nonconformances nc where nc.work_order_id = ${workOrderId} and nc.disposition is null)`;
}
