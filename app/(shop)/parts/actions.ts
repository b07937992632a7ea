'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { savePart } from '@/lib/parts/mutations';
import { partSchema } from '@/lib/parts/schemas';

export const savePartAction = formAction('customers.write', partSchema, async (input, actor) => {
  const { partId } = await savePart(actor, input);
  revalidatePath('/parts');
  revalidatePath(`/parts/${partId}`);
  if (input.partId === null) redirect(`/parts/${partId}?saved=1`);
  return { ok: true, message: 'Part saved.' };
});
