// Anodizing: an oxide grown from the aluminium by charge. Time and amp-hours come from the 720 rule
// (or the tank's or alloy's measured constant), the load is capped by the rectifier, and the
// coating splits into outward growth and penetration, which moves every surface and diameter.
import { z } from 'zod';
import { ANODIZE_720_CONSTANT, anodizeCalc, anodizeDimensionChange, PlatingInputError } from '@/lib/plating';
import { assembleLinePrice, bakeFor, checkFinishCharges, checkRates, commonComponents, costComponent, type FamilyFigure, type PricingInput } from '@/lib/quotes/pricing';
import { runArea, thicknessVerdict } from '../run-checks';
import { num } from '../calculator';
import type { FamilyCalculator, ProcessFamily } from '../types';
import { ANODIZE_METHODS, ANODIZE_TEMPLATES } from './bath';

export const SEALS = {
  hot_water: { label: 'hot deionised water', minutes: 30 },
  nickel_acetate: { label: 'nickel acetate', minutes: 15 },
  dichromate: { label: 'sodium dichromate', minutes: 15 },
  none: { label: 'no seal', minutes: 0 },
} as const;

const paramsSchema = z.object({
  coatingType: z.enum(['II', 'III'], { error: 'Choose Type II (sulfuric) or Type III (hard).' }),
  growthFraction: z.coerce.number({ error: 'Enter the share that grows outward.' }).min(0, 'Use a fraction from 0 to 1.').max(1, 'Use a fraction from 0 to 1.'),
  constantAminPerDm2PerUm: z.coerce.number().positive('The constant must be above 0.').max(100, 'Give the constant in A·min/dm² per µm (about 3).').optional(),
  seal: z.enum(['hot_water', 'nickel_acetate', 'dichromate', 'none'], { error: 'Choose the seal.' }),
  sealMinutes: z.coerce.number({ error: 'Enter the seal time.' }).min(0, 'At least 0 min.').max(240, 'At most 240 min.'),
});
export type AnodizeParams = z.infer<typeof paramsSchema>;

const RECTIFIER_EFFICIENCY = 0.85; // common practice, as for plating rectifiers (lib/quotes/process)

/** The constant in force: the alloy's (finish), else the tank's measured one, else the 720 rule. */
export function anodizeConstant(params: AnodizeParams, tankSettings: Record<string, unknown> | undefined): { value: number; source: string } {
  if (params.constantAminPerDm2PerUm) return { value: params.constantAminPerDm2PerUm, source: "the finish's own constant" };
  const tank = tankSettings?.constantAminPerDm2PerUm;
  if (typeof tank === 'number' && tank > 0) return { value: tank, source: "the tank's measured constant" };
  return { value: ANODIZE_720_CONSTANT, source: 'the 720 rule' };
}

