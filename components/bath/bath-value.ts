import type { UnitSystem } from '@/lib/plating/units';
import { roundForDisplay, toDisplay } from '@/lib/bath/display';
import { formatUnitValue } from '../unit-value';

/** A stored bath value as text in the reader's units: "76.2 g/L" or "10.17 oz/gal". */
export function formatBathValue(value: number | null | undefined, unit: string, system: UnitSystem, significant = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return formatUnitValue(null, unit);
  const shown = toDisplay(value, unit, system);
  return formatUnitValue(roundForDisplay(shown.value, significant), shown.unit, { digits: undefined });
}
