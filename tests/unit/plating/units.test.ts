import fc from 'fast-check';
import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  PlatingInputError,
  UNITS,
  convert,
  displayUnit,
  formatNumber,
  formatQuantity,
  formatStoredQuantity,
  fromStorage,
  toStorage,
  unitsOf,
  type Quantity,
  type UnitId,
} from '@/lib/plating';
import { catchError } from './catch-error';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('unit factors against NIST SP 811', () => {
  // Source: NIST SP 811 (2008), Appendix B.8 "Factors for units listed alphabetically". Exact
  // definitions: inch = 2.54 E−02 m; mil = 2.54 E−05 m; microinch = 2.54 E−08 m;
  // square inch = 6.4516 E−04 m²; square foot = 9.290304 E−02 m²; gallon [U.S.] = 231 in³
  // = 3.785411784 E−03 m³; pound (avoirdupois) = 4.5359237 E−01 kg;
  // ounce (troy) = 3.110 347 68 E−02 kg; t/°C = (t/°F − 32)/1.8.
  it.each<[UnitId, number]>([
    ['mm', 1000],
    ['mil', 25.4],
    ['tenth', 2.54],
    ['uin', 0.0254],
    ['cm2', 0.01],
    ['m2', 100],
    ['in2', 0.064516],
    ['ft2', 9.290304],
    ['gal', 3.785411784],
    ['kg', 1000],
    ['lb', 453.59237],
    ['ozt', 31.1034768],
  ])('1 %s = %d storage units (exact)', (u, expected) => {
    expect(rel(toStorage(1, u), expected)).toBeLessThan(1e-15);
  });

  it('US gallon is 231 cubic inches', () => {
    // Source: NIST SP 811 App. B.8 footnote (gallon [U.S.] defined as 231 in³).
    expect(rel(toStorage(1, 'gal'), 231 * 2.54 ** 3 / 1000)).toBeLessThan(1e-15);
  });

  it('oz/gal → g/L is 7.489 152 (SP 811 B.8: ounce (avoirdupois) per gallon [U.S.])', () => {
    // Source: NIST SP 811 App. B.8, 7.489 152 E+00 kg/m³ (= g/L); reference §1.1 gives 7.4892.
    expect(toStorage(1, 'oz/gal')).toBeCloseTo(7.489152, 6);
  });

  it('A/dm² ↔ A/ft²: 1 A/dm² = 9.2903 ASF, 1 ASF = 0.10764 A/dm²', () => {
    // Source: reference §1.1 (1 ft² = 9.290304 dm², SP 811 B.8); S4 prints 9.29 and 0.108.
    expect(fromStorage(1, 'A/ft2')).toBeCloseTo(9.2903, 4);
    expect(toStorage(1, 'A/ft2')).toBeCloseTo(0.10764, 5);
    expect(toStorage(1, 'mA/cm2')).toBeCloseTo(0.1, 15);
  });

  it.each([
    [32, 0],
    [212, 100],
    [-40, -40],
    [98.6, 37],
  ])('%d °F = %d °C', (f, c) => {
    // Source: NIST SP 811 App. B.8, t/°C = (t/°F − 32)/1.8.
    expect(toStorage(f, 'degF')).toBeCloseTo(c, 12);
    expect(fromStorage(c, 'degF')).toBeCloseTo(f, 12);
  });
});

