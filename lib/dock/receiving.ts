import 'server-only';
// Receiving at the dock: each delivery is a receipt on its work order (count, containers, weight,
// the customer's own part and lot numbers, condition and photos). The first receipt moves the
// order from "awaiting parts" to "received"; a discrepancy is e-mailed to the customer after the
// receipt is saved, so a mail outage never loses the count.
import { type Kysely, sql, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, Discrepancy } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertCan } from '@/lib/quotes/access';
import type { DockActor as Actor } from './actor';
import { nextDocumentNumber } from '@/lib/quotes/numbering';
import { changeWorkOrderState } from '@/lib/orders/states';
import { applyCount, countsOf } from './counts';
import type { ReceiptInput, ReworkReturnInput } from './schemas';

type Db = Kysely<Database>;
type Trx = Transaction<Database>;

/** Orders still open to parts arriving: before any plating run closes the count. */
export const RECEIVABLE_STATES = ['accepted', 'received', 'in_process'] as const;

export type ReceiptFields = {
  quantity: number;
  containers: number;
  weightKg?: number;
  customerPartNumber?: string;
  customerLot?: string;
  conditionNote?: string;
  discrepancy?: Discrepancy;
  discrepancyNote?: string;
  photoIds?: readonly string[];
  isReturn?: boolean;
};

export type SavedReceipt = { id: string; number: string; workOrderId: string; discrepancy: Discrepancy };

async function lockForReceiving(trx: Trx, workOrderId: string) {
  const wo = await trx
    .selectFrom('work_orders')
    .select(['id', 'number', 'state', 'customer_id', 'quantity_received', 'quantity_shipped', 'quantity_scrapped', 'quantity_held'])
    .where('id', '=', workOrderId)
    .forUpdate()
    .executeTakeFirst();
  if (!wo) throw new AppError('NOT_FOUND', 'That work order does not exist.');
  if (!(RECEIVABLE_STATES as readonly string[]).includes(wo.state)) {
    throw new AppError('CONFLICT', `Work order ${wo.number} is past receiving (its runs are logged); parts that arrive now belong on a new order or a rework return.`);
  }
  return wo;
}

async function attachPhotos(trx: Trx, actor: Actor, receiptId: string, photoIds: readonly string[]): Promise<void> {
  const ids = [...new Set(photoIds)];
  if (!ids.length) return;
  const files = await trx
    .selectFrom('files')
    .leftJoin('receipt_photos as rp', 'rp.file_id', 'files.id')
    .select(['files.id', 'files.content_type', 'files.uploaded_by', 'rp.receipt_id'])
    .where('files.id', 'in', ids)
    .execute();
  for (const id of ids) {
    const f = files.find((x) => x.id === id);
    if (!f || f.uploaded_by !== actor.id) throw new AppError('BAD_INPUT', 'A photo was not found among your uploads; upload it again.', { photoIds: ['Upload the photo again.'] });
    if (!f.content_type.startsWith('image/')) throw new AppError('BAD_INPUT', 'Only photos (PNG, JPEG, GIF or WebP) can be attached to a receipt.', { photoIds: ['Attach images only.'] });
    if (f.receipt_id) throw new AppError('CONFLICT', 'A photo is already attached to another receipt.', { photoIds: ['Upload the photo again.'] });
  }
  await trx.insertInto('receipt_photos').values(ids.map((file_id) => ({ receipt_id: receiptId, file_id }))).execute();
}

