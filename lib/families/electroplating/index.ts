// Electroplating: metal deposited by current, by Faraday's law (lib/plating's job estimate). Zinc
// finishes also show the coating's expected life where the customer states the environment.
import { z } from 'zod';
import { predictRun } from '@/lib/orders/run-math';
import {
  CORROSIVITY_CATEGORIES,
  describeZincLife,
  isCorrosivityCategory,
  PlatingInputError,
  thicknessFromCharge,
  ZINC_LIFE_STANDARD,
  ZINC_LOSS_UM_PER_YEAR,
  zincServiceLife,
  zincThicknessForLife,
  type CorrosivityCategory,
} from '@/lib/plating';
import { priceLine, type FamilyFigure, type PricingInput } from '@/lib/quotes/pricing';
import { NICKEL_COPPER_TEMPLATES } from '@/lib/bath/templates/nickel-copper';
import { OTHER_TEMPLATES } from '@/lib/bath/templates/other';
import { ZINC_TIN_TEMPLATES } from '@/lib/bath/templates/zinc-tin';
import { num } from '../calculator';
import type { FamilyCalculator, ProcessFamily } from '../types';

const paramsSchema = z.object({
  // Hours of ASTM B117 neutral salt spray the customer asks of a zinc finish with its conversion coating.
  saltSprayHours: z.coerce.number().positive('Enter hours above 0.').max(5000, 'At most 5000 h.').optional(),
});
export type ElectroplatingParams = z.infer<typeof paramsSchema>;

export const LIFE_DISCLAIMER = 'An estimate, not a warranty: the site’s measured corrosivity category governs.';

/** Zinc life in the stated environment, and the thickness a stated design life needs. */
export function zincLifeFigures(minThicknessUm: number, category: CorrosivityCategory | null | undefined, designLifeYears: number | null | undefined): FamilyFigure[] {
  if (!category) return [];
  const life = zincServiceLife({ thicknessUm: minThicknessUm, category });
  const figures: FamilyFigure[] = [{ key: 'zincLife', label: `Expected life in ${category} (${ZINC_LIFE_STANDARD}; ${LIFE_DISCLAIMER})`, value: describeZincLife(life, category) }];
  if (designLifeYears) {
    const needed = zincThicknessForLife({ years: designLifeYears, category }).thicknessUm;
    figures.push({
      key: 'zincForLife',
      label: `Zinc for a ${designLifeYears}-year life in ${category} (upper rate)`,
      value: needed,
      quantity: 'thickness',
      ...(needed > minThicknessUm ? { warning: 'More than the finish’s minimum thickness: quote a thicker coating or a shorter life.' } : {}),
    });
  }
  return figures;
}

/** Zinc's expected life in an ISO 9223 category, and the zinc a design life needs. */
export const ZINC_LIFE_CALCULATOR = {
  title: 'Zinc coating life',
  inputs: [
    { name: 'thicknessUm', label: 'Zinc thickness', kind: 'number', quantity: 'thickness', initial: 8 },
    { name: 'category', label: 'Environment (ISO 9223)', kind: 'select', options: CORROSIVITY_CATEGORIES.map((c) => ({ value: c, label: `${c} · ${ZINC_LOSS_UM_PER_YEAR[c].name}` })), initial: 'C3' },
    { name: 'years', label: 'Design life asked', kind: 'number', unit: 'years', initial: 10 },
  ],
  compute(v: Record<string, number | string>) {
    const category = String(v.category);
    if (!isCorrosivityCategory(category)) throw new PlatingInputError('category', 'Choose an ISO 9223 category.');
    return { figures: zincLifeFigures(num(v.thicknessUm), category, num(v.years)), notes: [LIFE_DISCLAIMER] };
  },
} as const satisfies FamilyCalculator;

export const electroplating: ProcessFamily<ElectroplatingParams> = {
  id: 'electroplating',
  label: 'Electroplating',
  metal: null,
  thicknessMethod: 'B499',
  makesCoating: true,
  usesCurrentDensity: true,
  bakeLabel: 'Hydrogen-embrittlement relief bake',
  usesEfficiency: true,
  calculators: [ZINC_LIFE_CALCULATOR],
  tankSettings: null,
  form: [{ name: 'saltSprayHours', label: 'Salt-spray hours the customer asks (ASTM B117)', kind: 'number', unit: 'h', optional: true, hint: 'Zinc with a conversion coating: leave empty if no salt-spray test is asked.' }],
  summary: 'Metal deposited by current: amp-hours, time and metal from Faraday’s law.',
  paramsSchema,
  defaultParams: {},
  templates: [...NICKEL_COPPER_TEMPLATES, ...ZINC_TIN_TEMPLATES, ...OTHER_TEMPLATES],
  methods: [],
  hazards: ['electrical'],
  // The metal and the route decide the rest (lib/finishes/hazards).
  cautions: () => ['electrical'],
  runsWithCurrent: true,
  runConditions: [],
  // Faraday's law on the run's charge at the tank's efficiency.
  runCost: (input) =>
    input.ampHours && input.ampHours > 0 && input.tankEfficiency
      ? { metalG: thicknessFromCharge({ element: input.finish.element, charge: input.finish.ionCharge, areaDm2: input.areaDm2, ampHours: input.ampHours, efficiency: input.tankEfficiency }).depositMassG }
      : { metalG: 0 },
  predictRun: (input) => {
    if (input.ampHours === null) throw new PlatingInputError('currentA', 'A plating run needs its current or its amp-hours.');
    if (input.tank.efficiency === null) throw new PlatingInputError('tankId', 'The tank has no cathode efficiency on record.');
    const p = predictRun({ ...input.finish, ampHours: input.ampHours, loads: input.loads, partsPerLoad: input.partsPerLoad, areaPerPartDm2: input.areaPerPartDm2, tankEfficiency: input.tank.efficiency });
    return { ...p, outsideWindow: [] };
  },
  // A plating tank deposits the finish's metal from the finish's ion.
  tankServes: (tank, finish) => tank.element === finish.element && tank.ionCharge === finish.ionCharge,
  price: (input: PricingInput) =>
    priceLine(input, input.finish.element === 'Zn' ? zincLifeFigures(input.finish.minThicknessUm, input.part.corrosivityCategory, input.part.designLifeYears) : []),
  quality: [
    { kind: 'thickness', label: 'Coating thickness (the method the specification names)' },
    { kind: 'bake', label: 'Embrittlement-relief bake, where the steel or the specification requires it' },
    { kind: 'salt_spray', label: 'Neutral salt spray (ASTM B117), where the finish asks for hours' },
  ],
  certificateStatement: (finish) => `Electroplated: ${finish.name}${finish.specText ? `, to ${finish.specText}` : ''}.`,
};
