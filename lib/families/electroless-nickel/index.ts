// Electroless nickel: no current. Time comes from the bath's deposition rate; the nickel taken from
// the bath is the deposit less its phosphorus; and each job uses a share of the bath's life, counted
// in metal turnovers, whose make-up and disposal cost is spread over the turnovers the shop gets.
import { z } from 'zod';
import { electrolessCalc, PlatingInputError } from '@/lib/plating';
import {
  assembleLinePrice,
  bakeFor,
  checkFinishCharges,
  checkRates,
  commonComponents,
  costComponent,
  metalRate,
  type FamilyFigure,
  type PricingInput,
} from '@/lib/quotes/pricing';
import { runArea, thicknessVerdict } from '../run-checks';
import { num } from '../calculator';
import type { FamilyCalculator, ProcessFamily } from '../types';
import { EN_METHODS, EN_TEMPLATES } from './bath';

const paramsSchema = z.object({
  depositionRateUmPerH: z.coerce.number({ error: 'Enter the bath’s deposition rate.' }).positive('Enter a rate above 0.').max(100, 'Give the rate in µm per hour (about 10–25).'),
  phosphorusWtPct: z.coerce.number({ error: 'Enter the phosphorus content.' }).min(0, 'Use 0–15 %.').max(15, 'Use 0–15 %.'),
  densityGPerCm3: z.coerce.number().positive().max(25, 'Give the density in g/cm³ (about 8).').optional(),
});
export type ElectrolessParams = z.infer<typeof paramsSchema>;

/** A tank's electroless settings, with the shop's defaults where it has none (common practice). */
export const enTankSettingsSchema = z.object({
  nickelMakeUpGPerL: z.coerce.number().positive().max(50).default(6),
  endOfLifeMto: z.coerce.number().positive().max(50).default(8),
  makeUpCostCents: z.coerce.number().int().min(0).default(0),
  disposalCostCents: z.coerce.number().int().min(0).default(0),
});
export type EnTankSettings = z.infer<typeof enTankSettingsSchema>;

export function enTankSettings(settings: Record<string, unknown> | undefined): EnTankSettings {
  return enTankSettingsSchema.parse(settings ?? {});
}

// Common practice (from memory): above about 2 dm² of work per litre an electroless bath runs
// unstable and slows.
const MAX_LOADING_DM2_PER_L = 2;

function price(input: PricingInput, params: ElectrolessParams) {
  const { part, finish, process, rates } = input;
  checkRates(rates);
  checkFinishCharges(finish);
  if (!Number.isSafeInteger(input.quantity) || input.quantity < 1) throw new PlatingInputError('quantity', 'The quantity must be a whole number of at least 1.');
  if (!process.tank) throw new PlatingInputError('finishId', 'No electroless nickel tank is set up to price this finish.');
  const nickelPrice = metalRate(rates, 'Ni');
  const tank = enTankSettings(process.tank.settings);
  const targetUm = finish.minThicknessUm / finish.distributionRatio;
  const partsPerLoad = Math.min(finish.partsPerLoad, input.quantity);
  const loads = Math.ceil(input.quantity / partsPerLoad);
  const lot = electrolessCalc({
    areaDm2: part.areaDm2 * input.quantity,
    thicknessUm: targetUm,
    depositionRateUmPerH: params.depositionRateUmPerH,
    phosphorusWtPct: params.phosphorusWtPct,
    densityGPerCm3: params.densityGPerCm3,
    bathVolumeL: process.tank.volumeL,
    nickelMakeUpGPerL: tank.nickelMakeUpGPerL,
  });
  const tankHours = (loads * lot.minutes) / 60;
  const loadingDm2PerL = (part.areaDm2 * partsPerLoad) / process.tank.volumeL;
  const costPerMtoCents = (tank.makeUpCostCents + tank.disposalCostCents) / tank.endOfLifeMto;
  const bake = bakeFor(input);
  const figures: FamilyFigure[] = [
    { key: 'deposit', label: 'Deposit, nominal', value: targetUm, quantity: 'thickness' },
    { key: 'rate', label: 'Deposition rate of the bath', value: params.depositionRateUmPerH, quantity: 'thickness', perHour: true },
    { key: 'minutes', label: 'Time per load', value: lot.minutes, unit: 'min', digits: 1 },
    { key: 'phosphorus', label: 'Phosphorus in the deposit', value: params.phosphorusWtPct, unit: '% by weight', digits: 1 },
    { key: 'density', label: params.densityGPerCm3 ? 'Deposit density' : 'Deposit density (from the phosphorus content)', value: lot.densityGPerCm3, unit: 'g/cm³', digits: 2 },
    { key: 'nickel', label: 'Nickel taken from the bath', value: lot.nickelConsumedG, quantity: 'mass' },
    { key: 'mto', label: `Share of a metal turnover (${process.tank.volumeL} L at ${tank.nickelMakeUpGPerL} g/L)`, value: lot.metalTurnovers, unit: 'MTO', digits: 4 },
    { key: 'bathLife', label: `Bath life cost per turnover (end of life at ${tank.endOfLifeMto} MTO)`, value: costPerMtoCents / 100, unit: '$ per MTO', digits: 2 },
    {
      key: 'loading', label: 'Bath loading per load', value: loadingDm2PerL, unit: 'dm²/L', digits: 3,
      ...(loadingDm2PerL > MAX_LOADING_DM2_PER_L ? { warning: `Above about ${MAX_LOADING_DM2_PER_L} dm²/L the bath runs unstable: use smaller loads.` } : {}),
    },
  ];
  if (params.phosphorusWtPct > 11.2) {
    figures.push({ key: 'magnetic', label: 'Thickness gauge', value: 'Above 11.2 % P the deposit is not ferromagnetic: measure by X-ray fluorescence or microscopy, not a magnetic gauge (ASTM B733 scope).' });
  }
  if (params.densityGPerCm3 === undefined) figures.push({ key: 'basis', label: 'Basis', value: 'Density from a phosphorus table recalled from memory; enter the bath’s measured density when known.' });
  const cautions: string[] = [];
  const components = [
    costComponent('metal', 'Nickel taken from the bath', lot.nickelConsumedG / 1000, 'kg', nickelPrice),
    costComponent('bathLife', 'Bath life (make-up and disposal per metal turnover)', lot.metalTurnovers, 'MTO', costPerMtoCents),
    ...commonComponents(input, { loads, tankHours }, bake),
  ];
  return assembleLinePrice(input, {
    components,
    bake,
    cautions,
    family: 'electroless_nickel',
    figures,
    job: {
      loads, partsPerLoad, loadLimitedBy: 'capacity', averageThicknessUm: targetUm, minimumThicknessUm: finish.minThicknessUm, distributionRatio: finish.distributionRatio,
      ampHours: 0, minutesPerLoad: lot.minutes, tankHours, labourHours: (loads * finish.handlingMinutesPerLoad) / 60, metalKg: lot.nickelConsumedG / 1000, acKWh: 0,
      areaPerLotDm2: part.areaDm2 * input.quantity,
    },
  });
}

