// Each process family's price and figures, checked by hand from the engine's own sources (the 720
// rule, the electroless mass balance, ASTM A967 windows, ISO 9223 zinc rates).
import { describe, expect, it } from 'vitest';
import { FAMILIES, getFamily, priceFinishLine } from '@/lib/families';
import { zincLifeFigures } from '@/lib/families/electroplating';
import { PlatingInputError } from '@/lib/plating';
import type { PricingInput } from '@/lib/quotes/pricing';
import { catchError } from '../plating/catch-error';

// Invented rates for the invented shop (cents).
const rates: PricingInput['rates'] = {
  labourPerHourCents: 4200, tankHourRackCents: 3500, tankHourBarrelCents: 2800, metalPerKgCents: { Ni: 2200, Zn: 380 }, additivesPerKahCents: 180,
  powerPerKwhCents: 14, bakePerLoadCents: 4500, lotChargeCents: 3500, minimumChargeCents: 12500, rushMultiplierPct: 150, marginPct: 35,
};
const shop = { rectifierMaxA: 1000, rectifierEfficiency: 0.85, dragOutLPerM2: 0.05, bathMetalGPerL: 0, anodeLossPercent: 0, anodes: 'insoluble' as const };
const base = { distributionRatio: 1, tankVolts: 16, handlingMinutesPerLoad: 20, maskingPerPieceCents: 0, bakeRequired: false, bakeThresholdHrc: null, method: 'rack' as const, efficiency: 1 };
const fig = (p: ReturnType<typeof priceFinishLine>, key: string) => p.figures!.find((f) => f.key === key)!;
const cost = (p: ReturnType<typeof priceFinishLine>, key: string) => p.components.find((c) => c.key === key)!;

describe('anodizing', () => {
  // 100 housings of 1 dm², 25 µm at 1.5 A/dm², 20 a load: 720 rule → 25 × 3.0512 ÷ 1.5 = 50.85 min (reference sheet, computed).
  const job: PricingInput = {
    part: { areaDm2: 1, weightG: 100, hardnessHrc: null, tensileMpa: null },
    finish: { ...base, family: 'anodizing', familyParams: { coatingType: 'III', growthFraction: 0.5, seal: 'hot_water', sealMinutes: 30 }, element: 'Al', ionCharge: 3, minThicknessUm: 25, currentDensityAdm2: 1.5, partsPerLoad: 20 },
    process: { ...shop, tank: { volumeL: 2000, settings: {} } },
    rates, quantity: 100, isRush: false, basis: 'piece',
  };

  it('gives time, current and amp-hours per load from the 720 rule', () => {
    const p = priceFinishLine(job);
    expect(p.family).toBe('anodizing');
    expect(fig(p, 'minutes').value as number).toBeCloseTo(50.85, 2);
    expect(fig(p, 'current').value).toBe(30); // 20 dm² × 1.5 A/dm²
    expect(fig(p, 'ampHours').value as number).toBeCloseTo(25.427, 3); // 30 A × 50.853 min ÷ 60
    // Half grows out (hard coat, common practice): 12.5 µm a surface, 25 µm on a diameter.
    expect([fig(p, 'growth').value, fig(p, 'penetration').value, fig(p, 'diameter').value]).toEqual([12.5, 12.5, 25]);
    expect(p.job.loads).toBe(5);
    // Tank time holds the anodizing and the seal: 5 × (50.85 + 30) min.
    expect(p.job.tankHours).toBeCloseTo((5 * (50.8530 + 30)) / 60, 3);
    // Power: 100 dm² × 1.5 A × 50.85 min = 127.1 A·h at 16 V ÷ 0.85 = 2.393 kWh.
    expect(cost(p, 'power').quantity).toBeCloseTo((127.13 * 16) / 1000 / 0.85, 2);
  });

  it("weighs the change on a diameter against the drawing's tolerance", () => {
    const tight = priceFinishLine({ ...job, part: { ...job.part, sizeToleranceUm: 20 } });
    expect(fig(tight, 'diameter').warning).toMatch(/More than the drawing’s tolerance/);
    expect(fig(tight, 'tolerance').value).toBe(20);
    const loose = priceFinishLine({ ...job, part: { ...job.part, sizeToleranceUm: 50 } });
    expect(fig(loose, 'diameter').warning).toBeUndefined();
    expect(fig(priceFinishLine(job), 'tolerance').value).toBe('not on the part record');
  });

  it('caps the load at the rectifier and says so', () => {
    const p = priceFinishLine({ ...job, process: { ...job.process, rectifierMaxA: 15 } });
    expect(p.job.partsPerLoad).toBe(10); // 15 A ÷ 1.5 A per part
    expect(p.job.loadLimitedBy).toBe('rectifier');
    expect(fig(p, 'rectifier').warning).toMatch(/limits a load to 10 parts/);
    expect((catchError(() => priceFinishLine({ ...job, process: { ...job.process, rectifierMaxA: 1 } })) as PlatingInputError).message).toMatch(/more than the 1 A rectifier/);
  });

  it("uses the tank's measured constant, and the finish's own over it", () => {
    const tank = priceFinishLine({ ...job, process: { ...job.process, tank: { volumeL: 2000, settings: { constantAminPerDm2PerUm: 3.6 } } } });
    expect(fig(tank, 'minutes').value as number).toBeCloseTo(60, 9); // 25 × 3.6 ÷ 1.5
    const own = priceFinishLine({
      ...job,
      finish: { ...job.finish, familyParams: { ...job.finish.familyParams, constantAminPerDm2PerUm: 3 } },
      process: { ...job.process, tank: { volumeL: 2000, settings: { constantAminPerDm2PerUm: 3.6 } } },
    });
    expect(fig(own, 'minutes').value as number).toBeCloseTo(50, 9);
  });

  it('refuses a growth share above 1 with the field named', () => {
    const e = catchError(() => priceFinishLine({ ...job, finish: { ...job.finish, familyParams: { coatingType: 'II', growthFraction: 1.5, seal: 'none', sealMinutes: 0 } } }));
    expect(e).toBeInstanceOf(PlatingInputError);
    expect((e as PlatingInputError).field).toBe('growthFraction');
  });
});

