// GET /api/imports/[kind]/template — staff who may edit customers (customers.write): the import template CSV
import { withPermission } from '@/lib/http';
import { templateResponse } from '@/lib/imports/kinds';

export const dynamic = 'force-dynamic';

export const GET = withPermission<{ kind: string }>('customers.write', async (_req, _user, ctx) => templateResponse((await ctx.params).kind));