/** The phosphorus a lot may show: the B733 type's band for the nominal content, else ±1 % (from memory). */
export function phosphorusRangeFor(nominalPct: number): { min: number; max: number } {
  const type = b733TypeFor(nominalPct);
  if (type === 'IV') return { min: 5, max: 9 };
  if (type === 'V') return { min: 10, max: 14 };
  if (type === 'III') return { min: 2, max: 4 };
  if (type === 'II') return { min: 1, max: 3 };
  return { min: Math.max(0, nominalPct - 1), max: Math.min(15, nominalPct + 1) };
}

/** ASTM B733 types by phosphorus (from memory: II 1–3 %, III 2–4 %, IV 5–9 %, V ≥ 10 %). */
export function b733TypeFor(phosphorusWtPct: number): string | null {
  if (phosphorusWtPct >= 10) return 'V';
  if (phosphorusWtPct >= 5 && phosphorusWtPct <= 9) return 'IV';
  if (phosphorusWtPct >= 2 && phosphorusWtPct <= 4) return 'III';
  if (phosphorusWtPct >= 1 && phosphorusWtPct <= 3) return 'II';
  return null;
}

/** Time from the bath's rate, nickel consumed and the share of a metal turnover for one job. */
export const EN_CALCULATOR = {
  title: 'Electroless nickel: one job',
  inputs: [
    { name: 'areaDm2', label: 'Area of the job', kind: 'number', quantity: 'area', initial: 10 },
    { name: 'thicknessUm', label: 'Deposit thickness', kind: 'number', quantity: 'thickness', initial: 25 },
    { name: 'depositionRateUmPerH', label: 'Deposition rate', kind: 'number', quantity: 'thickness', perHour: true, initial: 15 },
    { name: 'phosphorusWtPct', label: 'Phosphorus', kind: 'number', unit: '%', initial: 8 },
    { name: 'bathVolumeL', label: 'Bath volume', kind: 'number', quantity: 'volume', initial: 100 },
    { name: 'nickelMakeUpGPerL', label: 'Nickel at make-up', kind: 'number', unit: 'g/L', initial: 6 },
  ],
  compute(v: Record<string, number | string>) {
    const r = electrolessCalc({ areaDm2: num(v.areaDm2), thicknessUm: num(v.thicknessUm), depositionRateUmPerH: num(v.depositionRateUmPerH), phosphorusWtPct: num(v.phosphorusWtPct), bathVolumeL: num(v.bathVolumeL), nickelMakeUpGPerL: num(v.nickelMakeUpGPerL) });
    const type = b733TypeFor(num(v.phosphorusWtPct));
    const figures: FamilyFigure[] = [
      { key: 'minutes', label: 'Time in the bath', value: r.minutes, unit: 'min', digits: 1 },
      { key: 'deposit', label: 'Deposit', value: r.depositMassG, quantity: 'mass' },
      { key: 'nickel', label: 'Nickel consumed', value: r.nickelConsumedG, quantity: 'mass' },
      { key: 'phosphorus', label: 'Phosphorus in it', value: r.phosphorusG, quantity: 'mass' },
      { key: 'mto', label: 'Share of a metal turnover', value: r.metalTurnovers, unit: 'MTO', digits: 4 },
      { key: 'density', label: 'Density (from the phosphorus)', value: r.densityGPerCm3, unit: 'g/cm³', digits: 2 },
    ];
    return { figures, notes: [type ? `ASTM B733 Type ${type} by phosphorus (from memory).` : 'No B733 type for this phosphorus.', 'The density table is from memory; the bath supplier’s figure governs.'] };
  },
} as const satisfies FamilyCalculator;