describe('electroless nickel', () => {
  // 10 parts of 1 dm², 25 µm, 8 % P at 7.9 g/cm³: the reference sheet's worked check (×1): 19.75 g deposit,
  // 18.17 g nickel; in 100 L at 6 g/L → 0.0303 MTO; 15 µm/h → 100 min.
  const job: PricingInput = {
    part: { areaDm2: 1, weightG: 500, hardnessHrc: null, tensileMpa: null },
    finish: { ...base, family: 'electroless_nickel', familyParams: { depositionRateUmPerH: 15, phosphorusWtPct: 8, densityGPerCm3: 7.9 }, element: 'Ni', ionCharge: 2, minThicknessUm: 25, currentDensityAdm2: 0, partsPerLoad: 10 },
    process: { ...shop, rectifierMaxA: 0, tank: { volumeL: 100, settings: { nickelMakeUpGPerL: 6, endOfLifeMto: 8, makeUpCostCents: 60000, disposalCostCents: 20000 } } },
    rates, quantity: 10, isRush: false, basis: 'piece',
  };

  it('prices the nickel taken and the share of the bath life a job uses', () => {
    const p = priceFinishLine(job);
    expect(fig(p, 'minutes').value as number).toBeCloseTo(100, 9);
    expect(fig(p, 'nickel').value as number).toBeCloseTo(18.17, 9);
    expect(fig(p, 'mto').value as number).toBeCloseTo(0.030283, 5);
    // Nickel 18.17 g × $22/kg = 39.97 ¢ → 40 ¢; bath life 0.030283 MTO × (60 000 + 20 000) ¢ ÷ 8 MTO = 302.8 ¢ → 303 ¢.
    expect(cost(p, 'metal').cents).toBe(40);
    expect(cost(p, 'bathLife').cents).toBe(303);
    expect(p.job.tankHours).toBeCloseTo(100 / 60, 9);
  });

  it('warns when a load packs the bath too full (above about 2 dm²/L, common practice)', () => {
    const p = priceFinishLine({ ...job, finish: { ...job.finish, partsPerLoad: 300 }, quantity: 300 });
    expect(fig(p, 'loading').warning).toMatch(/unstable/);
  });

  it('needs a nickel price and a tank', () => {
    expect((catchError(() => priceFinishLine({ ...job, rates: { ...rates, metalPerKgCents: {} } })) as PlatingInputError).field).toBe('metalPerKgCents');
    expect((catchError(() => priceFinishLine({ ...job, process: { ...shop } })) as PlatingInputError).message).toMatch(/No electroless nickel tank/);
  });
});

describe('passivation', () => {
  const job: PricingInput = {
    part: { areaDm2: 0.036, weightG: 3.9, hardnessHrc: null, tensileMpa: null },
    finish: { ...base, family: 'passivation', familyParams: { windowId: 'a967-nitric-2', minutes: 30, temperatureC: 27, concentration: 25, verificationTest: 'water_immersion' }, element: 'Cr', ionCharge: 3, minThicknessUm: 0, currentDensityAdm2: 0, partsPerLoad: 250, handlingMinutesPerLoad: 15 },
    process: { ...shop, rectifierMaxA: 0 },
    rates, quantity: 1000, isRush: false, basis: 'piece',
  };

  it('prices cycle time and tank occupancy', () => {
    const p = priceFinishLine(job);
    expect(p.job.loads).toBe(4);
    expect(fig(p, 'occupancy').value).toBe(2); // 4 loads × 30 min
    expect(fig(p, 'cycle').value).toBe(45); // 30 min in the acid + 15 min handling
    expect(p.components.map((c) => c.key)).toEqual(['labour', 'tankTime', 'masking', 'bake']);
    // Labour 4 × 15 min = 1 h × $42; tank 2 h × $35.
    expect([cost(p, 'labour').cents, cost(p, 'tankTime').cents]).toEqual([4200, 7000]);
  });

  it("refuses a finish whose own conditions sit outside its window (ASTM A967 Nitric 2: 20–45 vol %)", () => {
    const e = catchError(() => priceFinishLine({ ...job, finish: { ...job.finish, familyParams: { ...job.finish.familyParams, concentration: 50 } } }));
    expect((e as PlatingInputError).message).toMatch(/outside 20–45 vol %/);
  });
});

