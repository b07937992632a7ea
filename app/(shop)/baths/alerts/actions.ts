'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { acknowledgeAlert } from '@/lib/bath/alerts';
import { acknowledgeSchema } from '@/lib/bath/schemas';

export const acknowledgeAlertAction = formAction('alerts.ack', acknowledgeSchema, async (input, user) => {
  await acknowledgeAlert(user, input);
  revalidatePath('/baths', 'layout');
  return { ok: true, message: 'Acknowledged.' };
});
