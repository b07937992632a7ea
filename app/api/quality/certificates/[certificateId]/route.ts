// GET /api/quality/certificates/[certificateId] — staff with quality.read: the certificate's stored PDF, as issued
import { withPermission } from '@/lib/http';
import { certificatePdfResponse } from '@/lib/quality/certificate';

export const dynamic = 'force-dynamic';

export const GET = withPermission<{ certificateId: string }>('quality.read', async (req, user, ctx) =>
  certificatePdfResponse(req, user, (await ctx.params).certificateId),
);
