// GET /api/portal/certificates/[certificateId] — a customer contact, for their own company's certificates only
import { AppError } from '@/lib/errors';
import { fileDownloadResponse } from '@/lib/files/download';
import { withPermission } from '@/lib/http';
import { certificatePdfFor } from '@/lib/quality/certificates';

export const dynamic = 'force-dynamic';

export const GET = withPermission<{ certificateId: string }>('portal.use', async (req, user, ctx) => {
  const { certificateId } = await ctx.params;
  // Scoped by the session's customer in the query: another customer's id reads as not found.
  const file = await certificatePdfFor(user, certificateId);
  if (!file) throw new AppError('NOT_FOUND', 'That certificate does not exist.');
  return fileDownloadResponse(file, new URL(req.url).searchParams.get('download') !== '1');
});