describe('zinc life on an electroplated quote', () => {
  it('gives the life in the stated category and the zinc a design life needs (ISO 9223 rates)', () => {
    const f = zincLifeFigures(8, 'C3', 10);
    expect(f[0]!.value).toBe('3.8 to 11.4 years');
    expect(f[0]!.label).toMatch(/estimate, not a warranty/);
    expect(f[1]!.value as number).toBeCloseTo(21, 9);
    expect(f[1]!.warning).toMatch(/More than the finish/);
    expect(zincLifeFigures(8, null, 10)).toEqual([]);
  });

  it('is one of the figures of an electroplated zinc line', () => {
    const p = priceFinishLine({
      part: { areaDm2: 0.0915, weightG: 9.6, hardnessHrc: 25, tensileMpa: 830, corrosivityCategory: 'C4', designLifeYears: null },
      finish: { ...base, element: 'Zn', ionCharge: 2, minThicknessUm: 8, currentDensityAdm2: 0.8, efficiency: 0.72, distributionRatio: 0.5, partsPerLoad: 2000, tankVolts: 9, method: 'barrel' },
      process: { ...shop, rectifierMaxA: 2000, anodes: 'soluble', bathMetalGPerL: 8 },
      rates, quantity: 1000, isRush: false, basis: 'piece',
    });
    expect(p.family).toBe('electroplating');
    // 8 µm in C4: 8 ÷ 4.2 = 1.9 to 8 ÷ 2.1 = 3.8 years.
    expect(p.figures!.map((x) => x.value)).toEqual(['1.9 to 3.8 years']);
  });
});

describe('the registry', () => {
  it('has one module per family, each with templates, cautions and certificate words', () => {
    for (const id of ['electroplating', 'electroless_nickel', 'anodizing', 'passivation'] as const) {
      const f = getFamily(id);
      expect(f.id).toBe(id);
      expect(f.templates.length).toBeGreaterThan(0);
      expect(f.certificateStatement({ name: 'X', specText: 'SPEC', minThicknessUm: 10 }, f.defaultParams as never)).toMatch(/SPEC/);
      expect(f.cautions(f.defaultParams as never).length).toBeGreaterThan(0);
    }
    expect(getFamily('anodizing').cautions({ coatingType: 'II', growthFraction: 0.3, seal: 'dichromate', sealMinutes: 15 } as never)).toContain('hexavalent-chromium');
    expect(getFamily('electroless_nickel').cautions({} as never)).toEqual(['nickel', 'heat']);
    expect(getFamily('passivation').cautions({ windowId: 'a967-nitric-2' } as never)).toContain('nitric-acid');
  });
});

describe('the workbench calculators', () => {
  const calc = (title: string) => FAMILIES.flatMap((f) => f.calculators).find((c) => c.title === title)!;
  const start = (title: string) => Object.fromEntries(calc(title).inputs.map((i) => [i.name, i.initial]));

  it('anodizing: 25 µm at 1.5 A/dm² on 20 dm² is 50.85 min at 30 A (720 rule, reference sheet)', () => {
    const r = calc('Anodizing: one load').compute(start('Anodizing: one load'));
    expect(r.figures.find((f) => f.key === 'minutes')!.value as number).toBeCloseTo(50.85, 2);
    expect(r.figures.find((f) => f.key === 'current')!.value).toBe(30);
    const over = calc('Anodizing: one load').compute({ ...start('Anodizing: one load'), rectifierMaxA: 20 });
    expect(over.figures.find((f) => f.key === 'current')!.warning).toMatch(/split the load/);
  });

  it('electroless nickel: the worked check, 10 dm² at 25 µm, 8 % P → 0.0303 MTO in 100 L at 6 g/L (density from the table, from memory)', () => {
    const r = calc('Electroless nickel: one job').compute(start('Electroless nickel: one job'));
    // 8 % P → 7.955 g/cm³ from the table (between 3 % / 8.5 and 8.5 % / 7.9): 2.5 cm³ × 7.955 × 0.92 = 18.30 g Ni.
    expect(r.figures.find((f) => f.key === 'nickel')!.value as number).toBeCloseTo(2.5 * (8.5 - (0.6 * 5) / 5.5) * 0.92, 6);
    expect(r.figures.find((f) => f.key === 'minutes')!.value as number).toBeCloseTo(100, 9);
  });

  it('refuses bad input with the engine’s own field', () => {
    expect(() => calc('Electroless nickel: one job').compute({ ...start('Electroless nickel: one job'), phosphorusWtPct: 40 })).toThrow(PlatingInputError);
    const e = catchError(() => calc('Passivation: one lot').compute({ ...start('Passivation: one lot'), loads: 0.5 })) as PlatingInputError;
    expect(e.field).toBe('loads');
    const z = calc('Zinc coating life').compute(start('Zinc coating life'));
    expect(z.figures[0]!.value).toBe('3.8 to 11.4 years');
  });
});
