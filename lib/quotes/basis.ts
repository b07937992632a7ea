// Pricing bases: how many "units" a line holds when it is priced per piece, per 100, per kg or lb,
// per ft² or dm², or per load. Conversions go through the engine's units module. Pure.
import { fromStorage, PlatingInputError } from '@/lib/plating';
import type { PricingBasis } from '@/db/types';

export const PRICING_BASES: readonly PricingBasis[] = ['piece', 'hundred', 'kg', 'lb', 'ft2', 'dm2', 'load'];

export const BASIS_LABELS: Record<PricingBasis, string> = {
  piece: 'per piece',
  hundred: 'per 100 pieces',
  kg: 'per kg',
  lb: 'per lb',
  ft2: 'per ft²',
  dm2: 'per dm²',
  load: 'per load',
};

export const BASIS_UNITS: Record<PricingBasis, string> = {
  piece: 'pc',
  hundred: '100 pc',
  kg: 'kg',
  lb: 'lb',
  ft2: 'ft²',
  dm2: 'dm²',
  load: 'load',
};

export type BasisFacts = { quantity: number; areaPerPartDm2: number; weightPerPartG: number | null; loads: number };

/** The line's size in the basis unit, e.g. 30 kg of parts, or 13.45 ft² of plated area. */
export function basisQuantity(basis: PricingBasis, facts: BasisFacts): number {
  const { quantity, areaPerPartDm2, weightPerPartG, loads } = facts;
  switch (basis) {
    case 'piece':
      return quantity;
    case 'hundred':
      return quantity / 100;
    case 'dm2':
      return quantity * areaPerPartDm2;
    case 'ft2':
      return fromStorage(quantity * areaPerPartDm2, 'ft2');
    case 'kg':
    case 'lb':
      if (weightPerPartG === null || !(weightPerPartG > 0)) {
        throw new PlatingInputError('basis', `The part has no weight on record, so it cannot be priced ${BASIS_LABELS[basis]}. Add its weight or choose another basis.`);
      }
      return fromStorage(quantity * weightPerPartG, basis);
    case 'load':
      return loads;
    default:
      throw new PlatingInputError('basis', `Unknown pricing basis "${String(basis)}".`);
  }
}

/** Rounds half-up to 4 decimal places of a cent, the precision unit prices are stored in. */
export function roundUnitCents(value: number): number {
  if (!Number.isFinite(value) || value < 0) throw new PlatingInputError('unitPrice', 'A unit price must be a finite amount of at least zero.');
  return Math.floor(value * 10_000 + 0.5 + 1e-6) / 10_000;
}

/** A line total spread over the basis quantity, in cents with 4 decimals. */
export function unitPriceCents(totalCents: number, basis: PricingBasis, facts: BasisFacts): number {
  const units = basisQuantity(basis, facts);
  if (!(units > 0)) throw new PlatingInputError('basis', `The line has no ${BASIS_UNITS[basis]} to price.`);
  return roundUnitCents(totalCents / units);
}
