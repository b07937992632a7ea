// GET /api/portal/invoices/:invoiceId — a signed-in customer contact, for their own company's invoices only.
import { portalInvoiceJson } from '@/lib/billing/portal';
import { AppError } from '@/lib/errors';
import { withPermission } from '@/lib/http';
import { conditionalJson } from '@/lib/http-etag';

export const GET = withPermission<{ invoiceId: string }>('portal.use', async (req, user, ctx) => {
  const { invoiceId } = await ctx.params;
  const invoice = await portalInvoiceJson(user, invoiceId);
  if (!invoice) throw new AppError('NOT_FOUND', 'That invoice was not found.');
  return conditionalJson(req, { invoice });
});
