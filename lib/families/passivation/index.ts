// Passivation of stainless steel: no current, no coating. A lot is held in the acid for a time at
// a temperature and concentration that must sit inside its treatment's window; the price is the
// cycle time and the tank it occupies. Each lot keeps its conditions and a verification test.
import { z } from 'zod';
import { checkPassivation, DEFAULT_PASSIVATION_WINDOWS, PlatingInputError, type PassivationWindow } from '@/lib/plating';
import { assembleLinePrice, bakeFor, checkFinishCharges, checkRates, commonComponents, type FamilyFigure, type PricingInput } from '@/lib/quotes/pricing';
import { runArea } from '../run-checks';
import { num } from '../calculator';
import type { FamilyCalculator, ProcessFamily } from '../types';
import { windowsOf } from './windows';
import { PASSIVATION_METHODS, PASSIVATION_TEMPLATES } from './bath';

/** ASTM A967's verification practices (names as the standard gives them). */
export const VERIFICATION_TESTS = [
  { id: 'water_immersion', label: 'Water immersion' },
  { id: 'high_humidity', label: 'High humidity' },
  { id: 'salt_spray', label: 'Salt spray' },
  { id: 'copper_sulfate', label: 'Copper sulfate' },
  { id: 'ferricyanide_nitric', label: 'Potassium ferricyanide–nitric acid' },
  { id: 'damp_cloth', label: 'Damp cloth' },
] as const;
export type VerificationTestId = (typeof VERIFICATION_TESTS)[number]['id'];

const paramsSchema = z.object({
  windowId: z.string({ error: 'Choose the treatment.' }).min(1, 'Choose the treatment.'),
  minutes: z.coerce.number({ error: 'Enter the immersion time.' }).positive('Enter a time above 0.').max(600, 'At most 600 min.'),
  temperatureC: z.coerce.number({ error: 'Enter the bath temperature.' }).min(0, 'At least 0 °C.').max(100, 'At most 100 °C.'),
  concentration: z.coerce.number({ error: 'Enter the acid concentration.' }).positive('Enter a concentration above 0.').max(100, 'At most 100 %.'),
  verificationTest: z.enum(VERIFICATION_TESTS.map((t) => t.id) as [VerificationTestId, ...VerificationTestId[]], { error: 'Choose the verification test.' }),
});
export type PassivationParams = z.infer<typeof paramsSchema>;

export function windowFor(id: string, windows: readonly PassivationWindow[] = DEFAULT_PASSIVATION_WINDOWS): PassivationWindow | null {
  return windows.find((w) => w.id === id) ?? null;
}

function price(input: PricingInput, params: PassivationParams) {
  const { finish, rates } = input;
  checkRates(rates);
  checkFinishCharges(finish);
  if (!Number.isSafeInteger(input.quantity) || input.quantity < 1) throw new PlatingInputError('quantity', 'The quantity must be a whole number of at least 1.');
  const verdict = checkPassivation({ windowId: params.windowId, temperatureC: params.temperatureC, minutes: params.minutes, concentration: params.concentration }, windowsOf(input.familyData));
  if (!verdict.ok) throw new PlatingInputError('finishId', `The finish's own conditions are outside the window: ${verdict.broken.join(' ')}`);
  const partsPerLoad = Math.min(finish.partsPerLoad, input.quantity);
  const loads = Math.ceil(input.quantity / partsPerLoad);
  const tankHours = (loads * params.minutes) / 60;
  const bake = bakeFor(input);
  const w = verdict.window;
  const figures: FamilyFigure[] = [
    { key: 'treatment', label: 'Treatment', value: `${w.standard} ${w.treatment}` },
    { key: 'minutes', label: 'Immersion per load', value: params.minutes, unit: 'min', digits: 0 },
    { key: 'temperature', label: 'Bath temperature', value: params.temperatureC, quantity: 'temperature' },
    { key: 'concentration', label: `${w.acid === 'nitric' ? 'Nitric' : 'Citric'} acid`, value: params.concentration, unit: w.concentration.unit, digits: 0 },
    { key: 'cycle', label: 'Cycle per load (immersion + handling)', value: params.minutes + finish.handlingMinutesPerLoad, unit: 'min', digits: 0 },
    { key: 'occupancy', label: 'Tank occupied by the lot', value: tankHours, unit: 'tank-h', digits: 2 },
    { key: 'verification', label: 'Verification test', value: VERIFICATION_TESTS.find((t) => t.id === params.verificationTest)!.label },
    { key: 'basis', label: 'Window', value: w.source },
  ];
  return assembleLinePrice(input, {
    components: commonComponents(input, { loads, tankHours }, bake),
    bake,
    cautions: [],
    family: 'passivation',
    figures,
    job: {
      loads, partsPerLoad, loadLimitedBy: 'capacity', averageThicknessUm: 0, minimumThicknessUm: 0, distributionRatio: 1,
      ampHours: 0, minutesPerLoad: params.minutes, tankHours, labourHours: (loads * finish.handlingMinutesPerLoad) / 60, metalKg: 0, acKWh: 0,
      areaPerLotDm2: input.part.areaDm2 * input.quantity,
    },
  });
}