function price(input: PricingInput, params: AnodizeParams) {
  const { part, finish, process, rates } = input;
  checkRates(rates);
  checkFinishCharges(finish);
  if (!Number.isSafeInteger(input.quantity) || input.quantity < 1) throw new PlatingInputError('quantity', 'The quantity must be a whole number of at least 1.');
  const cd = finish.currentDensityAdm2;
  const targetUm = finish.minThicknessUm / finish.distributionRatio;
  const k = anodizeConstant(params, process.tank?.settings);
  // The rectifier caps the area per load.
  const perPartA = part.areaDm2 * cd;
  if (perPartA > process.rectifierMaxA) {
    throw new PlatingInputError('finishId', `One part needs ${perPartA.toFixed(1)} A at ${cd} A/dm², more than the ${process.rectifierMaxA} A rectifier gives.`);
  }
  const byRectifier = Math.floor(process.rectifierMaxA / perPartA);
  const partsPerLoad = Math.min(finish.partsPerLoad, byRectifier, input.quantity);
  const loadLimitedBy = byRectifier < Math.min(finish.partsPerLoad, input.quantity) ? 'rectifier' : 'capacity';
  const loads = Math.ceil(input.quantity / partsPerLoad);
  const load = anodizeCalc({ areaDm2: part.areaDm2 * partsPerLoad, thicknessUm: targetUm, currentDensityAdm2: cd, growthFraction: params.growthFraction, constantAminPerDm2PerUm: k.value });
  const lot = anodizeCalc({ areaDm2: part.areaDm2 * input.quantity, thicknessUm: targetUm, currentDensityAdm2: cd, growthFraction: params.growthFraction, constantAminPerDm2PerUm: k.value });
  const minutesPerLoad = load.minutes + params.sealMinutes;
  const tankHours = (loads * minutesPerLoad) / 60;
  const acKWh = (lot.ampHours * finish.tankVolts) / 1000 / RECTIFIER_EFFICIENCY;
  const bake = bakeFor(input);
  const dims = anodizeDimensionChange(load.growthUm);
  const usePct = (load.currentA / process.rectifierMaxA) * 100;
  const figures: FamilyFigure[] = [
    { key: 'coating', label: `Coating (Type ${params.coatingType}), nominal`, value: targetUm, quantity: 'thickness' },
    { key: 'minutes', label: 'Anodizing time per load', value: load.minutes, unit: 'min', digits: 1 },
    { key: 'current', label: 'Current per load', value: load.currentA, unit: 'A', digits: 1 },
    { key: 'ampHours', label: 'Amp-hours per load', value: load.ampHours, unit: 'A·h', digits: 2 },
    {
      key: 'rectifier', label: 'Rectifier use', value: usePct, unit: `% of ${process.rectifierMaxA} A`, digits: 0,
      ...(loadLimitedBy === 'rectifier' ? { warning: `The rectifier limits a load to ${partsPerLoad} parts.` } : {}),
    },
    { key: 'growth', label: 'Growth per surface', value: dims.perSurfaceUm, quantity: 'thickness' },
    { key: 'penetration', label: 'Penetration into the metal', value: load.penetrationUm, quantity: 'thickness' },
    {
      key: 'diameter',
      label: 'Change on a diameter',
      value: dims.onDiameterUm,
      quantity: 'thickness',
      ...(part.sizeToleranceUm && dims.onDiameterUm > part.sizeToleranceUm ? { warning: 'More than the drawing’s tolerance: machine the part undersize before anodizing, or ask the customer.' } : {}),
    },
    part.sizeToleranceUm
      ? { key: 'tolerance', label: 'Drawing tolerance on a diameter (±)', value: part.sizeToleranceUm, quantity: 'thickness' }
      : { key: 'tolerance', label: 'Drawing tolerance on a diameter', value: 'not on the part record' },
    { key: 'constant', label: `Constant (${k.source})`, value: k.value, unit: 'A·min/dm² per µm', digits: 4 },
    { key: 'seal', label: `Seal (${SEALS[params.seal].label})`, value: params.sealMinutes, unit: 'min', digits: 0 },
  ];
  if (k.source === 'the 720 rule') {
    figures.push({ key: 'basis', label: 'Basis', value: 'The 720 rule is an estimate: alloy (high-copper 2xxx, high-silicon castings), temperature and acid move it; the tank’s measured constant replaces it.' });
  }
  const cautions = params.seal === 'dichromate' ? ['A dichromate seal is hexavalent chromium: a carcinogen. Follow the safety data sheet and local codes.'] : [];
  const components = [
    costComponent('power', 'Power', acKWh, 'kWh', rates.powerPerKwhCents),
    costComponent('additives', 'Acid and additives', lot.ampHours / 1000, 'kA·h', rates.additivesPerKahCents),
    ...commonComponents(input, { loads, tankHours }, bake),
  ];
  return assembleLinePrice(input, {
    components,
    bake,
    cautions,
    family: 'anodizing',
    figures,
    job: {
      loads, partsPerLoad, loadLimitedBy, averageThicknessUm: targetUm, minimumThicknessUm: finish.minThicknessUm, distributionRatio: finish.distributionRatio,
      // Minutes under current; the tank time also holds the seal.
      ampHours: lot.ampHours, minutesPerLoad: load.minutes, tankHours, labourHours: (loads * finish.handlingMinutesPerLoad) / 60, metalKg: 0, acKWh, areaPerLotDm2: part.areaDm2 * input.quantity,
    },
  });
}

