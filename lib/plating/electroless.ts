import { PlatingInputError } from './errors';
import { requireFiniteResults, requirePositive } from './validate';

// Electroless (autocatalytic) nickel–phosphorus: no current; thickness is the bath's deposition
// rate × time, set per bath from the shop's own measurements. The deposit is nickel with some
// phosphorus, so the nickel taken from the bath is the deposit's mass less its phosphorus. One metal
// turnover (MTO) is the bath's make-up nickel replaced once (common practice).

/**
 * Deposit density against phosphorus content, wt % P → g/cm³, interpolated linearly and flat past
 * the ends. 0 % is pure nickel, 8.908 g/cm³ (CRC Handbook). The rest is from memory: about 8.5 at
 * low P, about 7.9 at 8–9 % P, about 7.75 at high P; the shop's own measured density governs.
 */
export const EN_DENSITY_BY_PHOSPHORUS: readonly (readonly [number, number])[] = [
  [0, 8.908],
  [3, 8.5],
  [8.5, 7.9],
  [11, 7.75],
];

const MAX_PHOSPHORUS_PCT = 15; // nickel–phosphorus deposits hold at most about 15 % P (physical range)
const MAX_RATE_UM_PER_H = 100; // a guard against a unit typed wrong: real baths run about 10–25 µm/h

export function densityForPhosphorus(phosphorusWtPct: number): number {
  const p = requirePhosphorus(phosphorusWtPct);
  const table = EN_DENSITY_BY_PHOSPHORUS;
  if (p <= table[0]![0]) return table[0]![1];
  for (let i = 1; i < table.length; i += 1) {
    const [p1, d1] = table[i]!;
    const [p0, d0] = table[i - 1]!;
    if (p <= p1) return d0 + ((d1 - d0) * (p - p0)) / (p1 - p0);
  }
  return table[table.length - 1]![1];
}

function requirePhosphorus(value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || value > MAX_PHOSPHORUS_PCT) {
    throw new PlatingInputError('phosphorusWtPct', `Phosphorus content must be from 0 to ${MAX_PHOSPHORUS_PCT} % by weight; got ${String(value)}.`);
  }
  return value;
}

export type ElectrolessInput = {
  areaDm2: number;
  thicknessUm: number;
  depositionRateUmPerH: number;
  phosphorusWtPct: number;
  densityGPerCm3?: number;
  bathVolumeL: number;
  nickelMakeUpGPerL: number;
};

export type ElectrolessResult = {
  minutes: number;
  depositMassG: number;
  nickelConsumedG: number;
  phosphorusG: number;
  metalTurnovers: number;
  densityGPerCm3: number;
};

export function electrolessCalc(input: ElectrolessInput): ElectrolessResult {
  const areaDm2 = requirePositive('areaDm2', 'Area', input.areaDm2);
  const thicknessUm = requirePositive('thicknessUm', 'Deposit thickness', input.thicknessUm);
  const rate = requirePositive('depositionRateUmPerH', 'Deposition rate', input.depositionRateUmPerH);
  if (rate > MAX_RATE_UM_PER_H) throw new PlatingInputError('depositionRateUmPerH', `A deposition rate above ${MAX_RATE_UM_PER_H} µm/h is not an electroless bath; got ${rate}. Check the unit.`);
  const p = requirePhosphorus(input.phosphorusWtPct);
  let density: number;
  if (input.densityGPerCm3 === undefined) density = densityForPhosphorus(p);
  else {
    density = requirePositive('densityGPerCm3', 'Deposit density', input.densityGPerCm3);
    if (density > 25) throw new PlatingInputError('densityGPerCm3', `Deposit density must be in g/cm³ (about 8 for nickel–phosphorus); got ${density}.`);
  }
  const volumeL = requirePositive('bathVolumeL', 'Bath volume', input.bathVolumeL);
  const makeUp = requirePositive('nickelMakeUpGPerL', 'Nickel at make-up', input.nickelMakeUpGPerL);
  if (makeUp > 50) throw new PlatingInputError('nickelMakeUpGPerL', `Nickel at make-up must be in g/L (about 6 for most baths); got ${makeUp}.`);
  // dm² × 100 cm²/dm² × µm × 1e-4 cm/µm = cm³
  const volumeCm3 = areaDm2 * thicknessUm * 0.01;
  const depositMassG = volumeCm3 * density;
  const phosphorusG = (depositMassG * p) / 100;
  const nickelConsumedG = depositMassG - phosphorusG;
  const result = {
    minutes: (thicknessUm / rate) * 60,
    depositMassG,
    nickelConsumedG,
    phosphorusG,
    metalTurnovers: nickelConsumedG / (volumeL * makeUp),
    densityGPerCm3: density,
  };
  requireFiniteResults(result, { areaDm2, thicknessUm, depositionRateUmPerH: rate, bathVolumeL: volumeL });
  return result;
}

/** Metal turnovers from nickel put back: the bath's age as platers count it. */
export function metalTurnoversFromReplenishment(input: { nickelReplenishedG: number; bathVolumeL: number; nickelMakeUpGPerL: number }): number {
  const g = input.nickelReplenishedG;
  if (typeof g !== 'number' || !Number.isFinite(g) || g < 0) throw new PlatingInputError('nickelReplenishedG', `Nickel replenished must be a finite amount of at least 0 g; got ${String(g)}.`);
  const volumeL = requirePositive('bathVolumeL', 'Bath volume', input.bathVolumeL);
  const makeUp = requirePositive('nickelMakeUpGPerL', 'Nickel at make-up', input.nickelMakeUpGPerL);
  return g / (volumeL * makeUp);
}
