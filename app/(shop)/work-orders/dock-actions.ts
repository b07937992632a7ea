'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { formAction } from '@/lib/action';
import { recordCountMove } from '@/lib/dock/moves';
import { sendDiscrepancyNotice, sendShipmentNotice } from '@/lib/dock/notices';
import { receiveReworkReturn, recordReceipt } from '@/lib/dock/receiving';
import { countMoveSchema, receiptSchema, reworkReturnSchema, shipmentSchema } from '@/lib/dock/schemas';
import { createShipment } from '@/lib/dock/shipping';
import { inShop, MOVE_LABELS } from '@/lib/dock/counts';

const at = (id: string) => `/work-orders/${id}`;

export const receiveAction = formAction('dock.receive', receiptSchema, async (input, user) => {
  const saved = await recordReceipt(user, input);
  revalidatePath(at(input.workOrderId));
  if (saved.discrepancy === 'none') return { ok: true, message: `Receipt ${saved.number} saved: ${input.quantity.toLocaleString('en-US')} parts. Print its labels from the order.` };
  const notice = await sendDiscrepancyNotice(saved.id);
  return { ok: notice.ok, message: `Receipt ${saved.number} saved. ${notice.message}` };
});

export const reworkReturnAction = formAction('dock.receive', reworkReturnSchema, async (input, user) => {
  const saved = await receiveReworkReturn(user, input);
  revalidatePath(at(input.originalWorkOrderId));
  return { ok: true, message: `Returned parts received on rework order ${saved.workOrderNumber} (receipt ${saved.number}).` };
});

export const countMoveAction = formAction('orders.advance', countMoveSchema, async (input, user) => {
  const counts = await recordCountMove(user, input);
  revalidatePath(at(input.workOrderId));
  return { ok: true, message: `${MOVE_LABELS[input.kind]}: ${input.quantity.toLocaleString('en-US')} parts. ${inShop(counts).toLocaleString('en-US')} in the shop, ${counts.held.toLocaleString('en-US')} held.` };
});

export const shipAction = formAction('dock.ship', shipmentSchema, async (input, user) => {
  const saved = await createShipment(user, input);
  revalidatePath(at(input.workOrderId));
  const closing = saved.closed ? ' Every part is accounted for: the order is shipped.' : '';
  if (!input.emailCustomer) return { ok: true, message: `Shipment ${saved.number} recorded.${closing}` };
  const notice = await sendShipmentNotice(saved.id);
  return { ok: notice.ok, message: `Shipment ${saved.number} recorded.${closing} ${notice.message}` };
});

const ref = z.object({ id: z.uuid(), workOrderId: z.uuid() });

export const resendDiscrepancyAction = formAction('dock.receive', ref, async (input) => {
  const notice = await sendDiscrepancyNotice(input.id);
  revalidatePath(at(input.workOrderId));
  return { ok: notice.ok, message: notice.message };
});

export const resendShipmentAction = formAction('dock.ship', ref, async (input) => {
  const notice = await sendShipmentNotice(input.id);
  revalidatePath(at(input.workOrderId));
  return { ok: notice.ok, message: notice.message };
});
