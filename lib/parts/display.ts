// Part figures in the user's units, for pages and the form's previews. Pure and browser-safe.
import { convert, formatNumber, formatStoredQuantity, type UnitSystem } from '@/lib/plating';
import { lengthToMm, type LengthUnit } from './shapes';

export const formatArea = (dm2: number, system: UnitSystem) => formatStoredQuantity(dm2, 'area', system);
export const formatWeight = (g: number, system: UnitSystem) => formatStoredQuantity(g, 'mass', system);

export function formatLength(mm: number, unit: LengthUnit): string {
  return unit === 'mm' ? `${formatNumber(mm, 4)} mm` : `${formatNumber(convert(mm, 'mm', 'mil') / 1000, 4)} in`;
}

/** Solid volume: cm³ in metric, in³ in US units (1 in³ = (25.4 mm)³). */
export function formatVolume(cm3: number, system: UnitSystem): string {
  if (system === 'metric') return `${formatNumber(cm3, 3)} cm³`;
  const cm3PerIn3 = lengthToMm(1, 'in') ** 3 / 1000;
  return `${formatNumber(cm3 / cm3PerIn3, 3)} in³`;
}