export const electrolessNickel: ProcessFamily<ElectrolessParams> = {
  id: 'electroless_nickel',
  label: 'Electroless nickel',
  metal: { element: 'Ni', charge: 2, label: 'Nickel–phosphorus' },
  thicknessMethod: 'B568',
  makesCoating: true,
  usesCurrentDensity: false,
  bakeLabel: 'Heat treatment (hardness or embrittlement relief, ASTM B733 classes)',
  usesEfficiency: false,
  calculators: [EN_CALCULATOR],
  tankSettings: {
    schema: enTankSettingsSchema,
    fields: [
      { name: 'nickelMakeUpGPerL', label: 'Nickel at make-up', kind: 'number', unit: 'g/L', hint: 'One metal turnover is this nickel replaced once.' },
      { name: 'endOfLifeMto', label: 'End of life', kind: 'number', unit: 'metal turnovers', hint: 'An alert is raised when the bath reaches it (typically 6–10, common practice).' },
      { name: 'makeUpCostCents', label: 'Make-up cost of the bath', kind: 'number', convert: 'dollars', unit: '$' },
      { name: 'disposalCostCents', label: 'Disposal cost of the spent bath', kind: 'number', convert: 'dollars', unit: '$' },
    ],
  },
  form: [
    { name: 'depositionRateUmPerH', label: 'Deposition rate', kind: 'number', convert: 'thicknessPerHour', hint: 'The bath’s measured rate, per hour.' },
    { name: 'phosphorusWtPct', label: 'Phosphorus in the deposit', kind: 'number', unit: '% by weight' },
    { name: 'densityGPerCm3', label: 'Deposit density', kind: 'number', unit: 'g/cm³', optional: true, hint: 'Leave empty to take it from the phosphorus content.' },
  ],
  summary: 'Autocatalytic nickel–phosphorus: thickness from the bath’s rate and time, no current.',
  paramsSchema,
  defaultParams: { depositionRateUmPerH: 15, phosphorusWtPct: 8 },
  templates: EN_TEMPLATES,
  methods: EN_METHODS,
  hazards: ['nickel', 'heat'],
  cautions: () => ['nickel', 'heat'],
  runsWithCurrent: false,
  runConditions: ['temperatureC'],
  // The nickel the predicted deposit took from the bath, and its share of the bath's life.
  runCost: (input, params) => {
    if (!(input.predictedThicknessUm > 0)) return { metalG: 0 };
    const tank = enTankSettings(input.tank.settings);
    const r = electrolessCalc({
      areaDm2: input.areaDm2, thicknessUm: input.predictedThicknessUm, depositionRateUmPerH: params.depositionRateUmPerH, phosphorusWtPct: params.phosphorusWtPct,
      densityGPerCm3: params.densityGPerCm3, bathVolumeL: input.tank.volumeL, nickelMakeUpGPerL: tank.nickelMakeUpGPerL,
    });
    return { metalG: r.nickelConsumedG, bathLife: { metalTurnovers: r.metalTurnovers, costPerMtoCents: (tank.makeUpCostCents + tank.disposalCostCents) / tank.endOfLifeMto } };
  },
  // Thickness is the bath's rate × time in it.
  predictRun: (input, params) => {
    const area = runArea(input);
    if (!(input.minutesPerLoad > 0)) throw new PlatingInputError('minutesPerLoad', 'Minutes per load must be a number greater than 0.');
    return thicknessVerdict(input, area, (params.depositionRateUmPerH * input.minutesPerLoad) / 60);
  },
  tankServes: (tank) => EN_TEMPLATES.some((t) => t.id === tank.templateId),
  price,
  quality: [
    { kind: 'thickness', label: 'Deposit thickness (X-ray fluorescence ASTM B568, or microscopy ASTM B487)' },
    {
      kind: 'phosphorus_content',
      label: 'Phosphorus content of the deposit',
      methods: [
        { id: 'xrf', label: 'X-ray fluorescence' },
        { id: 'icp', label: 'Wet chemistry / ICP on a stripped deposit' },
        { id: 'edx', label: 'Energy-dispersive X-ray (EDX)' },
      ],
    },
    { kind: 'bake', label: 'Heat treatment for hardness or embrittlement relief, where the specification asks' },
  ],
  certificateStatement: (finish, p) => {
    const type = b733TypeFor(p.phosphorusWtPct);
    return `Autocatalytic (electroless) nickel–phosphorus, ${p.phosphorusWtPct} % phosphorus nominal${type ? ` (ASTM B733 Type ${type})` : ''}${finish.specText ? `, to ${finish.specText}` : ''}.`;
  },
};
