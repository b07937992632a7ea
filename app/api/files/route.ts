// POST /api/files?purpose=… — staff allowed to upload for that purpose (see lib/files/upload.ts)
import { NextResponse } from 'next/server';
import { receiveUpload } from '@/lib/files/upload';
import { withPermission } from '@/lib/http';

export const dynamic = 'force-dynamic';

export const POST = withPermission('staff.area', async (req, user) => {
  const answer = await receiveUpload(req, user);
  return NextResponse.json(answer, { status: 201 });
});
