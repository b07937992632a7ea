// GET /api/v1/certificates/{certificateId}/pdf — the signed certificate's PDF (scoped as the list)
import { apiRoute } from '@/lib/api/route';
import { certificatePdfResponse } from '@/lib/quality/certificate';

export const dynamic = 'force-dynamic';

// Scoped inside the query by the caller's own customer: another customer's id reads as not found.
export const GET = apiRoute<{ certificateId: string }>(['quality.read', 'portal.use'], async (req, user, ctx) =>
  certificatePdfResponse(req, user, (await ctx.params).certificateId),
);
