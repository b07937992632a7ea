// GET /api/v1/invoices — invoices with what is open and any credit on account (owner; a customer sees their own)
import { apiJson, apiRoute, parseQuery } from '@/lib/api/route';
import { listInvoices } from '@/lib/api/v1/resources';
import { invoice, pageOf, pageQuery } from '@/lib/api/v1/schemas';

export const dynamic = 'force-dynamic';

export const GET = apiRoute(['invoices.read', 'portal.use'], async (req, user) => apiJson(pageOf(invoice, 'Invoice'), await listInvoices(user, parseQuery(req, pageQuery))));
