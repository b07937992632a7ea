// GET /api/v1/shipments — shipments, carrier and tracking (staff; a customer sees their own)
import { apiJson, apiRoute, parseQuery } from '@/lib/api/route';
import { listShipments } from '@/lib/api/v1/resources';
import { pageOf, pageQuery, shipment } from '@/lib/api/v1/schemas';

export const dynamic = 'force-dynamic';

export const GET = apiRoute(['orders.read', 'portal.use'], async (req, user) => apiJson(pageOf(shipment, 'Shipment'), await listShipments(user, parseQuery(req, pageQuery))));
