// POST /api/imports/[kind] — staff who may edit customers (customers.write): import customers or parts from a CSV body
import { withPermission } from '@/lib/http';
import { receiveImport } from '@/lib/imports/kinds';

export const dynamic = 'force-dynamic';

export const POST = withPermission<{ kind: string }>('customers.write', async (req, user, ctx) => receiveImport(req, user, (await ctx.params).kind));
