'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { saveFinish } from '@/lib/finishes/mutations';
import { finishSchema } from '@/lib/finishes/schemas';

export const saveFinishAction = formAction('quotes.write', finishSchema, async (input, actor) => {
  const { finishId } = await saveFinish(actor, input);
  revalidatePath('/finishes');
  if (input.finishId === null) redirect(`/finishes/${finishId}`);
  revalidatePath(`/finishes/${finishId}`);
  return { ok: true, message: 'Finish saved.' };
});
