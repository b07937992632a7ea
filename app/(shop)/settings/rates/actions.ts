'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { saveRateSet } from '@/lib/rates/mutations';
import { rateSetSchema } from '@/lib/rates/schemas';

export const saveRateSetAction = formAction('rates.manage', rateSetSchema, async (input, actor) => {
  const { rateSetId } = await saveRateSet(actor, input);
  revalidatePath('/settings/rates');
  if (input.rateSetId === null) redirect(`/settings/rates/${rateSetId}?saved=1`);
  revalidatePath(`/settings/rates/${rateSetId}`);
  return { ok: true, message: 'Rates saved.' };
});
