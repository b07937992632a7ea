// POST /api/floor/entries — platers, supervisors and owners (bath.log): one analysis, addition or
// meter reading from the floor, sent at once or later from the device's offline queue. A resend
// with the same key stores nothing and answers 200 with the original.
import { after, NextResponse } from 'next/server';
import { notifyNewAlerts, submitFloorEntry } from '@/lib/bath/floor-entries';
import { floorEntrySchema } from '@/lib/bath/schemas';
import { readJson, withPermission } from '@/lib/http';

export const dynamic = 'force-dynamic';

export const POST = withPermission('bath.log', async (req, user) => {
  const entry = floorEntrySchema.parse(await readJson(req));
  const answer = await submitFloorEntry(user, entry);
  if (answer.newAlertIds.length > 0) after(() => notifyNewAlerts(answer.newAlertIds));
  return NextResponse.json(answer, { status: answer.duplicate ? 200 : 201 });
});
