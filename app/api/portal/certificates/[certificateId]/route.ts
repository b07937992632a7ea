// GET /api/portal/certificates/[certificateId] — a customer contact, for their own company's certificates only
import { withPermission } from '@/lib/http';
import { certificatePdfResponse } from '@/lib/quality/certificate';

export const dynamic = 'force-dynamic';

// Scoped by the session's customer inside the query: another customer's id reads as not found.
export const GET = withPermission<{ certificateId: string }>('portal.use', async (req, user, ctx) =>
  certificatePdfResponse(req, user, (await ctx.params).certificateId),
);