/** Saves one receipt inside `trx`: the order's received count grows and the first one marks it received. */
export async function insertReceipt(trx: Trx, actor: Actor, workOrderId: string, f: ReceiptFields, at: Date = new Date()): Promise<SavedReceipt> {
  const wo = await lockForReceiving(trx, workOrderId);
  const next = applyCount(countsOf(wo), { kind: 'receive', quantity: f.quantity });
  if (!next.ok) throw new AppError('BAD_INPUT', next.reason, { quantity: [next.reason] });
  const number = await nextDocumentNumber(trx, 'receipt', at);
  const discrepancy = f.discrepancy ?? 'none';
  const row = await trx
    .insertInto('receipts')
    .values({
      number,
      work_order_id: wo.id,
      customer_id: wo.customer_id,
      received_at: at,
      received_by: actor.id,
      quantity: f.quantity,
      containers: f.containers,
      weight_kg: f.weightKg ?? null,
      customer_part_number: f.customerPartNumber ?? '',
      customer_lot: f.customerLot ?? '',
      condition_note: f.conditionNote ?? '',
      discrepancy,
      discrepancy_note: discrepancy === 'none' ? '' : (f.discrepancyNote ?? ''),
      is_return: f.isReturn ?? false,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await attachPhotos(trx, actor, row.id, f.photoIds ?? []);
  await trx
    .updateTable('work_orders')
    .set({ quantity_received: next.counts.received, updated_at: sql`now()` })
    .where('id', '=', wo.id)
    .execute();
  if (wo.state === 'accepted') {
    await changeWorkOrderState(trx, { workOrderId: wo.id, to: 'received', actorId: actor.id, note: `Receipt ${number}: ${f.quantity.toLocaleString('en-US')} parts in ${f.containers} container${f.containers === 1 ? '' : 's'}` });
  } else {
    await trx
      .insertInto('work_order_events')
      .values({ work_order_id: wo.id, from_state: wo.state, to_state: wo.state, actor_id: actor.id, note: `Receipt ${number}: ${f.quantity.toLocaleString('en-US')} more parts` })
      .execute();
  }
  await trx
    .insertInto('audit_log')
    .values({ actor_id: actor.id, action: 'dock.receipt', entity: 'work_order', entity_id: wo.id, detail: JSON.stringify({ receipt: number, quantity: f.quantity, discrepancy }) })
    .execute();
  return { id: row.id, number, workOrderId: wo.id, discrepancy };
}

/** A receipt from the receiving form; the discrepancy notice is sent by the caller after commit. */
export async function recordReceipt(actor: Actor, input: ReceiptInput, conn: Db = defaultDb, at: Date = new Date()): Promise<SavedReceipt> {
  assertCan(actor, 'dock.receive');
  return conn.transaction().execute((trx) => insertReceipt(trx, actor, input.workOrderId, input, at));
}

/**
 * Parts sent back for rework: a new work order (no charge) linked to the original lot and, when
 * given, to the nonconformance, received at once through its own receipt.
 */
export async function receiveReworkReturn(
  actor: Actor,
  input: ReworkReturnInput,
  conn: Db = defaultDb,
  at: Date = new Date(),
): Promise<SavedReceipt & { workOrderNumber: string }> {
  assertCan(actor, 'dock.receive');
  return conn.transaction().execute(async (trx) => {
    const original = await trx
      .selectFrom('work_orders')
      .select(['id', 'number', 'customer_id', 'part_id', 'finish_id', 'bake_required', 'pricing_basis', 'quantity_shipped', 'state', 'due_date'])
      .where('id', '=', input.originalWorkOrderId)
      .forUpdate()
      .executeTakeFirst();
    if (!original) throw new AppError('NOT_FOUND', 'That work order does not exist.');
    if (original.quantity_shipped === 0) throw new AppError('CONFLICT', `Nothing has shipped on ${original.number} yet, so nothing can come back from it.`);
    const returned = await trx
      .selectFrom('work_orders')
      .select(sql<number>`coalesce(sum(quantity_ordered), 0)::int`.as('n'))
      .where('rework_of_id', '=', original.id)
      .executeTakeFirstOrThrow();
    if (returned.n + input.quantity > original.quantity_shipped) {
      const left = original.quantity_shipped - returned.n;
      const msg = `Only ${left.toLocaleString('en-US')} of the ${original.quantity_shipped.toLocaleString('en-US')} parts shipped on ${original.number} can still come back.`;
      throw new AppError('BAD_INPUT', msg, { quantity: [msg] });
    }
    if (input.nonconformanceId) {
      const nc = await trx.selectFrom('nonconformances').select('id').where('id', '=', input.nonconformanceId).where('work_order_id', '=', original.id).executeTakeFirst();
      if (!nc) throw new AppError('BAD_INPUT', `That nonconformance is not one of ${original.number}.`, { nonconformanceId: ['Choose one from the list.'] });
    }
    const number = await nextDocumentNumber(trx, 'work_order', at);
    const due = new Date(at.getTime() + 5 * 86_400_000).toISOString().slice(0, 10);
    const wo = await trx
      .insertInto('work_orders')
      .values({
        number,
        customer_id: original.customer_id,
        part_id: original.part_id,
        finish_id: original.finish_id,
        po_number: input.poNumber,
        due_date: due,
        quantity_ordered: input.quantity,
        bake_required: original.bake_required,
        unit_price_cents: 0,
        pricing_basis: original.pricing_basis,
        total_cents: 0,
        rework_of_id: original.id,
        rework_nonconformance_id: input.nonconformanceId ?? null,
      })
      .returning(['id', 'number'])
      .executeTakeFirstOrThrow();
    await trx
      .insertInto('work_order_events')
      .values({ work_order_id: wo.id, from_state: null, to_state: 'accepted', actor_id: actor.id, note: `Rework of ${original.number}: ${input.reason}` })
      .execute();
    const receipt = await insertReceipt(
      trx,
      actor,
      wo.id,
      { quantity: input.quantity, containers: input.containers, weightKg: input.weightKg, customerLot: input.customerLot, conditionNote: [input.reason, input.conditionNote].filter(Boolean).join(' · '), isReturn: true },
      at,
    );
    return { ...receipt, workOrderNumber: wo.number };
  });
}
