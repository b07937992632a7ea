'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { formAction } from '@/lib/action';
import { savePassivationWindow } from '@/lib/families/passivation/windows-store';
import { displayUnit, toStorage } from '@/lib/plating';

const num = (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? Number(v.trim().replace(',', '.')) : Number.NaN);

// The window's figures arrive as flat fields (band0_minC …) in the user's temperature unit.
const windowFormSchema = z.looseObject({
  windowId: z.string().min(1),
  bandCount: z.coerce.number().int().min(1).max(6),
  source: z.string().default(''),
});

export const savePassivationWindowAction = formAction('bath.limits', windowFormSchema, async (input, user) => {
  const f = input as Record<string, unknown>;
  const unit = displayUnit('temperature', user.unitSystem);
  const temp = (v: unknown) => (Number.isFinite(num(v)) ? toStorage(num(v), unit) : Number.NaN);
  const w = await savePassivationWindow(user, {
    id: input.windowId,
    concentration: { min: num(f.concentrationMin), max: num(f.concentrationMax) },
    bands: Array.from({ length: input.bandCount }, (_, i) => ({ minC: temp(f[`band${i}_minC`]), maxC: temp(f[`band${i}_maxC`]), minMinutes: num(f[`band${i}_minMinutes`]) })),
    source: input.source,
  });
  revalidatePath('/settings/passivation');
  return { ok: true, message: `Saved. Quotes, runs and lot checks use these figures for ${w.id} from now on.` };
});
