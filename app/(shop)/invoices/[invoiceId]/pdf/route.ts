// GET /invoices/:invoiceId/pdf — staff who may read invoices (owner).
import { invoicePdfResponse } from '@/lib/billing/pdf/render';
import { getInvoiceDetail } from '@/lib/billing/queries';
import { AppError } from '@/lib/errors';
import { withPermission } from '@/lib/http';

export const GET = withPermission<{ invoiceId: string }>('invoices.read', async (_req, _user, ctx) => {
  const { invoiceId } = await ctx.params;
  const detail = await getInvoiceDetail('staff', invoiceId);
  if (!detail) throw new AppError('NOT_FOUND', 'That invoice does not exist.');
  return invoicePdfResponse(detail);
});
