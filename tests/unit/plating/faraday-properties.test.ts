import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PLATING_METALS, PlatingInputError, plateCalc, thicknessFromCharge } from '@/lib/plating';
import { catchError } from './catch-error';

// Property tests of Faraday's law in both directions (fast-check).

const metal = fc.constantFrom(...PLATING_METALS.map((m) => ({ element: m.element, charge: m.charge })));
// Everyday magnitudes: 0.1 mm² to 100 m², 1 nm to 10 mm, current densities 1 mA/dm² to 1 kA/dm².
const area = fc.double({ min: 1e-3, max: 1e4, noNaN: true });
const thickness = fc.double({ min: 1e-3, max: 1e4, noNaN: true });
const efficiency = fc.double({ min: 1e-3, max: 1, noNaN: true });
const currentDensity = fc.double({ min: 1e-3, max: 1e3, noNaN: true });
// Any positive finite number at all, denormals and 1e308 included.
const anyPositive = fc.double({ min: Number.MIN_VALUE, max: Number.MAX_VALUE, noNaN: true });
const anyEfficiency = fc.double({ min: Number.MIN_VALUE, max: 1, noNaN: true });

describe('Faraday properties', () => {
  it('thickness → amp-hours → thickness round-trips', () => {
    fc.assert(
      fc.property(metal, area, thickness, efficiency, currentDensity, (m, a, t, e, j) => {
        const forward = plateCalc({ ...m, areaDm2: a, thicknessUm: t, efficiency: e, currentDensityAdm2: j });
        const back = thicknessFromCharge({ ...m, areaDm2: a, ampHours: forward.ampHours, efficiency: e });
        expect(Math.abs(back.thicknessUm - t) / t).toBeLessThan(1e-12);
        expect(Math.abs(back.depositMassG - forward.depositMassG) / forward.depositMassG).toBeLessThan(1e-12);
      }),
    );
  });

  it('amp-hours, minutes and mass grow with thickness; amp-hours, current and mass with area', () => {
    fc.assert(
      fc.property(metal, area, thickness, efficiency, currentDensity, fc.double({ min: 1, max: 10, noNaN: true }),
        (m, a, t, e, j, k) => {
          const base = plateCalc({ ...m, areaDm2: a, thicknessUm: t, efficiency: e, currentDensityAdm2: j });
          const thicker = plateCalc({ ...m, areaDm2: a, thicknessUm: t * k, efficiency: e, currentDensityAdm2: j });
          const bigger = plateCalc({ ...m, areaDm2: a * k, thicknessUm: t, efficiency: e, currentDensityAdm2: j });
          expect(thicker.ampHours).toBeGreaterThanOrEqual(base.ampHours);
          expect(thicker.minutes).toBeGreaterThanOrEqual(base.minutes);
          expect(thicker.depositMassG).toBeGreaterThanOrEqual(base.depositMassG);
          expect(bigger.ampHours).toBeGreaterThanOrEqual(base.ampHours);
          expect(bigger.currentA).toBeGreaterThanOrEqual(base.currentA);
          expect(bigger.depositMassG).toBeGreaterThanOrEqual(base.depositMassG);
          // Time depends on current density, not on area.
          expect(Math.abs(bigger.minutes - base.minutes) / base.minutes).toBeLessThan(1e-12);
        }),
    );
  });

  it('lower efficiency never needs fewer amp-hours', () => {
    fc.assert(
      fc.property(metal, area, thickness, efficiency, efficiency, currentDensity, (m, a, t, e1, e2, j) => {
        const [lo, hi] = e1 < e2 ? [e1, e2] : [e2, e1];
        const atLo = plateCalc({ ...m, areaDm2: a, thicknessUm: t, efficiency: lo, currentDensityAdm2: j });
        const atHi = plateCalc({ ...m, areaDm2: a, thicknessUm: t, efficiency: hi, currentDensityAdm2: j });
        expect(atLo.ampHours).toBeGreaterThanOrEqual(atHi.ampHours);
      }),
    );
  });

  it('never returns NaN or Infinity: any valid input gives finite numbers or a PlatingInputError', () => {
    fc.assert(
      fc.property(metal, anyPositive, anyPositive, anyEfficiency, anyPositive, anyPositive, (m, a, t, e, j, ah) => {
        for (const run of [
          () => Object.values(plateCalc({ ...m, areaDm2: a, thicknessUm: t, efficiency: e, currentDensityAdm2: j })),
          () => Object.values(thicknessFromCharge({ ...m, areaDm2: a, ampHours: ah, efficiency: e })),
        ]) {
          let values: number[];
          try {
            values = run();
          } catch (err) {
            expect(err).toBeInstanceOf(PlatingInputError);
            continue;
          }
          for (const v of values) expect(Number.isFinite(v)).toBe(true);
        }
      }),
      { numRuns: 500 },
    );
  });

  const valid = { element: 'Ni', charge: 2, areaDm2: 1, thicknessUm: 10, efficiency: 0.95, currentDensityAdm2: 2 };
  const badNumbers = [0, -1, -Infinity, Number.NaN, Infinity];

  it.each(['areaDm2', 'thicknessUm', 'currentDensityAdm2', 'efficiency'] as const)(
    'refuses 0, negative, NaN and ±Infinity for %s, naming the field',
    (field) => {
      for (const bad of badNumbers) {
        const err = catchError(() => plateCalc({ ...valid, [field]: bad }));
        expect(err).toBeInstanceOf(PlatingInputError);
        expect(err).toMatchObject({ field });
        expect(err.message.length).toBeGreaterThan(20);
      }
    },
  );

  it('refuses an efficiency above 1 and hints at percent', () => {
    const err = catchError(() => plateCalc({ ...valid, efficiency: 95 }));
    expect(err).toMatchObject({ field: 'efficiency' });
    expect(err.message).toMatch(/0\.95/);
    expect(() => plateCalc({ ...valid, efficiency: 1.0000001 })).toThrow(PlatingInputError);
  });

  it('refuses a non-number from untyped callers', () => {
    expect(() => plateCalc({ ...valid, areaDm2: '12' as unknown as number })).toThrow(PlatingInputError);
  });

  it('refuses 1e308 where the result overflows, blaming the out-of-scale input', () => {
    const err = catchError(() => plateCalc({ ...valid, areaDm2: 1e308 }));
    expect(err).toBeInstanceOf(PlatingInputError);
    expect(err).toMatchObject({ field: 'areaDm2' });
    const err2 = catchError(() => thicknessFromCharge({ element: 'Au', charge: 1, areaDm2: 1e-300, ampHours: 1e300, efficiency: 1 }));
    expect(err2).toBeInstanceOf(PlatingInputError);
  });

  it('refuses a vanishing current that would give infinite minutes', () => {
    const err = catchError(() => plateCalc({ ...valid, areaDm2: 1e-200, currentDensityAdm2: 1e-200, thicknessUm: 1e10 }));
    expect(err).toBeInstanceOf(PlatingInputError);
  });
});
