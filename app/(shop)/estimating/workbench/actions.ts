'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { saveCalculation } from '@/lib/estimating/mutations';
import { saveCalculationSchema } from '@/lib/estimating/schemas';

// The browser's figures are not sent: saveCalculation recomputes them from the input.
export const saveCalculationAction = formAction('plating.estimate', saveCalculationSchema, async (input, actor) => {
  await saveCalculation(actor, { title: input.title, input: input.input });
  revalidatePath('/estimating/workbench');
  return { ok: true, message: `Saved “${input.title}”. It is at the top of the recent calculations.` };
});
