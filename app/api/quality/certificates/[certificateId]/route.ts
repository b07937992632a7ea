// GET /api/quality/certificates/[certificateId] — staff with quality.read: the certificate's stored PDF, as issued
import { AppError } from '@/lib/errors';
import { fileDownloadResponse } from '@/lib/files/download';
import { withPermission } from '@/lib/http';
import { certificatePdfFor } from '@/lib/quality/certificates';

export const dynamic = 'force-dynamic';

export const GET = withPermission<{ certificateId: string }>('quality.read', async (req, user, ctx) => {
  const { certificateId } = await ctx.params;
  const file = await certificatePdfFor(user, certificateId);
  if (!file) throw new AppError('NOT_FOUND', 'That certificate does not exist.');
  return fileDownloadResponse(file, new URL(req.url).searchParams.get('download') !== '1');
});
