'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { acknowledgeAlert } from '@/lib/bath/alerts';
import { acknowledgeSchema } from '@/lib/bath/schemas';
import { updateBathSettings } from '@/lib/bath/settings';
import { z } from 'zod';

export const acknowledgeAlertAction = formAction('alerts.ack', acknowledgeSchema, async (input, user) => {
  await acknowledgeAlert(user, input);
  revalidatePath('/baths', 'layout');
  return { ok: true, message: 'Acknowledged.' };
});

const hoursText = z.string().trim().regex(/^\d+(\.\d+)?$/, 'Give a number of hours, e.g. 4.').transform(Number);

export const updateBathSettingsAction = formAction(
  'settings.manage',
  z.object({ escalateAfterHours: hoursText, additionGraceHours: hoursText, overdueGraceHours: hoursText }),
  async (input, user) => {
    await updateBathSettings(user, input);
    revalidatePath('/baths/alerts');
    return { ok: true, message: 'Alert settings saved.' };
  },
);
