// GET /api/v1/parts — parts, a page at a time (office staff; a customer sees their own)
import { apiJson, apiRoute, parseQuery } from '@/lib/api/route';
import { listParts } from '@/lib/api/v1/resources';
import { pageOf, pageQuery, part } from '@/lib/api/v1/schemas';

export const dynamic = 'force-dynamic';

export const GET = apiRoute(['customers.read', 'portal.use'], async (req, user) => apiJson(pageOf(part, 'Part'), await listParts(user, parseQuery(req, pageQuery))));
