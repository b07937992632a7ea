import { describe, expect, it } from 'vitest';
import {
  DISTRIBUTION_RATIO_DEFAULTS,
  PlatingInputError,
  averageThicknessUm,
  energyKWh,
  metalConsumed,
  planLoads,
  saltForMetal,
} from '@/lib/plating';
import { catchError } from './catch-error';

describe('salt needed for a mass of metal', () => {
  // Salt fractions themselves are checked in tests/unit/chemistry/formula.test.ts.
  it('divides the metal by the salt metal fraction (reference §5: 16.0 kg Ni → 71.65 kg NiSO₄·6H₂O)', () => {
    // Source: reference sheet §5, "Addition when the analysis is metal but you add a salt".
    const r = saltForMetal({ metalG: 16_000, saltFormula: 'NiSO4·6H2O', element: 'Ni' });
    expect(r.metalFraction * 100).toBeCloseTo(22.33, 2);
    expect(r.saltG / 1000).toBeCloseTo(71.65, 1);
  });

  it('refuses a negative amount of metal', () => {
    expect(catchError(() => saltForMetal({ metalG: -1, saltFormula: 'NiSO4·6H2O', element: 'Ni' }))).toMatchObject({ field: 'metalG' });
  });
});

describe('thickness distribution', () => {
  it('average = minimum ÷ ratio, defaults rack 0.7 and barrel 0.5 (common practice)', () => {
    expect(DISTRIBUTION_RATIO_DEFAULTS).toEqual({ rack: 0.7, barrel: 0.5 });
    expect(averageThicknessUm(7, 0.7)).toBeCloseTo(10, 12);
    expect(averageThicknessUm(12, DISTRIBUTION_RATIO_DEFAULTS.barrel)).toBe(24);
  });

  it('§8: 25 µm minimum with a 1.6 geometry factor averages 40 µm', () => {
    // Source: reference §8 estimating example (average ≈ minimum × factor; ratio = 1/factor).
    expect(averageThicknessUm(25, 1 / 1.6)).toBeCloseTo(40, 12);
  });

  it('refuses a ratio outside (0, 1]', () => {
    for (const r of [0, -0.5, 1.2, Number.NaN]) {
      expect(catchError(() => averageThicknessUm(10, r))).toMatchObject({ field: 'distributionRatio' });
    }
  });
});

describe('load planning', () => {
  it('fills to rack capacity when the rectifier allows', () => {
    const plan = planLoads({ quantity: 250, areaPerPartDm2: 0.5, partsPerLoad: 40, rectifierMaxA: 500, currentDensityAdm2: 4 });
    expect(plan).toEqual({ partsPerLoad: 40, limitedBy: 'capacity', loads: 7, partsInLastLoad: 10, currentPerLoadA: 80 });
  });

  it('limits the load by rectifier amps at the current density', () => {
    const plan = planLoads({ quantity: 1000, areaPerPartDm2: 0.5, partsPerLoad: 400, rectifierMaxA: 500, currentDensityAdm2: 4 });
    expect(plan.partsPerLoad).toBe(250);
    expect(plan.limitedBy).toBe('rectifier');
    expect(plan.loads).toBe(4);
    expect(plan.currentPerLoadA).toBe(500);
  });

  it('refuses a part too large for the rectifier and non-whole quantities', () => {
    expect(
      catchError(() => planLoads({ quantity: 1, areaPerPartDm2: 200, partsPerLoad: 1, rectifierMaxA: 500, currentDensityAdm2: 4 })),
    ).toMatchObject({ field: 'rectifierMaxA' });
    expect(
      catchError(() => planLoads({ quantity: 2.5, areaPerPartDm2: 1, partsPerLoad: 1, rectifierMaxA: 500, currentDensityAdm2: 4 })),
    ).toMatchObject({ field: 'quantity' });
  });
});

describe('metal consumed and salt', () => {
  it('§5 drag-out: 0.10 L/m² × 50 m² × 300 g/L = 1.5 kg', () => {
    // Source: reference §5 "Drag-out loss" example.
    const use = metalConsumed({ depositMassG: 0, areaDm2: 5000, dragOutLPerM2: 0.1, bathMetalGPerL: 300 });
    expect(use.dragOutG).toBeCloseTo(1500, 9);
    expect(use.totalG).toBeCloseTo(1500, 9);
  });

  it('adds anode losses as a percentage of deposit plus drag-out', () => {
    // 1000 dm² = 10 m²: 0.1 L/m² × 10 m² × 100 g/L = 100 g of drag-out.
    const input = { depositMassG: 900, areaDm2: 1000, dragOutLPerM2: 0.1, bathMetalGPerL: 100 };
    const use = metalConsumed({ ...input, anodeLossPercent: 10 });
    expect(use.dragOutG).toBeCloseTo(100, 9);
    expect(use.anodeLossG).toBeCloseTo(100, 9);
    expect(use.totalG).toBeCloseTo(1100, 9);
    expect(catchError(() => metalConsumed({ ...input, anodeLossPercent: 100 }))).toMatchObject({
      field: 'anodeLossPercent',
    });
  });

  it('§5: 16.0 kg of nickel as NiSO₄·6H₂O is 71.65 kg', () => {
    // Source: reference §5 "Addition when the analysis is metal but you add a salt".
    const r = saltForMetal({ metalG: 16_000, saltFormula: 'NiSO4·6H2O', element: 'Ni' });
    expect(r.saltG / 1000).toBeCloseTo(71.65, 1);
    expect(r.metalFraction).toBeCloseTo(0.2233, 4);
  });
});

describe('energy', () => {
  it('§11: 6 V × 1000 A·h at 85 % rectifier efficiency → 6 kWh DC, 7.06 kWh AC', () => {
    // Source: reference §11 "DC energy" / "AC energy" example.
    const e = energyKWh({ tankVolts: 6, ampHours: 1000, rectifierEfficiency: 0.85 });
    expect(e.dcKWh).toBe(6);
    expect(e.acKWh).toBeCloseTo(7.06, 2);
  });

  it('refuses an efficiency above 1', () => {
    expect(() => energyKWh({ tankVolts: 6, ampHours: 1000, rectifierEfficiency: 85 })).toThrow(PlatingInputError);
  });
});
