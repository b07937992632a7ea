// Part figures in the user's units, for pages and the form's previews. Pure and browser-safe.
import { lengthFromMm, unitSymbol, volumeFromCm3 } from '@/lib/estimating/display-units';
import { formatNumber, formatStoredQuantity, type UnitSystem } from '@/lib/plating';
import type { LengthUnit } from './shapes';

export const formatArea = (dm2: number, system: UnitSystem) => formatStoredQuantity(dm2, 'area', system);
export const formatWeight = (g: number, system: UnitSystem) => formatStoredQuantity(g, 'mass', system);

export function formatLength(mm: number, unit: LengthUnit): string {
  return `${formatNumber(lengthFromMm(mm, unit), 4)} ${unit}`;
}

/** Solid volume: cm³ in metric, in³ in US units. */
export function formatVolume(cm3: number, system: UnitSystem): string {
  const v = volumeFromCm3(cm3, system);
  return `${formatNumber(v.value, 3)} ${unitSymbol(v.unit)}`;
}
