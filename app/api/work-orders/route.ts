// GET /api/work-orders — the work-order list for the grid (JSON page or CSV); staff with orders.read
import { gridResponse } from '@/lib/grid/server';
import { withPermission } from '@/lib/http';
import { WORK_ORDER_GRID, workOrderGridSelect } from '@/lib/orders/queries';

export const GET = withPermission('orders.read', (req) => gridResponse(req, workOrderGridSelect(), WORK_ORDER_GRID));
