// GET /api/v1/work-orders — work orders with their planned and actual dates (staff; a customer sees their own)
import { apiJson, apiRoute, parseQuery } from '@/lib/api/route';
import { listWorkOrders } from '@/lib/api/v1/resources';
import { pageOf, workOrder, workOrderListQuery } from '@/lib/api/v1/schemas';

export const dynamic = 'force-dynamic';

export const GET = apiRoute(['orders.read', 'portal.use'], async (req, user) => apiJson(pageOf(workOrder, 'WorkOrder'), await listWorkOrders(user, parseQuery(req, workOrderListQuery))));
