// Benchmark of the process families' calculations: the workbench calculators the page recomputes on
// every keystroke, and a family's whole line price, each timed against the 16 ms of one frame at
// 60 Hz. Run alone with `npm run bench -- families`.
import { FAMILIES, priceFinishLine } from '../../lib/families';
import type { PricingInput } from '../../lib/quotes/pricing';
import { quantile } from './stats';
import type { BenchRow } from './types';

const FRAME_MS = 16;
const WARM_UP = 200;
const RUNS = 2000;

function timeIt(fn: (i: number) => void): { median: number; p99: number } {
  const times: number[] = [];
  for (let i = 0; i < WARM_UP + RUNS; i++) {
    const t0 = performance.now();
    fn(i);
    const ms = performance.now() - t0;
    if (i >= WARM_UP) times.push(ms);
  }
  return { median: quantile(times, 0.5), p99: quantile(times, 0.99) };
}

const rates: PricingInput['rates'] = {
  labourPerHourCents: 4200, tankHourRackCents: 3500, tankHourBarrelCents: 2800, metalPerKgCents: { Ni: 2200 }, additivesPerKahCents: 180,
  powerPerKwhCents: 14, bakePerLoadCents: 4500, lotChargeCents: 3500, minimumChargeCents: 12500, rushMultiplierPct: 150, marginPct: 35,
};
const shop = { rectifierMaxA: 1500, rectifierEfficiency: 0.85, dragOutLPerM2: 0.05, bathMetalGPerL: 0, anodeLossPercent: 0, anodes: 'insoluble' as const };
const finish = { distributionRatio: 0.9, tankVolts: 16, handlingMinutesPerLoad: 20, maskingPerPieceCents: 0, bakeRequired: false, bakeThresholdHrc: null, method: 'rack' as const, efficiency: 1, partsPerLoad: 40 };
const LINES: { what: string; input: PricingInput }[] = [
  {
    what: 'anodizing line price',
    input: { part: { areaDm2: 1.45, weightG: 118, hardnessHrc: null, tensileMpa: null }, finish: { ...finish, family: 'anodizing', familyParams: { coatingType: 'II', growthFraction: 0.33, seal: 'hot_water', sealMinutes: 30 }, element: 'Al', ionCharge: 3, minThicknessUm: 10, currentDensityAdm2: 1.5 }, process: { ...shop, tank: { volumeL: 2500, settings: {} } }, rates, quantity: 300, isRush: false, basis: 'piece' },
  },
  {
    what: 'electroless nickel line price',
    input: { part: { areaDm2: 4.6, weightG: 2950, hardnessHrc: null, tensileMpa: null }, finish: { ...finish, family: 'electroless_nickel', familyParams: { depositionRateUmPerH: 15, phosphorusWtPct: 8 }, element: 'Ni', ionCharge: 2, minThicknessUm: 25, currentDensityAdm2: 0 }, process: { ...shop, tank: { volumeL: 400, settings: { nickelMakeUpGPerL: 6, endOfLifeMto: 8, makeUpCostCents: 184000, disposalCostCents: 96000 } } }, rates, quantity: 24, isRush: false, basis: 'piece' },
  },
];

const row = (what: string, t: { median: number; p99: number }): BenchRow => ({
  area: 'families',
  what: `${what} (median of ${RUNS}; p99 ${t.p99.toFixed(4)} ms)`,
  value: `${t.median.toFixed(4)} ms`,
  baseline: `one frame ${FRAME_MS} ms`,
  ratio: Number((t.median / FRAME_MS).toFixed(5)),
  target: '< 1× (inside one frame)',
  met: t.median < FRAME_MS,
});

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const calc of FAMILIES.flatMap((f) => f.calculators)) {
    const base = Object.fromEntries(calc.inputs.map((i) => [i.name, i.initial]));
    const numeric = calc.inputs.find((i) => i.kind === 'number' && typeof i.initial === 'number')!;
    // Each run changes one input, as a keystroke does.
    rows.push(row(`calculator: ${calc.title}`, timeIt((i) => calc.compute({ ...base, [numeric.name]: (numeric.initial as number) * (1 + (i % 50) / 100) }))));
  }
  for (const l of LINES) rows.push(row(l.what, timeIt((i) => priceFinishLine({ ...l.input, quantity: l.input.quantity + (i % 100) }))));
  return rows;
}