describe('unit factors cross-checked with mathjs', () => {
  // Source: the mathjs npm package's unit definitions (independent of ours).
  const cases: [UnitId, string, string][] = [
    ['mm', '1 mm', 'um'],
    ['mil', '1 mil', 'um'],
    ['tenth', '0.0001 in', 'um'],
    ['uin', '0.000001 in', 'um'],
    ['cm2', '1 cm^2', 'dm^2'],
    ['m2', '1 m^2', 'dm^2'],
    ['in2', '1 in^2', 'dm^2'],
    ['ft2', '1 ft^2', 'dm^2'],
    ['A/ft2', '1 A/ft^2', 'A/dm^2'],
    ['mA/cm2', '1 mA/cm^2', 'A/dm^2'],
    ['gal', '1 gal', 'L'],
    ['kg', '1 kg', 'g'],
    ['lb', '1 lbm', 'g'],
    ['ozt', '480 grain', 'g'], // a troy ounce is 480 grains; mathjs has no troy ounce
    ['oz/gal', '1 oz/gal', 'g/L'],
  ];
  it.each(cases)('%s matches mathjs "%s" in %s', (ours, theirs, storage) => {
    expect(rel(toStorage(1, ours), unit(theirs).toNumber(storage))).toBeLessThan(1e-12);
  });

  it('temperatures match mathjs degF → degC', () => {
    fc.assert(
      fc.property(fc.double({ min: -400, max: 5000, noNaN: true }), (f) => {
        expect(toStorage(f, 'degF')).toBeCloseTo(unit(f, 'degF').toNumber('degC'), 9);
      }),
    );
  });
});

describe('storage round trips and display', () => {
  const allUnits = Object.keys(UNITS) as UnitId[];

  it('fromStorage(toStorage(x)) returns x for every unit', () => {
    fc.assert(
      fc.property(fc.constantFrom(...allUnits), fc.double({ min: 1e-6, max: 1e9, noNaN: true }), (u, x) => {
        // Absolute floor for °F, whose −32 offset cancels digits of small values.
        const tolerance = 1e-12 * Math.max(Math.abs(x), UNITS[u].quantity === 'temperature' ? 100 : 0);
        expect(Math.abs(fromStorage(toStorage(x, u), u) - x)).toBeLessThanOrEqual(tolerance);
      }),
    );
  });

  it('convert goes through storage: 0.5 mil = 12.7 µm = 5 tenths = 500 µin', () => {
    expect(convert(0.5, 'mil', 'um')).toBeCloseTo(12.7, 12);
    expect(convert(0.5, 'mil', 'tenth')).toBeCloseTo(5, 12);
    expect(convert(0.5, 'mil', 'uin')).toBeCloseTo(500, 9);
  });

  it('maps each quantity to a display unit of the same quantity in both systems', () => {
    const quantities: Quantity[] = ['thickness', 'area', 'currentDensity', 'volume', 'mass', 'temperature', 'concentration'];
    for (const q of quantities) {
      for (const system of ['metric', 'us'] as const) {
        expect(unitsOf(q)).toContain(displayUnit(q, system));
      }
    }
    expect(displayUnit('thickness', 'metric')).toBe('um');
    expect(displayUnit('currentDensity', 'us')).toBe('A/ft2');
  });

  it('formats with sensible significant figures', () => {
    expect(formatQuantity(12.3456, 'um')).toBe('12.3 µm');
    expect(formatQuantity(0.000512, 'mil')).toBe('0.000512 mil');
    expect(formatQuantity(12345, 'A/ft2')).toBe('12300 A/ft²');
    expect(formatQuantity(9.9996, 'g')).toBe('10.0 g');
    expect(formatQuantity(-40, 'degF')).toBe('-40.0 °F');
    expect(formatQuantity(0, 'L')).toBe('0 L');
    expect(formatQuantity(7.489152, 'g/L', { significantFigures: 5 })).toBe('7.4892 g/L');
    expect(formatStoredQuantity(12.7, 'thickness', 'us')).toBe('0.500 mil');
    expect(formatNumber(1e-12)).toBe('1.00e-12');
  });

  it('refuses unknown units, mixed quantities, non-numbers and sub-absolute-zero temperatures', () => {
    expect(catchError(() => toStorage(1, 'furlong' as UnitId))).toMatchObject({ field: 'unit' });
    expect(() => convert(1, 'mil', 'dm2')).toThrow(/Cannot convert/);
    expect(() => toStorage(Number.NaN, 'um')).toThrow(PlatingInputError);
    expect(() => toStorage(Infinity, 'um')).toThrow(PlatingInputError);
    expect(() => toStorage(-500, 'degF')).toThrow(/absolute zero/);
    expect(() => formatQuantity(Infinity, 'um')).toThrow(PlatingInputError);
  });
});
