'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { recordHullCellPanel } from '@/lib/bath/record';
import { hullCellSchema } from '@/lib/bath/schemas';
import { db } from '@/db';
import { FILE_KINDS } from '@/lib/files/sniff';
import { storeFile } from '@/lib/files/store';

export const recordHullCellAction = formAction('bath.log', hullCellSchema, async (input, user, formData) => {
  const photo = formData.get('photo');
  const result = await db.transaction().execute(async (trx) => {
    let fileId: string | null = null;
    if (photo instanceof File && photo.size > 0) {
      const stored = await storeFile(
        { name: photo.name, bytes: new Uint8Array(await photo.arrayBuffer()), declaredType: photo.type, allowed: FILE_KINDS.image, uploadedBy: user.id },
        trx,
      );
      fileId = stored.id;
    }
    return recordHullCellPanel(user, { key: input.key, tankId: input.tankId, currentA: input.currentA as number, minutes: input.minutes as number, notes: input.notes, fileId, madeAt: new Date() }, trx);
  });
  revalidatePath(`/baths/${input.tankId}`);
  return { ok: true, message: result.duplicate ? 'This panel was already saved.' : 'Hull cell panel saved.' };
});
