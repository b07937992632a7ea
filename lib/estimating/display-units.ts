// Units the workbench shows that the engine's unit table does not list (lengths of part dimensions,
// part volume, drag-out per area). Every factor is built from the exact factors in
// lib/plating/units.ts, so there is still only one source of conversion constants. Pure.
import { convert, isUnitId, toStorage, UNITS, type UnitSystem } from '@/lib/plating';
import type { LengthUnit } from '@/lib/parts/shapes';

export type DragOutUnit = 'L/m2' | 'gal/1000ft2';

export const LENGTH_UNIT: Record<UnitSystem, LengthUnit> = { metric: 'mm', us: 'in' };
// Drag-out per 1000 ft² is how US pollution-prevention guides quote it (from memory).
export const DRAG_OUT_UNIT: Record<UnitSystem, DragOutUnit> = { metric: 'L/m2', us: 'gal/1000ft2' };
export const DRAG_OUT_UNITS = ['L/m2', 'gal/1000ft2'] as const satisfies readonly DragOutUnit[];

export const UNIT_SYMBOLS: Record<string, string> = {
  mm: 'mm',
  in: 'in',
  cm3: 'cm³',
  in3: 'in³',
  'L/m2': 'L/m²',
  'gal/1000ft2': 'gal/1000 ft²',
};

// 1 in = 1000 mil; the mil factor (25.4 µm) is the engine's. The inverse is lengthToMm in lib/parts/shapes.ts.
const mmPerInch = () => convert(1000, 'mil', 'mm');

export function lengthFromMm(mm: number, unit: LengthUnit): number {
  return unit === 'mm' ? mm : mm / mmPerInch();
}

export function volumeFromCm3(cm3: number, system: UnitSystem): { value: number; unit: 'cm3' | 'in3' } {
  if (system === 'metric') return { value: cm3, unit: 'cm3' };
  const cmPerInch = mmPerInch() / 10;
  return { value: cm3 / cmPerInch ** 3, unit: 'in3' };
}

const DM2_PER_M2 = 100;

// L/m² ↔ gal per 1000 ft², through the engine's gallon and square-foot factors.
function litresPerM2PerUsUnit(): number {
  return toStorage(1, 'gal') / (toStorage(1000, 'ft2') / DM2_PER_M2);
}

export function dragOutToStorage(value: number, unit: DragOutUnit): number {
  return unit === 'L/m2' ? value : value * litresPerM2PerUsUnit();
}

export function dragOutFromStorage(lPerM2: number, unit: DragOutUnit): number {
  return unit === 'L/m2' ? lPerM2 : lPerM2 / litresPerM2PerUsUnit();
}

/** The symbol to print after a value: the engine's symbol for its own units, ours for the rest. */
export function unitSymbol(unit: string): string {
  return isUnitId(unit) ? UNITS[unit].symbol : (UNIT_SYMBOLS[unit] ?? unit);
}
