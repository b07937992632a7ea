// GET /api/receipts/:receiptId/labels — one 4 × 6 in label per container, with a QR code; staff with orders.read
import { db } from '@/db';
import { renderReceiptLabels } from '@/lib/dock/labels-pdf';
import { contentDisposition } from '@/lib/grid/csv';
import { jsonError, withPermission } from '@/lib/http';

const UUID = /^[0-9a-f-]{36}$/i;

export const GET = withPermission<{ receiptId: string }>('orders.read', async (_req, _user, { params }) => {
  const { receiptId } = await params;
  const r = UUID.test(receiptId)
    ? await db
        .selectFrom('receipts as r')
        .innerJoin('work_orders as w', 'w.id', 'r.work_order_id')
        .innerJoin('customers as c', 'c.id', 'r.customer_id')
        .innerJoin('parts as p', 'p.id', 'w.part_id')
        .innerJoin('finishes as f', 'f.id', 'w.finish_id')
        .select(['r.number', 'r.quantity', 'r.containers', 'r.customer_lot', 'r.received_at', 'w.id as work_order_id', 'w.number as wo_number', 'w.po_number', 'w.due_date', 'c.name', 'p.part_number', 'f.code'])
        .where('r.id', '=', receiptId)
        .executeTakeFirst()
    : undefined;
  if (!r) return jsonError(404, 'NOT_FOUND', 'That receipt does not exist.');
  const pdf = await renderReceiptLabels({
    receiptNumber: r.number, workOrderId: r.work_order_id, workOrderNumber: r.wo_number, customerName: r.name, poNumber: r.po_number, partNumber: r.part_number,
    finishCode: r.code, customerLot: r.customer_lot, quantity: r.quantity, containers: r.containers, receivedAt: r.received_at, dueDate: r.due_date,
  });
  return new Response(new Uint8Array(pdf), {
    headers: { 'content-type': 'application/pdf', 'content-disposition': contentDisposition('inline', `labels-${r.number}.pdf`), 'cache-control': 'no-store' },
  });
});
