// Showing bath values in the reader's unit system, and verdicts as the UI's status shapes. Pure and
// safe in the browser. Values are stored in the analysis method's unit (g/L, °C, mL/L, pH …); only
// the quantities the units module knows are converted (g/L ↔ oz/gal, °C ↔ °F, kg ↔ lb, L ↔ gal).
import { convert, type UnitId, type UnitSystem, UNITS } from '../plating/units';
import { formatShopTime, shopTimeZone } from '../quality/shop-time';
import type { LimitName, Limits, Verdict, VerdictStatus } from './verdict';

const SYMBOL_TO_ID: Record<string, UnitId> = {
  'g/L': 'g/L',
  'oz/gal': 'oz/gal',
  '°C': 'degC',
  '°F': 'degF',
  kg: 'kg',
  lb: 'lb',
  L: 'L',
  gal: 'gal',
};

const US_EQUIVALENT: Record<string, string> = { 'g/L': 'oz/gal', '°C': '°F', kg: 'lb', L: 'gal' };
const METRIC_EQUIVALENT: Record<string, string> = { 'oz/gal': 'g/L', '°F': '°C', lb: 'kg', gal: 'L' };

/** The unit a value stored in `unit` is shown in for this reader. */
export function displayUnitOf(unit: string, system: UnitSystem): string {
  return (system === 'us' ? US_EQUIVALENT[unit] : METRIC_EQUIVALENT[unit]) ?? unit;
}

/** Converts between two unit symbols; equal symbols pass through; unknown pairs throw a clear message. */
export function convertSymbol(value: number, from: string, to: string): number {
  if (from === to) return value;
  const a = SYMBOL_TO_ID[from];
  const b = SYMBOL_TO_ID[to];
  if (!a || !b) throw new Error(`Cannot convert ${from} to ${to}.`);
  return convert(value, a, b);
}

export function toDisplay(value: number, unit: string, system: UnitSystem): { value: number; unit: string } {
  const shown = displayUnitOf(unit, system);
  return { value: convertSymbol(value, unit, shown), unit: shown };
}

/** Whether a value entered in `entered` can be stored as `stored` (same unit, or a known conversion). */
export function canConvert(entered: string, stored: string): boolean {
  if (entered === stored) return true;
  const a = SYMBOL_TO_ID[entered];
  const b = SYMBOL_TO_ID[stored];
  return !!a && !!b && UNITS[a].quantity === UNITS[b].quantity;
}

export const VERDICT_STATUS: Record<VerdictStatus, 'ok' | 'near' | 'out'> = {
  in_range: 'ok',
  near_limit: 'near',
  out_of_range: 'out',
};

/** Significant-figure rounding for display, without trailing noise (76.2345 → 76.23). */
export function roundForDisplay(value: number, significant = 4): number {
  if (!Number.isFinite(value) || value === 0) return value;
  return Number(value.toPrecision(significant));
}

const LIMIT_WORDS: Record<LimitName, { words: string; key: keyof Limits }> = {
  lower_spec: { words: 'lower specification limit', key: 'lowerSpec' },
  upper_spec: { words: 'upper specification limit', key: 'upperSpec' },
  lower_control: { words: 'lower control limit', key: 'lowerControl' },
  upper_control: { words: 'upper control limit', key: 'upperControl' },
};

/** "Below the lower control limit (48.3 g/L)." in the reader's units. */
export function verdictSentence(verdict: Pick<Verdict, 'status' | 'limit'>, limits: Limits, unit: string, system: UnitSystem): string {
  if (verdict.status === 'in_range' || !verdict.limit) return 'Within the limits.';
  const { words, key } = LIMIT_WORDS[verdict.limit];
  const bound = limits[key];
  const shown = bound === undefined ? '' : ` (${roundForDisplay(toDisplay(bound, unit, system).value)} ${displayUnitOf(unit, system)})`;
  if (verdict.status === 'near_limit') return `Close to the ${words}${shown}.`;
  return `${verdict.limit.startsWith('lower') ? 'Below' : 'Above'} the ${words}${shown}.`;
}

/** A time in the shop's zone, "1 Dec 2026, 07:45 EST", as every screen, PDF and e-mail writes it (server and browser agree). */
export function formatWhen(at: Date | string): string {
  return formatShopTime(at, shopTimeZone());
}
