import { PlatingInputError } from './errors';
import { requireFiniteResults, requireNonNegative, requirePositive } from './validate';

// Sulfuric and hard anodizing: the anodic oxide grows with the charge passed per area. The trade's
// "720 rule" says a mil of oxide takes 720 A·min per ft² (12 A/ft² for 60 min, 24 A/ft² for 30 min).
// It is an estimate: alloy, temperature and acid move the real figure, so a tank or alloy may carry
// its own measured constant instead. About half a hard coating grows outward and half penetrates
// the metal (common practice); Type II grows outward about a third (from memory).

const FT2_DM2 = 9.290304; // (3.048 dm)², exact per NIST SP 811
const MIL_UM = 25.4; // 0.001 in, exact

/** 720 A·min/ft² per mil in A·min/dm² per µm: 720 ÷ 9.290304 ÷ 25.4 = 3.0512 (computed). */
export const ANODIZE_720_CONSTANT = 720 / FT2_DM2 / MIL_UM;

// Physical range: thicker than ~250 µm is beyond any sulfuric or hard coat; above ~10 A/dm² the
// bath burns the work (both common practice, a guard against a unit typed wrong, not a spec).
const MAX_THICKNESS_UM = 250;
const MAX_CURRENT_DENSITY_ADM2 = 10;

export type AnodizeInput = {
  areaDm2: number;
  thicknessUm: number;
  currentDensityAdm2: number;
  /** Share of the coating that grows outward from the original surface, 0–1 (hard ≈ 0.5). */
  growthFraction: number;
  /** A·min/dm² per µm; defaults to the 720 rule. */
  constantAminPerDm2PerUm?: number;
};

export type AnodizeResult = { minutes: number; currentA: number; ampHours: number; growthUm: number; penetrationUm: number };

function requireCurrentDensity(value: unknown): number {
  const cd = requirePositive('currentDensityAdm2', 'Current density', value);
  if (cd > MAX_CURRENT_DENSITY_ADM2) {
    throw new PlatingInputError('currentDensityAdm2', `Current density must be at most ${MAX_CURRENT_DENSITY_ADM2} A/dm² for anodizing; got ${cd}. Check the unit (1 A/dm² ≈ 9.3 A/ft²).`);
  }
  return cd;
}

function requireConstant(value: unknown): number {
  if (value === undefined) return ANODIZE_720_CONSTANT;
  const k = requirePositive('constantAminPerDm2PerUm', 'The anodizing constant', value);
  if (k > 100) throw new PlatingInputError('constantAminPerDm2PerUm', `The anodizing constant must be in A·min/dm² per µm (about 3 for sulfuric acid); got ${k}.`);
  return k;
}

export function requireGrowthFraction(value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || value > 1) {
    throw new PlatingInputError('growthFraction', `The share of the coating that grows outward must be a fraction from 0 to 1; got ${String(value)}.`);
  }
  return value;
}

/** Time, current and charge for an anodic coating, and how it splits into growth and penetration. */
export function anodizeCalc(input: AnodizeInput): AnodizeResult {
  const areaDm2 = requirePositive('areaDm2', 'Area', input.areaDm2);
  const thicknessUm = requirePositive('thicknessUm', 'Coating thickness', input.thicknessUm);
  if (thicknessUm > MAX_THICKNESS_UM) throw new PlatingInputError('thicknessUm', `An anodic coating thicker than ${MAX_THICKNESS_UM} µm is outside what sulfuric or hard anodizing makes; got ${thicknessUm}.`);
  const cd = requireCurrentDensity(input.currentDensityAdm2);
  const growth = requireGrowthFraction(input.growthFraction);
  const k = requireConstant(input.constantAminPerDm2PerUm);
  const minutes = (thicknessUm * k) / cd;
  const currentA = areaDm2 * cd;
  const result = { minutes, currentA, ampHours: (currentA * minutes) / 60, growthUm: thicknessUm * growth, penetrationUm: thicknessUm * (1 - growth) };
  requireFiniteResults(result, { areaDm2, thicknessUm, currentDensityAdm2: cd });
  return result;
}

/** The reverse: the coating a time at a current density makes. */
export function anodizeThicknessFromTime(input: { minutes: number; currentDensityAdm2: number; constantAminPerDm2PerUm?: number }): { thicknessUm: number } {
  const minutes = requirePositive('minutes', 'Time', input.minutes);
  const cd = requireCurrentDensity(input.currentDensityAdm2);
  const k = requireConstant(input.constantAminPerDm2PerUm);
  const thicknessUm = (minutes * cd) / k;
  requireFiniteResults({ thicknessUm }, { minutes, currentDensityAdm2: cd });
  return { thicknessUm };
}

/** How the part's size changes: each surface moves out by the growth; a diameter by twice that. */
export function anodizeDimensionChange(growthUm: number): { perSurfaceUm: number; onDiameterUm: number } {
  const g = requireNonNegative('growthUm', 'Outward growth', growthUm);
  return { perSurfaceUm: g, onDiameterUm: 2 * g };
}
