// The engine's figures for anodizing, electroless nickel, zinc coating life and passivation,
// checked against sources outside the project. Each check names its source.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ANODIZE_720_CONSTANT,
  anodizeCalc,
  anodizeDimensionChange,
  anodizeThicknessFromTime,
  checkPassivation,
  CORROSIVITY_CATEGORIES,
  DEFAULT_PASSIVATION_WINDOWS,
  densityForPhosphorus,
  describeZincLife,
  electrolessCalc,
  fromStorage,
  metalTurnoversFromReplenishment,
  PlatingInputError,
  toStorage,
  zincServiceLife,
  zincThicknessForLife,
} from '@/lib/plating';
import { catchError } from './catch-error';

describe('anodizing: the 720 rule', () => {
  // Source: the trade's "720 rule" (trade articles on anodizing practice): mil = A/ft² × min ÷ 720;
  // 24 A/ft² → 30 min per mil, 12 → 60, 18 → 40, 30 → 24, 36 → 20. Worked in US units through the
  // project's unit module, whose factors are NIST SP 811's.
  it.each([
    [24, 30],
    [12, 60],
    [18, 40],
    [30, 24],
    [36, 20],
  ])('%i A/ft² makes 1 mil in %i min (US units)', (asf, minutes) => {
    const r = anodizeCalc({ areaDm2: 1, thicknessUm: toStorage(1, 'mil'), currentDensityAdm2: toStorage(asf, 'A/ft2'), growthFraction: 0.5 });
    expect(r.minutes).toBeCloseTo(minutes, 9);
    expect(anodizeThicknessFromTime({ minutes, currentDensityAdm2: toStorage(asf, 'A/ft2') }).thicknessUm).toBeCloseTo(25.4, 9);
  });

  it('is 3.0512 A·min/dm² per µm in SI (720 ÷ 9.290304 ÷ 25.4; NIST SP 811 exact factors)', () => {
    expect(ANODIZE_720_CONSTANT).toBeCloseTo(3.0512, 4);
  });

  it('25 µm at 1.5 A/dm² takes 50.85 min; on 10 dm² that is 15 A and 12.71 A·h (reference sheet, computed from the rule)', () => {
    const r = anodizeCalc({ areaDm2: 10, thicknessUm: 25, currentDensityAdm2: 1.5, growthFraction: 0.5 });
    expect(r.minutes).toBeCloseTo(50.85, 2);
    expect(r.currentA).toBe(15);
    expect(r.ampHours).toBeCloseTo(12.71, 2);
    // Hard anodize grows about half outward and half in (common practice).
    expect([r.growthUm, r.penetrationUm]).toEqual([12.5, 12.5]);
    expect(anodizeDimensionChange(r.growthUm)).toEqual({ perSurfaceUm: 12.5, onDiameterUm: 25 });
    expect(fromStorage(r.growthUm, 'mil')).toBeCloseTo(0.4921, 4);
  });

  it("takes a tank's own measured constant in place of the rule", () => {
    const r = anodizeCalc({ areaDm2: 2, thicknessUm: 20, currentDensityAdm2: 2, growthFraction: 1 / 3, constantAminPerDm2PerUm: 3.6 });
    expect(r.minutes).toBeCloseTo(36, 9); // 20 × 3.6 ÷ 2
    expect(r.penetrationUm).toBeCloseTo(13.333, 3);
  });

  it.each([
    [{ growthFraction: 1.2 }, 'growthFraction'],
    [{ growthFraction: Number.NaN }, 'growthFraction'],
    [{ currentDensityAdm2: 0 }, 'currentDensityAdm2'],
    [{ currentDensityAdm2: 24 }, 'currentDensityAdm2'], // A/ft² typed into A/dm²
    [{ thicknessUm: -1 }, 'thicknessUm'],
    [{ thicknessUm: 400 }, 'thicknessUm'],
    [{ areaDm2: Number.POSITIVE_INFINITY }, 'areaDm2'],
    [{ constantAminPerDm2PerUm: 0 }, 'constantAminPerDm2PerUm'],
  ])('refuses %o with a message on %s', (bad, field) => {
    const err = catchError(() => anodizeCalc({ areaDm2: 1, thicknessUm: 25, currentDensityAdm2: 1.5, growthFraction: 0.5, ...bad }));
    expect(err).toBeInstanceOf(PlatingInputError);
    expect((err as PlatingInputError).field).toBe(field);
    expect((err as Error).message).toMatch(/^[A-Z].+\.$/);
  });

  it('time scales with thickness and inversely with current density (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 100, noNaN: true }), fc.double({ min: 0.2, max: 5, noNaN: true }), (t, cd) => {
        const a = anodizeCalc({ areaDm2: 1, thicknessUm: t, currentDensityAdm2: cd, growthFraction: 0.5 });
        expect(a.minutes * cd).toBeCloseTo(t * ANODIZE_720_CONSTANT, 6);
        expect(a.growthUm + a.penetrationUm).toBeCloseTo(t, 9);
      }),
    );
  });
});

