'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { formAction } from '@/lib/action';
import { setupTankAnalytes } from '@/lib/bath/analytes';
import { updateAnalyteLimits } from '@/lib/bath/limits';
import { limitsSchema } from '@/lib/bath/schemas';
import { updateTankSettings } from '@/lib/bath/tank-settings';
import { displayUnit } from '@/lib/plating';

export const updateLimitsAction = formAction('bath.limits', limitsSchema.extend({ tankId: z.uuid() }), async (input, user) => {
  const { changed } = await updateAnalyteLimits(user, {
    analyteId: input.analyteId,
    target: input.target as number,
    lowerControl: input.lowerControl,
    upperControl: input.upperControl,
    lowerSpec: input.lowerSpec,
    upperSpec: input.upperSpec,
    frequencyHours: input.frequencyHours as number,
    reason: input.reason,
  });
  revalidatePath(`/baths/${input.tankId}`);
  return { ok: true, message: changed ? 'Limits saved; the change is kept in the history below.' : 'Nothing changed.' };
});

export const setupAnalytesAction = formAction('bath.limits', z.object({ tankId: z.uuid() }), async (input) => {
  const added = await setupTankAnalytes(input.tankId);
  revalidatePath(`/baths/${input.tankId}`);
  return { ok: true, message: added ? `${added} analytes set up from the bath template.` : 'The analytes were already set up.' };
});

const tankSettingsSchema = z.looseObject({
  tankId: z.uuid(),
  madeUpOn: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.iso.date({ error: 'Enter the make-up date as a date.' }).nullable()),
});

export const updateTankSettingsAction = formAction('bath.limits', tankSettingsSchema, async (input, user) => {
  await updateTankSettings(user, {
    tankId: input.tankId,
    form: input,
    madeUpOn: input.madeUpOn,
    units: { thickness: displayUnit('thickness', user.unitSystem), temperature: displayUnit('temperature', user.unitSystem) },
  });
  revalidatePath(`/baths/${input.tankId}`);
  return { ok: true, message: 'Process settings saved.' };
});
