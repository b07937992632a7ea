// POST /api/portal/invoices/:invoiceId/checkout — a signed-in customer contact, for their own company's invoices only.
import { NextResponse } from 'next/server';
import { startInvoiceCheckout } from '@/lib/billing/checkout';
import { withPermission } from '@/lib/http';

// No amount is read from the request: the open balance comes from the database.
export const POST = withPermission<{ invoiceId: string }>('portal.use', async (_req, user, ctx) => {
  const { invoiceId } = await ctx.params;
  const { url } = await startInvoiceCheckout(user, invoiceId);
  return NextResponse.json({ url }, { status: 201 });
});
