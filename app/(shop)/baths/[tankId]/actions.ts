'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { formAction } from '@/lib/action';
import { setupTankAnalytes } from '@/lib/bath/analytes';
import { updateAnalyteLimits } from '@/lib/bath/limits';
import { limitsSchema } from '@/lib/bath/schemas';

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
