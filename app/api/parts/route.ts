// GET /api/parts — office staff (customers.read): the part list as grid pages or CSV; ?customerId= narrows it to one customer
import { AppError } from '@/lib/errors';
import { isUuid } from '@/lib/files/store';
import { gridResponse } from '@/lib/grid/server';
import { withPermission } from '@/lib/http';
import { partGridColumns, partGridQuery } from '@/lib/parts/grid';

export const dynamic = 'force-dynamic';

export const GET = withPermission('customers.read', (req, user) => {
  const customerId = new URL(req.url).searchParams.get('customerId');
  if (customerId !== null && !isUuid(customerId)) throw new AppError('BAD_INPUT', 'customerId must be a customer id.');
  return gridResponse(req, partGridQuery(user.unitSystem, customerId), {
    columns: partGridColumns(user.unitSystem),
    key: 'p.id',
    defaultSort: { colId: 'partNumber', dir: 'asc' },
    fileName: 'parts',
  });
});
