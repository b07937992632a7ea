import 'server-only';
// Shipping: each shipment carries part of an inspected order's parts with its own packing slip
// (stored when made, never re-rendered). The shipment that accounts for the last part in the shop
// closes the order as shipped; the e-mail with the slip and certificate goes after commit.
import { type Kysely, sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { storeFile } from '@/lib/files/store';
import { getWorkOrder } from '@/lib/orders/queries';
import { changeWorkOrderState } from '@/lib/orders/states';
import { assertCan } from '@/lib/quotes/access';
import type { DockActor as Actor } from './actor';
import { nextDocumentNumber } from '@/lib/quotes/numbering';
import { shopTimeZone } from '@/lib/quality/shop-time';
import { getShopSettings } from '@/lib/users/queries';
import { applyCount, countsOf, inShop, isBalanced } from './counts';
import { renderPackingSlipPdf, type PackingSlipData } from './packing-slip-pdf';
import type { ShipmentInput } from './schemas';

type Db = Kysely<Database>;

export type SavedShipment = { id: string; number: string; workOrderId: string; closed: boolean; slipFileId: string; certificateId: string | null };

export function packingSlipFilename(number: string): string {
  return `packing-slip-${number}.pdf`;
}

export async function createShipment(actor: Actor, input: Omit<ShipmentInput, 'emailCustomer'>, conn: Db = defaultDb, at: Date = new Date()): Promise<SavedShipment> {
  assertCan(actor, 'dock.ship');
  return conn.transaction().execute(async (trx) => {
    const locked = await trx
      .selectFrom('work_orders')
      .select(['id', 'number', 'state', 'quantity_received', 'quantity_shipped', 'quantity_scrapped', 'quantity_held'])
      .where('id', '=', input.workOrderId)
      .forUpdate()
      .executeTakeFirst();
    if (!locked) throw new AppError('NOT_FOUND', 'That work order does not exist.');
    if (locked.state !== 'inspected') {
      throw new AppError(
        'CONFLICT',
        locked.state === 'shipped' || locked.state === 'invoiced'
          ? `Work order ${locked.number} has shipped all its parts.`
          : `Work order ${locked.number} ships after inspection; it is not inspected yet.`,
      );
    }
    const before = countsOf(locked);
    const next = applyCount(before, { kind: 'ship', quantity: input.quantity });
    if (!next.ok) throw new AppError('BAD_INPUT', next.reason, { quantity: [next.reason] });
    const wo = (await getWorkOrder(locked.id, trx))!;
    const [receipts, certificate, shop] = await Promise.all([
      trx.selectFrom('receipts').select(['customer_part_number', 'customer_lot']).where('work_order_id', '=', wo.id).orderBy('received_at').execute(),
      trx.selectFrom('certificates').select(['id', 'number']).where('work_order_id', '=', wo.id).executeTakeFirst(),
      getShopSettings(),
    ]);
    const number = await nextDocumentNumber(trx, 'shipment', at);
    const distinct = (xs: string[]) => [...new Set(xs.map((x) => x.trim()).filter(Boolean))];
    const slip: PackingSlipData = {
      shop,
      number,
      shippedAt: at.toISOString(),
      timeZone: shopTimeZone(),
      customer: { name: wo.customer_name, code: wo.customer_code, shipTo: wo.shipping_address },
      poNumber: wo.po_number,
      workOrderNumber: wo.number,
      part: { number: wo.part_number, revision: wo.part_revision, description: wo.part_description },
      customerPartNumbers: distinct(receipts.map((r) => r.customer_part_number)),
      customerLots: distinct(receipts.map((r) => r.customer_lot)),
      finish: { code: wo.finish_code, name: wo.finish_name, spec: wo.spec_text },
      certificateNumber: certificate?.number ?? null,
      quantity: input.quantity,
      containers: input.containers,
      weightKg: input.weightKg ?? null,
      counts: { received: before.received, shippedBefore: before.shipped, scrapped: before.scrapped, held: before.held, remaining: inShop(next.counts) },
      carrier: input.carrier,
      trackingNumber: input.trackingNumber,
      isRework: wo.rework_of_id !== null,
    };
    const pdf = await renderPackingSlipPdf(slip);
    const file = await storeFile({ name: packingSlipFilename(number), bytes: pdf, declaredType: 'application/pdf', allowed: ['pdf'], uploadedBy: actor.id }, trx);
    const row = await trx
      .insertInto('shipments')
      .values({
        number,
        work_order_id: wo.id,
        customer_id: wo.customer_id,
        shipped_at: at,
        shipped_by: actor.id,
        quantity: input.quantity,
        containers: input.containers,
        weight_kg: input.weightKg ?? null,
        carrier: input.carrier,
        tracking_number: input.trackingNumber,
        ship_to: wo.shipping_address,
        certificate_id: certificate?.id ?? null,
        slip_file_id: file.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await trx.updateTable('work_orders').set({ quantity_shipped: next.counts.shipped, updated_at: sql`now()` }).where('id', '=', wo.id).execute();
    const closed = isBalanced(next.counts);
    const note = `Shipment ${number}: ${input.quantity.toLocaleString('en-US')} parts by ${input.carrier}${input.trackingNumber ? ` (${input.trackingNumber})` : ''}`;
    if (closed) {
      await changeWorkOrderState(trx, { workOrderId: wo.id, to: 'shipped', actorId: actor.id, note });
    } else {
      await trx.insertInto('work_order_events').values({ work_order_id: wo.id, from_state: wo.state, to_state: wo.state, actor_id: actor.id, note: `${note}; ${inShop(next.counts).toLocaleString('en-US')} still here` }).execute();
    }
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actor.id, action: 'dock.shipment', entity: 'work_order', entity_id: wo.id, detail: JSON.stringify({ shipment: number, quantity: input.quantity, closed }) })
      .execute();
    return { id: row.id, number, workOrderId: wo.id, closed, slipFileId: file.id, certificateId: certificate?.id ?? null };
  });
}