/** A lot's time, temperature and concentration against its treatment, and the tank it occupies. */
export const PASSIVATION_CALCULATOR = {
  title: 'Passivation: one lot',
  inputs: [
    { name: 'windowId', label: 'Treatment', kind: 'select', options: DEFAULT_PASSIVATION_WINDOWS.map((w) => ({ value: w.id, label: `${w.standard} ${w.treatment}` })), initial: 'a967-nitric-2' },
    { name: 'temperatureC', label: 'Bath temperature', kind: 'number', quantity: 'temperature', initial: 27 },
    { name: 'minutes', label: 'Immersion', kind: 'number', unit: 'min', initial: 30 },
    { name: 'concentration', label: 'Acid concentration', kind: 'number', unit: '%', initial: 25 },
    { name: 'loads', label: 'Loads in the lot', kind: 'number', unit: 'loads', initial: 4 },
  ],
  compute(v: Record<string, number | string>, familyData?: Record<string, unknown>) {
    const verdict = checkPassivation({ windowId: String(v.windowId), temperatureC: num(v.temperatureC), minutes: num(v.minutes), concentration: num(v.concentration) }, windowsOf(familyData));
    const loads = num(v.loads);
    if (!(loads >= 1) || !Number.isInteger(loads)) throw new PlatingInputError('loads', 'Loads must be a whole number of at least 1.');
    const figures: FamilyFigure[] = [
      { key: 'verdict', label: 'Window', value: verdict.ok ? `Inside ${verdict.window.standard} ${verdict.window.treatment}` : 'Outside the window', ...(verdict.ok ? {} : { warning: verdict.broken.join(' ') }) },
      { key: 'occupancy', label: 'Tank occupied', value: (loads * num(v.minutes)) / 60, unit: 'tank-h', digits: 2 },
    ];
    return { figures, notes: [verdict.window.source] };
  },
} as const satisfies FamilyCalculator;

export const passivation: ProcessFamily<PassivationParams> = {
  id: 'passivation',
  label: 'Passivation',
  // No metal is deposited; the passive film is chromium-rich oxide on the stainless steel.
  metal: { element: 'Cr', charge: 3, label: 'Stainless steel (passive film)' },
  thicknessMethod: null,
  makesCoating: false,
  usesCurrentDensity: false,
  bakeLabel: 'Heat treatment (not usual after passivation)',
  usesEfficiency: false,
  calculators: [PASSIVATION_CALCULATOR],
  tankSettings: null,
  form: [
    { name: 'windowId', label: 'Treatment', kind: 'select', options: DEFAULT_PASSIVATION_WINDOWS.map((w) => ({ value: w.id, label: `${w.standard} ${w.treatment}` })) },
    { name: 'minutes', label: 'Immersion time', kind: 'number', unit: 'min' },
    { name: 'temperatureC', label: 'Bath temperature', kind: 'number', convert: 'temperature' },
    { name: 'concentration', label: 'Acid concentration', kind: 'number', unit: '% (vol % nitric, wt % citric)' },
    { name: 'verificationTest', label: 'Verification test', kind: 'select', options: VERIFICATION_TESTS.map((t) => ({ value: t.id, label: t.label })) },
  ],
  summary: 'Stainless steel cleaned of free iron in nitric or citric acid: a time, temperature and concentration window per lot.',
  paramsSchema,
  defaultParams: { windowId: 'a967-nitric-2', minutes: 30, temperatureC: 27, concentration: 25, verificationTest: 'water_immersion' },
  templates: PASSIVATION_TEMPLATES,
  methods: PASSIVATION_METHODS,
  hazards: ['strong_acid', 'oxidiser'],
  cautions: (p) => (windowFor(p.windowId)?.acid === 'citric' ? ['acid', 'heat'] : ['nitric-acid', 'acid']),
  runsWithCurrent: false,
  runConditions: ['temperatureC', 'concentration'],
  // No coating: the run is judged against its treatment's window, lot by lot (ASTM A967 §5.2.2).
  runCost: () => ({ metalG: 0 }),
  predictRun: (input, params) => {
    const area = runArea(input);
    const { temperatureC, concentration } = input.conditions;
    if (temperatureC === undefined) throw new PlatingInputError('temperature', 'Enter the bath temperature read at the tank.');
    if (concentration === undefined) throw new PlatingInputError('concentration', 'Enter the acid concentration of the latest analysis.');
    const verdict = checkPassivation({ windowId: params.windowId, temperatureC, minutes: input.minutesPerLoad, concentration }, windowsOf(input.familyData));
    return { platedAreaDm2: area, averageThicknessUm: 0, minimumThicknessUm: 0, requiredMinimumUm: 0, isBelowMinimum: false, outsideWindow: verdict.ok ? [] : verdict.broken };
  },
  tankServes: (tank, finish) => tank.templateId === (windowFor(finish.params.windowId)?.acid === 'citric' ? 'citric-passivation' : 'nitric-passivation'),
  price,
  quality: [
    { kind: 'passivation_lot', label: 'Time, temperature and acid concentration for the lot (ASTM A967 §5.2.2)' },
    { kind: 'passivation_test', label: 'Verification test', methods: VERIFICATION_TESTS },
  ],
  certificateStatement: (finish, p) => {
    const w = windowFor(p.windowId);
    const test = VERIFICATION_TESTS.find((t) => t.id === p.verificationTest)?.label.toLowerCase();
    return `Passivated${w ? ` per ${w.standard}, treatment ${w.treatment}` : ''}${finish.specText ? ` (${finish.specText})` : ''}; verified by the ${test} test.`;
  },
};
