import 'server-only';
import { sql, type Kysely } from 'kysely';
import { z } from 'zod';
import { db as defaultDb } from '@/db';
import type { Database, WorkOrderState } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertCan, type Actor } from '@/lib/quotes/access';
import { insertReceipt } from '@/lib/dock/receiving';
import { changeWorkOrderState, WORK_ORDER_STATES } from './states';

type Db = Kysely<Database>;

const count = (label: string) =>
  z.preprocess(
    (v) => (v === '' || v === undefined || v === null ? undefined : v),
    z.coerce.number({ error: `Enter ${label}.` }).int(`Enter a whole number of ${label}.`).min(1, `Enter at least 1.`).max(100_000_000).optional(),
  );

export const advanceSchema = z.object({
  workOrderId: z.uuid(),
  to: z.enum(WORK_ORDER_STATES as [WorkOrderState, ...WorkOrderState[]], { error: 'Choose the next step.' }),
  quantityReceived: count('parts received'),
  note: z.string().trim().max(500, 'Use at most 500 characters.').default(''),
});
export type AdvanceInput = z.infer<typeof advanceSchema>;

/** Moves a work order one step on; the state machine refuses skipped steps with the reason. */
export async function advanceWorkOrder(actor: Actor, input: AdvanceInput, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'orders.advance');
  await conn.transaction().execute(async (trx) => {
    // Parts arrive through a receipt; this short form (a count alone) is the dock's quickest one.
    if (input.to === 'received' && input.quantityReceived !== undefined) {
      const wo = await trx.selectFrom('work_orders').select('state').where('id', '=', input.workOrderId).executeTakeFirst();
      if (wo?.state === 'accepted') {
        await insertReceipt(trx, actor, input.workOrderId, { quantity: input.quantityReceived, containers: 1, conditionNote: input.note });
        return;
      }
    }
    await changeWorkOrderState(trx, { workOrderId: input.workOrderId, to: input.to, actorId: actor.id, note: input.note });
  });
}

export const dueDateSchema = z.object({
  workOrderId: z.uuid(),
  dueDate: z.iso.date({ error: 'Enter a date as YYYY-MM-DD.' }),
});

/** The office that promised the date may move it; the change is kept in the audit log. */
export async function setDueDate(actor: Actor, input: z.infer<typeof dueDateSchema>, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'quotes.write');
  await conn.transaction().execute(async (trx) => {
    const wo = await trx.selectFrom('work_orders').select(['id', 'due_date', 'state']).where('id', '=', input.workOrderId).forUpdate().executeTakeFirst();
    if (!wo) throw new AppError('NOT_FOUND', 'That work order does not exist.');
    if (wo.state === 'shipped' || wo.state === 'invoiced') throw new AppError('CONFLICT', 'This order has shipped; its due date is history now.');
    await trx.updateTable('work_orders').set({ due_date: input.dueDate, updated_at: sql`now()` }).where('id', '=', wo.id).execute();
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actor.id, action: 'work_order.due_date', entity: 'work_order', entity_id: wo.id, detail: JSON.stringify({ from: wo.due_date, to: input.dueDate }) })
      .execute();
  });
}