/** Time, current, amp-hours and the size change for one load, as the estimator types it. */
export const ANODIZE_CALCULATOR = {
  title: 'Anodizing: one load',
  inputs: [
    { name: 'areaDm2', label: 'Area in the load', kind: 'number', quantity: 'area', initial: 20 },
    { name: 'thicknessUm', label: 'Anodic coating thickness', kind: 'number', quantity: 'thickness', initial: 25 },
    { name: 'currentDensityAdm2', label: 'Anodizing current density', kind: 'number', quantity: 'currentDensity', initial: 1.5 },
    { name: 'growthFraction', label: 'Share that grows outward', kind: 'number', initial: 0.5, hint: 'Hard coatings about 0.5, Type II about 0.33 (common practice).' },
    { name: 'rectifierMaxA', label: 'Anodizing rectifier rating', kind: 'number', unit: 'A', initial: 1000 },
    { name: 'constantAminPerDm2PerUm', label: 'Measured constant (empty: the 720 rule)', kind: 'number', unit: 'A·min/dm² per µm', initial: '' },
  ],
  compute(v: Record<string, number | string>) {
    const k = v.constantAminPerDm2PerUm === '' || v.constantAminPerDm2PerUm === undefined ? undefined : num(v.constantAminPerDm2PerUm);
    const r = anodizeCalc({ areaDm2: num(v.areaDm2), thicknessUm: num(v.thicknessUm), currentDensityAdm2: num(v.currentDensityAdm2), growthFraction: num(v.growthFraction), constantAminPerDm2PerUm: k });
    const max = num(v.rectifierMaxA);
    const d = anodizeDimensionChange(r.growthUm);
    const over = Number.isFinite(max) && max > 0 && r.currentA > max;
    const figures: FamilyFigure[] = [
      { key: 'minutes', label: 'Time', value: r.minutes, unit: 'min', digits: 1 },
      { key: 'current', label: 'Current', value: r.currentA, unit: 'A', digits: 1, ...(over ? { warning: `More than the ${max} A rectifier: split the load.` } : {}) },
      { key: 'ampHours', label: 'Amp-hours', value: r.ampHours, unit: 'A·h', digits: 2 },
      { key: 'growth', label: 'Growth per surface', value: d.perSurfaceUm, quantity: 'thickness' },
      { key: 'penetration', label: 'Penetration', value: r.penetrationUm, quantity: 'thickness' },
      { key: 'diameter', label: 'Change on a diameter', value: d.onDiameterUm, quantity: 'thickness' },
    ];
    return { figures, notes: [k ? 'With the measured constant.' : 'By the 720 rule (3.0512 A·min/dm² per µm): an estimate; alloy and temperature move it.'] };
  },
} as const satisfies FamilyCalculator;

