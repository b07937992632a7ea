// GET /api/v1/certificates — certificates of conformance (staff; a customer sees their own)
import { apiJson, apiRoute, parseQuery } from '@/lib/api/route';
import { listCertificates } from '@/lib/api/v1/resources';
import { certificate, pageOf, pageQuery } from '@/lib/api/v1/schemas';

export const dynamic = 'force-dynamic';

export const GET = apiRoute(['quality.read', 'portal.use'], async (req, user) => apiJson(pageOf(certificate, 'Certificate'), await listCertificates(user, parseQuery(req, pageQuery))));
