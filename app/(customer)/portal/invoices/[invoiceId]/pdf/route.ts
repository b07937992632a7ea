// GET /portal/invoices/:invoiceId/pdf — a signed-in customer contact, for their own company's invoices only.
import { getPortalInvoice } from '@/lib/billing/portal';
import { invoicePdfResponse } from '@/lib/billing/pdf/render';
import { AppError } from '@/lib/errors';
import { withPermission } from '@/lib/http';

export const GET = withPermission<{ invoiceId: string }>('portal.use', async (_req, user, ctx) => {
  const { invoiceId } = await ctx.params;
  const detail = await getPortalInvoice(user, invoiceId);
  if (!detail) throw new AppError('NOT_FOUND', 'That invoice was not found.');
  return invoicePdfResponse(detail);
});
