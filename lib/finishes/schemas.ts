// Form input for finish specifications; quantities arrive in the unit the user chose and leave in
// the stored unit (µm, A/dm², °C, fraction), converted by lib/plating/units.ts.
import { z } from 'zod';
import { dollarsSchema } from '@/lib/quotes/schemas';
import { PLATING_METALS, toStorage, unitsOf, type UnitOf } from '@/lib/plating';
import { checkbox, numberField, optionalNumberField, optionalText, requiredText } from '@/lib/records/fields';
import type { ProcessFamilyId } from '@/db/types';
import { FAMILY_IDS, getFamily } from '@/lib/families';
import { readFamilyFields } from '@/lib/families/form';
import { routeFromText } from './hazards';

const unitEnum = <Q extends 'thickness' | 'currentDensity' | 'temperature'>(q: Q, what: string) =>
  z.enum(unitsOf(q) as [UnitOf<Q>, ...UnitOf<Q>[]], { error: `Choose a unit of ${what}.` });

const optionalUuid = z.preprocess((v) => (v === '' || v === undefined ? null : v), z.uuid({ error: 'Choose a line.' }).nullable());

/** A family's own form fields (fp_<name>), converted to storage units and checked by its schema. */
function familyParamsFrom(v: Record<string, unknown>, thickness: UnitOf<'thickness'>, temperature: UnitOf<'temperature'>) {
  const family = getFamily(v.family as ProcessFamilyId);
  return { family, parsed: family.paramsSchema.safeParse(readFamilyFields(family.form, v, 'fp_', { thickness, temperature })) };
}

