import 'server-only';
// Scrap and hold: parts taken out of the shop's count with a reason, each move a ledger row.
import { type Kysely, sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertCan } from '@/lib/quotes/access';
import type { DockActor as Actor } from './actor';
import { applyCount, countsOf, type Counts } from './counts';
import type { CountMoveInput } from './schemas';

const CLOSED = new Set(['shipped', 'invoiced']);

export async function recordCountMove(actor: Actor, input: CountMoveInput, conn: Kysely<Database> = defaultDb): Promise<Counts> {
  assertCan(actor, 'orders.advance');
  return conn.transaction().execute(async (trx) => {
    const wo = await trx
      .selectFrom('work_orders')
      .select(['id', 'number', 'state', 'quantity_received', 'quantity_shipped', 'quantity_scrapped', 'quantity_held'])
      .where('id', '=', input.workOrderId)
      .forUpdate()
      .executeTakeFirst();
    if (!wo) throw new AppError('NOT_FOUND', 'That work order does not exist.');
    if (CLOSED.has(wo.state)) throw new AppError('CONFLICT', `Work order ${wo.number} is closed; its counts are final.`);
    const next = applyCount(countsOf(wo), { kind: input.kind, quantity: input.quantity });
    if (!next.ok) throw new AppError('BAD_INPUT', next.reason, { quantity: [next.reason] });
    await trx.insertInto('count_moves').values({ work_order_id: wo.id, kind: input.kind, quantity: input.quantity, reason: input.reason, actor_id: actor.id }).execute();
    await trx
      .updateTable('work_orders')
      .set({ quantity_scrapped: next.counts.scrapped, quantity_held: next.counts.held, updated_at: sql`now()` })
      .where('id', '=', wo.id)
      .execute();
    return next.counts;
  });
}
