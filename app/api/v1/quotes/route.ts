// GET /api/v1/quotes — quotes, newest number first (office staff; a customer sees their own, never drafts)
import { apiJson, apiRoute, parseQuery } from '@/lib/api/route';
import { listQuotes } from '@/lib/api/v1/resources';
import { pageOf, quote, quoteListQuery } from '@/lib/api/v1/schemas';

export const dynamic = 'force-dynamic';

export const GET = apiRoute(['quotes.read', 'portal.use'], async (req, user) => apiJson(pageOf(quote, 'Quote'), await listQuotes(user, parseQuery(req, quoteListQuery))));
