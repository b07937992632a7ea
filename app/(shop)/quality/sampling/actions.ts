'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { replaceSamplingPlan } from '@/lib/quality/sampling-plans';
import { samplingPlanSchema } from '@/lib/quality/schemas';

const whole = (v: unknown): number => (typeof v === 'number' ? v : typeof v === 'string' && /^\s*\d+\s*$/.test(v) ? Number(v) : NaN);

export const saveSamplingPlanAction = formAction('quality.disposition', samplingPlanSchema, async (input, user) => {
  // Blank "highest lot" means "and over"; everything else must be a whole number, which the plan's
  // own check reports row by row.
  const rows = input.rows.map((r) => ({
    minLot: whole(r.minLot),
    maxLot: r.maxLot === '' || r.maxLot === null || r.maxLot === undefined ? null : whole(r.maxLot),
    codeLetter: String(r.codeLetter ?? '').trim(),
    sampleSize: whole(r.sampleSize),
  }));
  await replaceSamplingPlan(user, { name: input.name, source: input.source, rows });
  revalidatePath('/quality/sampling');
  return { ok: true, message: 'Saved. The new table applies to every lot from now on; the earlier one stays on record.' };
});
