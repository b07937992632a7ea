import { PlatingInputError } from './errors';

// The one place where units are converted. Every quantity is stored in one SI-ish unit (µm, dm²,
// A/dm², L, g, °C, g/L); the rest are converted through it. Factors are exact per NIST SP 811
// Appendix B.8: 1 in = 0.0254 m, 1 US gal = 3.785411784 L, 1 lb = 0.45359237 kg,
// 1 troy oz = 31.1034768 g, 1 oz (avoirdupois) = 28.349523125 g (= lb/16), t/°C = (t/°F − 32)/1.8.

export type Quantity =
  | 'thickness'
  | 'area'
  | 'currentDensity'
  | 'volume'
  | 'mass'
  | 'temperature'
  | 'concentration';

export type UnitSystem = 'metric' | 'us';

type UnitDef = {
  readonly quantity: Quantity;
  readonly symbol: string;
  readonly name: string;
  // storage value = (value − zero) × scale
  readonly scale: number;
  readonly zero?: number;
};

const INCH_UM = 25_400; // 0.0254 m
const INCH2_DM2 = 0.064516; // (0.254 dm)²
const FOOT2_DM2 = 9.290304; // (3.048 dm)²
const GALLON_L = 3.785411784;
const POUND_G = 453.59237;
const TROY_OUNCE_G = 31.1034768;
const OUNCE_G = POUND_G / 16; // avoirdupois

export const UNITS = {
  um: { quantity: 'thickness', symbol: 'µm', name: 'micrometre', scale: 1 },
  mm: { quantity: 'thickness', symbol: 'mm', name: 'millimetre', scale: 1000 },
  mil: { quantity: 'thickness', symbol: 'mil', name: 'mil (0.001 in)', scale: INCH_UM / 1000 },
  tenth: { quantity: 'thickness', symbol: 'tenths', name: 'tenth (0.0001 in)', scale: INCH_UM / 10_000 },
  uin: { quantity: 'thickness', symbol: 'µin', name: 'microinch', scale: INCH_UM / 1_000_000 },

  dm2: { quantity: 'area', symbol: 'dm²', name: 'square decimetre', scale: 1 },
  cm2: { quantity: 'area', symbol: 'cm²', name: 'square centimetre', scale: 0.01 },
  m2: { quantity: 'area', symbol: 'm²', name: 'square metre', scale: 100 },
  in2: { quantity: 'area', symbol: 'in²', name: 'square inch', scale: INCH2_DM2 },
  ft2: { quantity: 'area', symbol: 'ft²', name: 'square foot', scale: FOOT2_DM2 },

  'A/dm2': { quantity: 'currentDensity', symbol: 'A/dm²', name: 'ampere per square decimetre', scale: 1 },
  'A/ft2': { quantity: 'currentDensity', symbol: 'A/ft²', name: 'ampere per square foot (ASF)', scale: 1 / FOOT2_DM2 },
  'mA/cm2': { quantity: 'currentDensity', symbol: 'mA/cm²', name: 'milliampere per square centimetre', scale: 0.1 },

  L: { quantity: 'volume', symbol: 'L', name: 'litre', scale: 1 },
  gal: { quantity: 'volume', symbol: 'gal', name: 'US gallon', scale: GALLON_L },

  g: { quantity: 'mass', symbol: 'g', name: 'gram', scale: 1 },
  kg: { quantity: 'mass', symbol: 'kg', name: 'kilogram', scale: 1000 },
  ozt: { quantity: 'mass', symbol: 'oz t', name: 'troy ounce', scale: TROY_OUNCE_G },
  lb: { quantity: 'mass', symbol: 'lb', name: 'pound (avoirdupois)', scale: POUND_G },

  degC: { quantity: 'temperature', symbol: '°C', name: 'degree Celsius', scale: 1 },
  degF: { quantity: 'temperature', symbol: '°F', name: 'degree Fahrenheit', scale: 1 / 1.8, zero: 32 },

  'g/L': { quantity: 'concentration', symbol: 'g/L', name: 'gram per litre', scale: 1 },
  'oz/gal': { quantity: 'concentration', symbol: 'oz/gal', name: 'ounce (avoirdupois) per US gallon', scale: OUNCE_G / GALLON_L },
} as const satisfies Record<string, UnitDef>;

export type UnitId = keyof typeof UNITS;
export type UnitOf<Q extends Quantity> = {
  [U in UnitId]: (typeof UNITS)[U]['quantity'] extends Q ? U : never;
}[UnitId];

