// GET /api/portal/quotes/:quoteId/pdf — the quotation PDF for a customer contact, own company only
import { contentDisposition } from '@/lib/grid/csv';
import { jsonError, withPermission } from '@/lib/http';
import { getPortalQuote } from '@/lib/quotes/queries';
import { quotePdfFileName, renderQuotePdf } from '@/lib/quotes/quote-pdf';

const UUID = /^[0-9a-f-]{36}$/i;

export const GET = withPermission<{ quoteId: string }>('portal.use', async (_req, user, { params }) => {
  const { quoteId } = await params;
  // Scoped by the contact's own company in the WHERE: another company's id answers 404.
  const quote = UUID.test(quoteId) && user.customerId ? await getPortalQuote(user.customerId, quoteId) : null;
  if (!quote) return jsonError(404, 'NOT_FOUND', 'That quote does not exist.');
  const pdf = await renderQuotePdf(quote);
  return new Response(new Uint8Array(pdf), {
    headers: { 'content-type': 'application/pdf', 'content-disposition': contentDisposition('inline', quotePdfFileName(quote)), 'cache-control': 'no-store' },
  });
});
