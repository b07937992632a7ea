// GET /api/quotes/:quoteId/pdf — the quotation PDF; office staff with quotes.read
import { contentDisposition } from '@/lib/grid/csv';
import { jsonError, withPermission } from '@/lib/http';
import { getQuote } from '@/lib/quotes/queries';
import { quotePdfFileName, renderQuotePdf } from '@/lib/quotes/quote-pdf';

const UUID = /^[0-9a-f-]{36}$/i;

export const GET = withPermission<{ quoteId: string }>('quotes.read', async (_req, _user, { params }) => {
  const { quoteId } = await params;
  const quote = UUID.test(quoteId) ? await getQuote(quoteId) : null;
  if (!quote) return jsonError(404, 'NOT_FOUND', 'That quote does not exist.');
  const pdf = await renderQuotePdf(quote);
  return new Response(new Uint8Array(pdf), {
    headers: { 'content-type': 'application/pdf', 'content-disposition': contentDisposition('inline', quotePdfFileName(quote)), 'cache-control': 'no-store' },
  });
});