export const finishSchema = z
  .looseObject({
    family: z.enum(FAMILY_IDS, { error: 'Choose the process family.' }).default('electroplating'),
    finishId: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.uuid().nullable()),
    code: z
      .string({ error: 'Enter a code.' })
      .trim()
      .toUpperCase()
      .regex(/^[A-Z0-9-]{2,24}$/, 'Use 2–24 capital letters, digits or dashes, e.g. ZN-B633-SC2.'),
    name: requiredText('a name', 200),
    specText: optionalText(300),
    route: z
      .string()
      .default('')
      .transform(routeFromText)
      .refine((r) => r.length > 0, 'List at least one process step.')
      .refine((r) => r.length <= 30, 'Use at most 30 steps.')
      .refine((r) => r.every((s) => s.step.length <= 120 && (s.note ?? '').length <= 200), 'Keep each step under 120 characters and each note under 200.'),
    metal: z.string().optional(),
    minThickness: optionalNumberField('the minimum thickness', { positive: true }),
    maxThickness: optionalNumberField('the maximum thickness', { positive: true }),
    thicknessUnit: unitEnum('thickness', 'thickness'),
    method: z.enum(['rack', 'barrel'], { error: 'Choose rack or barrel.' }),
    currentDensity: optionalNumberField('the current density', { positive: true }),
    currentDensityUnit: unitEnum('currentDensity', 'current density'),
    efficiencyPercent: optionalNumberField('the cathode efficiency', { positive: true, max: 100 }),
    distributionRatio: numberField('the distribution ratio', { positive: true, max: 1 }),
    tankVolts: numberField('the tank voltage', { positive: true, max: 50 }),
    partsPerLoad: numberField('the parts per load', { integer: true, min: 1, max: 10_000_000 }),
    handlingMinutesPerLoad: numberField('the handling minutes per load', { min: 0, max: 10_000 }),
    maskingPerPiece: z.preprocess((v) => (v === '' || v === undefined ? '0' : v), dollarsSchema),
    bakeRequired: checkbox,
    bakeThresholdHrc: optionalNumberField('the bake threshold hardness', { positive: true, max: 79 }),
    bakeWindowHours: numberField('the bake start window', { positive: true, max: 48 }),
    bakeTemp: optionalNumberField('the bake temperature'),
    temperatureUnit: unitEnum('temperature', 'temperature'),
    bakeHours: optionalNumberField('the bake time', { positive: true, max: 48 }),
    lineId: optionalUuid,
    isActive: checkbox,
  })
  // `when`: run these checks even when other fields failed, so every message shows at once.
  .superRefine((v, ctx) => {
    const family = getFamily(v.family);
    if (!family.metal && !PLATING_METALS.some((m) => m.key === v.metal)) ctx.addIssue({ code: 'custom', path: ['metal'], message: 'Choose the metal.' });
    if (family.makesCoating && v.minThickness === null) ctx.addIssue({ code: 'custom', path: ['minThickness'], message: 'Enter the minimum thickness.' });
    if (family.usesCurrentDensity && v.currentDensity === null) ctx.addIssue({ code: 'custom', path: ['currentDensity'], message: 'Enter the current density.' });
    if (family.usesEfficiency && v.efficiencyPercent === null) ctx.addIssue({ code: 'custom', path: ['efficiencyPercent'], message: 'Enter the cathode efficiency.' });
    const { parsed } = familyParamsFrom(v, v.thicknessUnit ?? 'um', v.temperatureUnit ?? 'degC');
    if (!parsed.success) for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', path: [`fp_${String(issue.path[0] ?? '')}`], message: issue.message });
    if (typeof v.maxThickness === 'number' && typeof v.minThickness === 'number' && v.maxThickness <= v.minThickness) {
      ctx.addIssue({ code: 'custom', path: ['maxThickness'], message: 'The maximum must be more than the minimum.' });
    }
    if (v.bakeRequired && v.bakeTemp === null) ctx.addIssue({ code: 'custom', path: ['bakeTemp'], message: 'Enter the bake temperature from the specification.' });
    if (v.bakeRequired && v.bakeHours === null) ctx.addIssue({ code: 'custom', path: ['bakeHours'], message: 'Enter the bake time from the specification.' });
  }, { when: () => true })
  .transform((v, ctx) => {
    const um = (x: number) => toStorage(x, v.thicknessUnit);
    const bakeTempC = v.bakeTemp === null ? null : toStorage(v.bakeTemp, v.temperatureUnit);
    const { family, parsed } = familyParamsFrom(v, v.thicknessUnit, v.temperatureUnit);
    const adm2 = family.usesCurrentDensity && v.currentDensity !== null ? toStorage(v.currentDensity, v.currentDensityUnit) : null;
    // Table limits (finishes CHECKs): thickness < 5000 µm, current density ≤ 100 A/dm², bake 0–400 °C.
    const minUm = family.makesCoating && v.minThickness !== null ? um(v.minThickness) : 0;
    if (minUm >= 5000) ctx.addIssue({ code: 'custom', path: ['minThickness'], message: 'That thickness is more than 5 mm.' });
    if (adm2 !== null && adm2 > 100) ctx.addIssue({ code: 'custom', path: ['currentDensity'], message: 'That current density is above 100 A/dm².' });
    if (bakeTempC !== null && (bakeTempC <= 0 || bakeTempC >= 400)) ctx.addIssue({ code: 'custom', path: ['bakeTemp'], message: 'The bake temperature must be between 0 and 400 °C.' });
    const metal = family.metal ?? PLATING_METALS.find((m) => m.key === v.metal)!;
    return {
      family: family.id,
      family_params: JSON.stringify(parsed.success ? parsed.data : {}),
      finishId: v.finishId,
      code: v.code,
      name: v.name,
      spec_text: v.specText,
      process_route: v.route,
      element: metal.element,
      ion_charge: metal.charge,
      min_thickness_um: minUm,
      max_thickness_um: v.maxThickness === null || !family.makesCoating ? null : um(v.maxThickness),
      method: v.method,
      current_density_adm2: adm2,
      efficiency: family.usesEfficiency && v.efficiencyPercent !== null ? v.efficiencyPercent / 100 : null,
      distribution_ratio: v.distributionRatio,
      tank_volts: v.tankVolts,
      parts_per_load: v.partsPerLoad,
      handling_minutes_per_load: v.handlingMinutesPerLoad,
      masking_per_piece_cents: v.maskingPerPiece,
      bake_required: v.bakeRequired,
      bake_threshold_hrc: v.bakeThresholdHrc,
      bake_window_hours: v.bakeWindowHours,
      bake_temp_c: bakeTempC,
      bake_hours: v.bakeHours,
      line_id: v.lineId,
      is_active: v.isActive,
    };
  });

export type FinishInput = z.infer<typeof finishSchema>;
