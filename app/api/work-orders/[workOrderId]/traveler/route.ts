// GET /api/work-orders/:workOrderId/traveler — the printable traveler PDF with its QR code; staff with orders.read
import { contentDisposition } from '@/lib/grid/csv';
import { jsonError, withPermission } from '@/lib/http';
import { getWorkOrder } from '@/lib/orders/queries';
import { renderTravelerPdf } from '@/lib/orders/traveler-pdf';

const UUID = /^[0-9a-f-]{36}$/i;

export const GET = withPermission<{ workOrderId: string }>('orders.read', async (_req, user, { params }) => {
  const { workOrderId } = await params;
  const wo = UUID.test(workOrderId) ? await getWorkOrder(workOrderId) : null;
  if (!wo) return jsonError(404, 'NOT_FOUND', 'That work order does not exist.');
  const pdf = await renderTravelerPdf(wo, user.unitSystem);
  return new Response(new Uint8Array(pdf), {
    headers: { 'content-type': 'application/pdf', 'content-disposition': contentDisposition('inline', `traveler-${wo.number}.pdf`), 'cache-control': 'no-store' },
  });
});
