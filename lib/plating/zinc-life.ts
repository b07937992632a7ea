import { PlatingInputError } from './errors';
import { requirePositive } from './validate';

// Zinc coating life by atmospheric corrosivity category. First-year zinc loss per ISO 9223:2012
// (Table 2, repeated in ISO 12944-2 and ISO 14713-1). Life to first maintenance ≈ thickness ÷ rate,
// linear as ISO 14713-1 tabulates it. Always an estimate: the site's measured category governs.

export const CORROSIVITY_CATEGORIES = ['C1', 'C2', 'C3', 'C4', 'C5', 'CX'] as const;
export type CorrosivityCategory = (typeof CORROSIVITY_CATEGORIES)[number];

export const ZINC_LOSS_UM_PER_YEAR: Record<CorrosivityCategory, { min: number; max: number; name: string }> = {
  C1: { min: 0, max: 0.1, name: 'very low' },
  C2: { min: 0.1, max: 0.7, name: 'low' },
  C3: { min: 0.7, max: 2.1, name: 'medium' },
  C4: { min: 2.1, max: 4.2, name: 'high' },
  C5: { min: 4.2, max: 8.4, name: 'very high' },
  CX: { min: 8.4, max: 25, name: 'extreme' },
};

export const ZINC_LIFE_STANDARD = 'ISO 9223 corrosivity category, zinc loss rates as ISO 14713-1 tabulates them';

export function isCorrosivityCategory(value: unknown): value is CorrosivityCategory {
  return typeof value === 'string' && (CORROSIVITY_CATEGORIES as readonly string[]).includes(value);
}

function requireCategory(value: unknown): CorrosivityCategory {
  if (!isCorrosivityCategory(value)) {
    throw new PlatingInputError('category', `The corrosivity category must be one of ${CORROSIVITY_CATEGORIES.join(', ')} (ISO 9223); got ${String(value)}.`);
  }
  return value;
}

/** maxYears is null where the lowest rate is zero (C1): the life has no upper bound to state. */
export type ZincLife = { minYears: number; maxYears: number | null; lossUmPerYear: { min: number; max: number } };

export function zincServiceLife(input: { thicknessUm: number; category: CorrosivityCategory }): ZincLife {
  const t = requirePositive('thicknessUm', 'Zinc thickness', input.thicknessUm);
  const c = requireCategory(input.category);
  const { min, max } = ZINC_LOSS_UM_PER_YEAR[c];
  return { minYears: t / max, maxYears: min === 0 ? null : t / min, lossUmPerYear: { min, max } };
}

/** The zinc a design life needs, conservatively: at the category's upper rate. */
export function zincThicknessForLife(input: { years: number; category: CorrosivityCategory }): { thicknessUm: number } {
  const years = requirePositive('years', 'Design life', input.years);
  if (years > 200) throw new PlatingInputError('years', `A design life must be at most 200 years; got ${years}.`);
  return { thicknessUm: years * ZINC_LOSS_UM_PER_YEAR[requireCategory(input.category)].max };
}

/** "3.8 to 11.4 years", or "at least 80 years (no upper bound in C1)". */
export function describeZincLife(life: ZincLife, category: CorrosivityCategory): string {
  const y = (v: number) => (v >= 100 ? Math.round(v).toString() : v.toFixed(1));
  return life.maxYears === null ? `at least ${y(life.minYears)} years (no upper bound in ${category})` : `${y(life.minYears)} to ${y(life.maxYears)} years`;
}
