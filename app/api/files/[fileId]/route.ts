// GET /api/files/[fileId] — staff who may read a record the file is attached to (or who uploaded it); a customer contact only for files on its own records
import { readFileFor } from '@/lib/files/access';
import { fileDownloadResponse } from '@/lib/files/download';
import { AppError } from '@/lib/errors';
import { withPermission } from '@/lib/http';

export const dynamic = 'force-dynamic';

export const GET = withPermission<{ fileId: string }>('account.self', async (req, user, ctx) => {
  const { fileId } = await ctx.params;
  const file = await readFileFor(user, fileId);
  // The same answer for "no such file" and "not yours", so ids cannot be probed.
  if (!file) throw new AppError('NOT_FOUND', 'That file does not exist or you may not see it.');
  return fileDownloadResponse(file, new URL(req.url).searchParams.get('inline') === '1');
});