export const anodizing: ProcessFamily<AnodizeParams> = {
  id: 'anodizing',
  label: 'Anodizing',
  // The oxide is aluminium's own: Al → Al³⁺.
  metal: { element: 'Al', charge: 3, label: 'Aluminium (anodic oxide)' },
  thicknessMethod: 'B244',
  makesCoating: true,
  usesCurrentDensity: true,
  bakeLabel: 'Heat treatment (rarely needed after anodizing)',
  usesEfficiency: false,
  calculators: [ANODIZE_CALCULATOR],
  tankSettings: {
    schema: z.object({ constantAminPerDm2PerUm: z.coerce.number().positive('The constant must be above 0.').max(100, 'Give it in A·min/dm² per µm (about 3).').optional() }),
    fields: [{ name: 'constantAminPerDm2PerUm', label: 'Measured anodizing constant', kind: 'number', unit: 'A·min/dm² per µm', optional: true, hint: 'From this tank’s own coatings; empty uses the 720 rule (3.0512).' }],
  },
  form: [
    { name: 'coatingType', label: 'Coating', kind: 'select', options: [{ value: 'II', label: 'Type II (sulfuric)' }, { value: 'III', label: 'Type III (hard)' }] },
    { name: 'growthFraction', label: 'Share that grows outward', kind: 'number', hint: 'Hard coatings about 0.5, Type II about 0.33 (common practice).' },
    { name: 'constantAminPerDm2PerUm', label: 'Measured constant for this alloy', kind: 'number', unit: 'A·min/dm² per µm', optional: true, hint: 'Leave empty to use the tank’s constant or the 720 rule (3.0512).' },
    { name: 'seal', label: 'Seal', kind: 'select', options: Object.entries(SEALS).map(([value, s]) => ({ value, label: s.label })) },
    { name: 'sealMinutes', label: 'Seal time', kind: 'number', unit: 'min' },
  ],
  summary: 'An oxide grown from aluminium by charge (sulfuric Type II, hard Type III), then sealed.',
  paramsSchema,
  defaultParams: { coatingType: 'II', growthFraction: 1 / 3, seal: 'hot_water', sealMinutes: SEALS.hot_water.minutes },
  templates: ANODIZE_TEMPLATES,
  methods: ANODIZE_METHODS,
  hazards: ['strong_acid', 'heat', 'nickel', 'electrical'],
  // Sulfuric acid, a near-boiling seal; a nickel acetate seal is a nickel salt, a dichromate seal Cr(VI).
  cautions: (p) => ['acid', 'electrical', ...(p.seal === 'none' ? [] : ['heat' as const]), ...(p.seal === 'nickel_acetate' ? ['nickel' as const] : []), ...(p.seal === 'dichromate' ? ['hexavalent-chromium' as const] : [])],
  runsWithCurrent: true,
  runConditions: [],
  // The charge per area over the constant: µm = A·min/dm² ÷ (A·min/dm² per µm).
  // The oxide is the part's own aluminium: no metal is bought for it.
  runCost: () => ({ metalG: 0 }),
  predictRun: (input, params) => {
    if (input.ampHours === null) throw new PlatingInputError('currentA', 'An anodizing run needs its current or its amp-hours.');
    const area = runArea(input);
    const k = anodizeConstant(params, input.tank.settings).value;
    return thicknessVerdict(input, area, (input.ampHours * 60) / area / k);
  },
  tankServes: (tank, finish) => tank.templateId === (finish.params.coatingType === 'III' ? 'hard-anodize' : 'sulfuric-anodize'),
  price,
  quality: [
    { kind: 'thickness', label: 'Anodic coating thickness by eddy current (ASTM B244 / ISO 2360)' },
    {
      kind: 'seal_test',
      label: 'Seal quality test',
      methods: [
        { id: 'dye_spot', label: 'Dye-spot test (ASTM B136, ISO 2143)' },
        { id: 'acid_dissolution', label: 'Acid dissolution mass loss (ASTM B680, ISO 3210)' },
        { id: 'admittance', label: 'Admittance (ISO 2931)' },
      ],
    },
  ],
  certificateStatement: (finish, p) =>
    `Anodized in sulfuric acid${p.coatingType === 'III' ? ' (hard anodic coating, Type III)' : ' (Type II)'}${p.seal === 'none' ? ', unsealed' : `, sealed in ${SEALS[p.seal].label}`}; coating thickness measured by eddy current (ASTM B244)${finish.specText ? `, to ${finish.specText}` : ''}.`,
};