describe('electroless nickel: mass balance and metal turnovers', () => {
  it('10 dm², 25 µm, 7.9 g/cm³, 8 % P → 19.75 g deposit, 18.17 g Ni; 100 L at 6 g/L → 0.0303 MTO; 15 µm/h → 100 min (reference sheet, computed)', () => {
    const r = electrolessCalc({ areaDm2: 10, thicknessUm: 25, depositionRateUmPerH: 15, phosphorusWtPct: 8, densityGPerCm3: 7.9, bathVolumeL: 100, nickelMakeUpGPerL: 6 });
    expect(r.depositMassG).toBeCloseTo(19.75, 9);
    expect(r.nickelConsumedG).toBeCloseTo(18.17, 9);
    expect(r.phosphorusG).toBeCloseTo(1.58, 9);
    expect(r.metalTurnovers).toBeCloseTo(0.0303, 4);
    expect(r.minutes).toBeCloseTo(100, 9);
  });

  it('defaults the density from phosphorus: pure nickel 8.908 g/cm³ (CRC Handbook), falling with P (table from memory)', () => {
    expect(densityForPhosphorus(0)).toBe(8.908);
    expect(densityForPhosphorus(8.5)).toBeCloseTo(7.9, 9);
    expect(densityForPhosphorus(15)).toBe(7.75);
    // Monotone: more phosphorus, a lighter deposit.
    for (let p = 0.5; p <= 15; p += 0.5) expect(densityForPhosphorus(p)).toBeLessThanOrEqual(densityForPhosphorus(p - 0.5));
    expect(electrolessCalc({ areaDm2: 1, thicknessUm: 10, depositionRateUmPerH: 12, phosphorusWtPct: 8.5, bathVolumeL: 50, nickelMakeUpGPerL: 6 }).densityGPerCm3).toBeCloseTo(7.9, 9);
  });

  it('counts metal turnovers from nickel put back: 6 g/L × 100 L = 600 g is one MTO (common practice)', () => {
    expect(metalTurnoversFromReplenishment({ nickelReplenishedG: 1500, bathVolumeL: 100, nickelMakeUpGPerL: 6 })).toBe(2.5);
  });

  it.each([
    [{ phosphorusWtPct: 16 }, 'phosphorusWtPct'],
    [{ phosphorusWtPct: -0.1 }, 'phosphorusWtPct'],
    [{ depositionRateUmPerH: 0 }, 'depositionRateUmPerH'],
    [{ depositionRateUmPerH: 600 }, 'depositionRateUmPerH'],
    [{ bathVolumeL: 0 }, 'bathVolumeL'],
    [{ nickelMakeUpGPerL: 6000 }, 'nickelMakeUpGPerL'],
    [{ densityGPerCm3: 7900 }, 'densityGPerCm3'],
  ])('refuses %o with a message on %s', (bad, field) => {
    const err = catchError(() => electrolessCalc({ areaDm2: 1, thicknessUm: 10, depositionRateUmPerH: 12, phosphorusWtPct: 9, bathVolumeL: 50, nickelMakeUpGPerL: 6, ...bad }));
    expect((err as PlatingInputError).field).toBe(field);
  });
});

