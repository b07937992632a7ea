// GET /api/customers — office staff (customers.read): the customer list as grid pages or CSV
import { CUSTOMER_GRID_COLUMNS, customerGridQuery } from '@/lib/customers/grid';
import { gridResponse } from '@/lib/grid/server';
import { withPermission } from '@/lib/http';

export const dynamic = 'force-dynamic';

export const GET = withPermission('customers.read', (req) =>
  gridResponse(req, customerGridQuery(), {
    columns: CUSTOMER_GRID_COLUMNS,
    key: 'c.id',
    defaultSort: { colId: 'name', dir: 'asc' },
    fileName: 'customers',
  }),
);