export const STORAGE_UNIT = {
  thickness: 'um',
  area: 'dm2',
  currentDensity: 'A/dm2',
  volume: 'L',
  mass: 'g',
  temperature: 'degC',
  concentration: 'g/L',
} as const satisfies { [Q in Quantity]: UnitOf<Q> };

const DISPLAY_UNIT = {
  metric: STORAGE_UNIT,
  us: {
    thickness: 'mil',
    area: 'ft2',
    currentDensity: 'A/ft2',
    volume: 'gal',
    mass: 'lb',
    temperature: 'degF',
    concentration: 'oz/gal',
  },
} as const satisfies Record<UnitSystem, { [Q in Quantity]: UnitOf<Q> }>;

const ABSOLUTE_ZERO_C = -273.15;

export function isUnitId(unit: string): unit is UnitId {
  return Object.prototype.hasOwnProperty.call(UNITS, unit);
}

export function unitInfo(unit: string): UnitDef & { id: UnitId } {
  if (!isUnitId(unit)) {
    throw new PlatingInputError('unit', `Unknown unit "${unit}". Known units: ${Object.keys(UNITS).join(', ')}.`);
  }
  return { id: unit, ...UNITS[unit] };
}

export function unitsOf<Q extends Quantity>(quantity: Q): UnitOf<Q>[] {
  return (Object.keys(UNITS) as UnitId[]).filter((u) => UNITS[u].quantity === quantity) as UnitOf<Q>[];
}

function requireValue(value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new PlatingInputError('value', `A value to convert must be a finite number; got ${String(value)}.`);
  }
  return value;
}

function checkTemperature(storage: number): number {
  if (storage < ABSOLUTE_ZERO_C) {
    throw new PlatingInputError('value', `That temperature is below absolute zero (${storage} °C).`);
  }
  return storage;
}

export function toStorage(value: number, unit: UnitId): number {
  const def = unitInfo(unit);
  const storage = (requireValue(value) - (def.zero ?? 0)) * def.scale;
  return def.quantity === 'temperature' ? checkTemperature(storage) : storage;
}

export function fromStorage(value: number, unit: UnitId): number {
  const def = unitInfo(unit);
  const v = requireValue(value);
  if (def.quantity === 'temperature') checkTemperature(v);
  return v / def.scale + (def.zero ?? 0);
}

export function convert(value: number, from: UnitId, to: UnitId): number {
  const a = unitInfo(from);
  const b = unitInfo(to);
  if (a.quantity !== b.quantity) {
    throw new PlatingInputError('unit', `Cannot convert ${a.name} (${a.quantity}) to ${b.name} (${b.quantity}).`);
  }
  return fromStorage(toStorage(value, from), to);
}

export function displayUnit<Q extends Quantity>(quantity: Q, system: UnitSystem): UnitOf<Q> {
  const table = DISPLAY_UNIT[system] as { [K in Quantity]: UnitOf<K> } | undefined;
  if (!table || !(quantity in table)) {
    throw new PlatingInputError('quantity', `No display unit for ${String(quantity)} in the ${String(system)} system.`);
  }
  return table[quantity];
}

export type FormatOptions = { significantFigures?: number };

// Rounds to a few significant figures without scientific notation for everyday magnitudes, so
// 0.000512 mil stays readable and 12 345 A/ft² does not print 12345.000.
export function formatNumber(value: number, significantFigures = 3): string {
  const v = requireValue(value);
  if (!Number.isInteger(significantFigures) || significantFigures < 1 || significantFigures > 15) {
    throw new PlatingInputError('significantFigures', 'Significant figures must be a whole number from 1 to 15.');
  }
  const rounded = Number(v.toPrecision(significantFigures));
  if (rounded === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(rounded)));
  if (magnitude >= 15 || magnitude < -9) return rounded.toPrecision(significantFigures);
  return rounded.toFixed(Math.max(0, significantFigures - 1 - magnitude));
}

export function formatQuantity(value: number, unit: UnitId, options: FormatOptions = {}): string {
  const def = unitInfo(unit);
  return `${formatNumber(value, options.significantFigures)} ${def.symbol}`;
}

// A stored value shown in the user's preferred system, e.g. 12.7 µm → "0.500 mil".
export function formatStoredQuantity(
  storageValue: number,
  quantity: Quantity,
  system: UnitSystem,
  options: FormatOptions = {},
): string {
  const unit = displayUnit(quantity, system);
  return formatQuantity(fromStorage(storageValue, unit), unit, options);
}