describe('zinc coating life by ISO 9223 category', () => {
  // Source: ISO 9223:2012 zinc first-year corrosion rates (also ISO 12944-2 and ISO 14713-1):
  // C1 ≤ 0.1, C2 0.1–0.7, C3 0.7–2.1, C4 2.1–4.2, C5 4.2–8.4, CX 8.4–25 µm per year.
  it.each([
    ['C2', 0.1, 0.7],
    ['C3', 0.7, 2.1],
    ['C4', 2.1, 4.2],
    ['C5', 4.2, 8.4],
    ['CX', 8.4, 25],
  ] as const)('%s loses %f–%f µm of zinc a year', (category, min, max) => {
    expect(zincServiceLife({ thicknessUm: 10, category }).lossUmPerYear).toEqual({ min, max });
  });

  it('8 µm in C3 lasts 3.8–11.4 years; 25 µm in C4 6.0–11.9 years (life = thickness ÷ rate, ISO 14713-1)', () => {
    const c3 = zincServiceLife({ thicknessUm: 8, category: 'C3' });
    expect([c3.minYears, c3.maxYears]).toEqual([8 / 2.1, 8 / 0.7]);
    expect(describeZincLife(c3, 'C3')).toBe('3.8 to 11.4 years');
    const c4 = zincServiceLife({ thicknessUm: 25, category: 'C4' });
    expect(describeZincLife(c4, 'C4')).toBe('6.0 to 11.9 years');
  });

  it("C1's longest life has no bound: it says so and never prints Infinity", () => {
    const c1 = zincServiceLife({ thicknessUm: 8, category: 'C1' });
    expect(c1.maxYears).toBeNull();
    expect(c1.minYears).toBe(80);
    expect(describeZincLife(c1, 'C1')).toBe('at least 80.0 years (no upper bound in C1)');
    expect(JSON.stringify(c1)).not.toMatch(/Infinity|null.*null/);
  });

  it('a design life needs the conservative thickness: 10 years in C3 → 21 µm (upper rate, ISO 9223)', () => {
    expect(zincThicknessForLife({ years: 10, category: 'C3' }).thicknessUm).toBeCloseTo(21, 9);
    for (const category of CORROSIVITY_CATEGORIES) {
      const t = zincThicknessForLife({ years: 5, category }).thicknessUm;
      expect(zincServiceLife({ thicknessUm: t, category }).minYears).toBeCloseTo(5, 9);
    }
  });

  it('refuses an unknown category and a zero thickness', () => {
    expect((catchError(() => zincServiceLife({ thicknessUm: 8, category: 'C6' as never })) as PlatingInputError).field).toBe('category');
    expect((catchError(() => zincServiceLife({ thicknessUm: 0, category: 'C3' })) as PlatingInputError).field).toBe('thicknessUm');
    expect((catchError(() => zincThicknessForLife({ years: Number.NaN, category: 'C3' })) as PlatingInputError).field).toBe('years');
  });
});

describe('passivation window (ASTM A967)', () => {
  it('Nitric 2 holds 20–45 vol % nitric acid (ASTM A967, checked); each default names its source', () => {
    const n2 = DEFAULT_PASSIVATION_WINDOWS.find((w) => w.id === 'a967-nitric-2')!;
    expect(n2.concentration).toEqual({ min: 20, max: 45, unit: 'vol %' });
    expect(n2.source).toMatch(/checked/);
    for (const w of DEFAULT_PASSIVATION_WINDOWS) expect(w.source).toMatch(/checked|from memory/i);
    // Citric treatments 4–10 wt % citric acid (from memory, reference sheet [M]).
    expect(DEFAULT_PASSIVATION_WINDOWS.filter((w) => w.acid === 'citric').every((w) => w.concentration.min === 4 && w.concentration.max === 10)).toBe(true);
  });

  it('passes a lot inside a band and names every rule a lot outside breaks', () => {
    expect(checkPassivation({ windowId: 'a967-nitric-2', temperatureC: 25, minutes: 30, concentration: 25 }).ok).toBe(true);
    expect(checkPassivation({ windowId: 'a967-nitric-2', temperatureC: 50, minutes: 12, concentration: 25 }).ok).toBe(true); // 49–60 °C ≥ 10 min
    const v = checkPassivation({ windowId: 'a967-nitric-2', temperatureC: 25, minutes: 20, concentration: 50 });
    expect(v).toMatchObject({
      ok: false,
      broken: ['Nitric acid at 50 vol % is outside 20–45 vol % for ASTM A967 Nitric 2.', '20 min is shorter than the 30 min ASTM A967 Nitric 2 needs at 21–32 °C.'],
    });
    const gap = checkPassivation({ windowId: 'a967-nitric-2', temperatureC: 35, minutes: 60, concentration: 25 });
    expect(gap).toMatchObject({ ok: false, broken: ['35 °C is outside every temperature band of ASTM A967 Nitric 2 (21–32 °C, 38–52 °C, 49–60 °C).'] });
  });

  it('takes a shop-edited window, and refuses an unknown treatment or NaN', () => {
    const own = [{ ...DEFAULT_PASSIVATION_WINDOWS[0]!, id: 'shop-nitric', bands: [{ minC: 20, maxC: 30, minMinutes: 45 }] }];
    expect(checkPassivation({ windowId: 'shop-nitric', temperatureC: 25, minutes: 30, concentration: 25 }, own).ok).toBe(false);
    expect((catchError(() => checkPassivation({ windowId: 'nope', temperatureC: 25, minutes: 30, concentration: 25 })) as PlatingInputError).field).toBe('windowId');
    expect((catchError(() => checkPassivation({ windowId: 'a967-citric-2', temperatureC: Number.NaN, minutes: 30, concentration: 5 })) as PlatingInputError).field).toBe('temperatureC');
  });
});
