// GET /api/work-orders — the work-order list for the grid (JSON page or CSV); staff with orders.read
import { gridResponse } from '@/lib/grid/server';
import { withPermission } from '@/lib/http';
import { WORK_ORDER_GRID_COLUMNS, workOrderGridSelect, workOrderSearch } from '@/lib/orders/queries';

export const GET = withPermission('orders.read', (req) =>
  gridResponse(req, workOrderGridSelect(), {
    columns: WORK_ORDER_GRID_COLUMNS,
    // Work-order numbers are unique, so the number itself keeps pages stable on its own index.
    key: 'w.number',
    defaultSort: { colId: 'number', dir: 'desc' },
    fileName: 'work-orders',
    search: workOrderSearch,
  }),
);
