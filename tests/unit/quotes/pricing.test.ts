import { describe, expect, it } from 'vitest';
import { PlatingInputError } from '@/lib/plating';
import { percentOf, priceLine, roundCents, type PricingInput } from '@/lib/quotes/pricing';
import { basisQuantity, unitPriceCents } from '@/lib/quotes/basis';
import { catchError } from '../plating/catch-error';

// Invented rates for the invented shop (cents).
const rates: PricingInput['rates'] = {
  labourPerHourCents: 4200,
  tankHourRackCents: 3500,
  tankHourBarrelCents: 2800,
  metalPerKgCents: { Ni: 2200, Zn: 380 },
  additivesPerKahCents: 180,
  powerPerKwhCents: 14,
  bakePerLoadCents: 4500,
  lotChargeCents: 3500,
  minimumChargeCents: 12500,
  rushMultiplierPct: 150,
  marginPct: 35,
};

// Job 1: 250 brackets, 0.5 dm² and 120 g each, 25 µm minimum nickel on racks of 40.
const nickelJob: PricingInput = {
  part: { areaDm2: 0.5, weightG: 120, hardnessHrc: null, tensileMpa: null },
  finish: {
    element: 'Ni', ionCharge: 2, minThicknessUm: 25, method: 'rack', currentDensityAdm2: 4, efficiency: 0.95,
    distributionRatio: 0.625, tankVolts: 6, partsPerLoad: 40, handlingMinutesPerLoad: 15, maskingPerPieceCents: 10,
    bakeRequired: false, bakeThresholdHrc: null,
  },
  process: { rectifierMaxA: 500, rectifierEfficiency: 0.85, dragOutLPerM2: 0.05, bathMetalGPerL: 70, anodeLossPercent: 5, anodes: 'soluble' },
  rates,
  quantity: 250,
  isRush: false,
  basis: 'piece',
};

// Job 2: 200 hardened set screws (39 HRC), 0.172 dm² and 31.5 g each, 8 µm minimum zinc in one
// barrel load, rush, with a shop whose minimum charge is $250.
const zincJob: PricingInput = {
  part: { areaDm2: 0.172, weightG: 31.5, hardnessHrc: 39, tensileMpa: 1220 },
  finish: {
    element: 'Zn', ionCharge: 2, minThicknessUm: 8, method: 'barrel', currentDensityAdm2: 0.8, efficiency: 0.72,
    distributionRatio: 0.5, tankVolts: 9, partsPerLoad: 2000, handlingMinutesPerLoad: 20, maskingPerPieceCents: 0,
    bakeRequired: false, bakeThresholdHrc: 31,
  },
  process: { rectifierMaxA: 2000, rectifierEfficiency: 0.85, dragOutLPerM2: 0.2, bathMetalGPerL: 7.5, anodeLossPercent: 0, anodes: 'soluble' },
  rates: { ...rates, minimumChargeCents: 25000 },
  quantity: 200,
  isRush: true,
  basis: 'kg',
};

const cents = (p: ReturnType<typeof priceLine>) => Object.fromEntries(p.components.map((c) => [c.key, c.cents]));

describe('the rounding rule', () => {
  it('rounds each amount half-up to whole cents', () => {
    expect([roundCents(0.5), roundCents(2.5), roundCents(1.49), roundCents(1038.05625)]).toEqual([1, 3, 1, 1038]);
    // 0.1 × 125 is 12.499999999999998 in binary floating point; the exact value is a half.
    expect(roundCents(0.1 * 125)).toBe(13);
  });

  it('takes percentages of whole cents half-up (not to even)', () => {
    expect(percentOf(30, 35)).toBe(11); // 10.5 → 11 (bankers' rounding would give 10)
    expect(percentOf(10, 35)).toBe(4); // 3.5 → 4
    expect(percentOf(31969, 35)).toBe(11189); // 11 189.15
  });

  it('refuses amounts that are not finite or negative', () => {
    expect(catchError(() => roundCents(Number.NaN))).toBeInstanceOf(PlatingInputError);
    expect(catchError(() => roundCents(-1))).toBeInstanceOf(PlatingInputError);
  });
});

describe('priceLine, job 1 (nickel on racks) computed by hand', () => {
  const p = priceLine(nickelJob);

  it('plans 7 loads of 40 and the nickel job figures', () => {
    // 250 ÷ 40 = 6.25 → 7 loads; the rectifier's 500 A would drive 500 ÷ (0.5 × 4) = 250 parts.
    expect([p.job.loads, p.job.partsPerLoad, p.job.loadLimitedBy]).toEqual([7, 40, 'capacity']);
    // Average = 25 µm ÷ 0.625 = 40 µm (reference §8: time and metal follow the average).
    expect(p.job.averageThicknessUm).toBeCloseTo(40, 12);
    // Deposit = 40 µm × 1e-4 cm/µm × 125 dm² × 100 cm²/dm² × 8.90 g/cm³ = 445 g.
    // ECE(Ni²⁺) = 58.6934 × 3600 ÷ (2 × 96 485.332 12) = 1.094 965 6 g/(A·h) (reference §1.2: 1.0950).
    // A·h = 445 ÷ (1.094 965 6 × 0.95) = 427.795 2.
    expect(p.job.ampHours).toBeCloseTo(427.7952, 3);
  });

  it('builds each cost line in whole cents', () => {
    expect(cents(p)).toEqual({
      // Metal = (445 g deposit + 0.05 L/m² × 1.25 m² × 70 g/L = 4.375 g drag-out) × 1.05 anode loss
      //       = 471.843 75 g = 0.471 843 75 kg × 2200 ¢/kg = 1038.056 25 ¢ → 1038 ¢.
      metal: 1038,
      // Salts and additives = 0.427 795 2 kA·h × 180 ¢ = 77.003 ¢ → 77 ¢.
      additives: 77,
      // Power = 6 V × 427.795 2 A·h ÷ 1000 ÷ 0.85 = 3.019 731 kWh × 14 ¢ = 42.276 ¢ → 42 ¢.
      power: 42,
      // Labour = 7 loads × 15 min = 1.75 h × 4200 ¢ = 7350 ¢.
      labour: 7350,
      // Tank time: one load is 20 dm² at 80 A and takes 427.795 2 × 20/125 ÷ 80 h = 0.855 590 h;
      // 7 loads = 5.989 133 h × 3500 ¢ = 20 961.966 ¢ → 20 962 ¢.
      tankTime: 20962,
      // Masking = 250 × 10 ¢.
      masking: 2500,
      // No bake: the finish does not ask for one and the part's hardness is not on record.
      bake: 0,
    });
  });

  it('adds margin and lot charge; no minimum, no rush', () => {
    // 1038 + 77 + 42 + 7350 + 20 962 + 2500 = 31 969 ¢.
    expect(p.subtotalCents).toBe(31969);
    expect(p.marginCents).toBe(11189); // 35 % = 11 189.15 → 11 189
    expect(p.beforeMinimumCents).toBe(31969 + 11189 + 3500);
    expect(p.minimumApplied).toBe(false);
    expect(p.rushCents).toBe(0);
    expect(p.totalCents).toBe(46658);
    expect(p.perPieceCents).toBe(186.632); // 46 658 ÷ 250
    expect(p.bake.applies).toBe(false);
  });

  it('states the unit price per each basis', () => {
    const facts = { quantity: 250, areaPerPartDm2: 0.5, weightPerPartG: 120, loads: 7 };
    expect(unitPriceCents(46658, 'hundred', facts)).toBe(18663.2);
    expect(unitPriceCents(46658, 'dm2', facts)).toBe(373.264); // ÷ 125 dm²
    // 125 dm² ÷ 9.290 304 dm²/ft² (NIST SP 811 B.8: 1 ft = 0.3048 m) = 13.454 888 ft²;
    // 46 658 × 9.290 304 ÷ 125 = 3467.736 03.
    expect(unitPriceCents(46658, 'ft2', facts)).toBe(3467.736);
    // 30 kg; 30 000 g ÷ 453.592 37 g/lb (NIST SP 811 B.8) = 66.138 68 lb; 46 658 ÷ 66.138 68 = 705.457 09.
    expect(unitPriceCents(46658, 'kg', facts)).toBe(1555.2667);
    expect(unitPriceCents(46658, 'lb', facts)).toBe(705.4571);
    expect(unitPriceCents(46658, 'load', facts)).toBe(6665.4286);
    expect(basisQuantity('ft2', facts)).toBeCloseTo(13.454888, 5);
  });
});

describe('priceLine, job 2 (hardened zinc, barrel, minimum charge and rush) computed by hand', () => {
  const p = priceLine(zincJob);

  it('charges a bake because the part is 39 HRC, at or above the 31 HRC threshold', () => {
    expect(p.bake.applies).toBe(true);
    expect(p.bake.reason).toMatch(/39 HRC/);
  });

  it('builds each cost line in whole cents', () => {
    // Area 200 × 0.172 = 34.4 dm²; average 8 ÷ 0.5 = 16 µm; one barrel load (2000 fit).
    // Deposit = 16e-4 cm × 3440 cm² × 7.134 g/cm³ = 39.265 536 g.
    // ECE(Zn²⁺) = 65.38 × 3600 ÷ (2 × 96 485.332 12) = 1.219 708 7; A·h = 39.265 536 ÷ (1.219 708 7 × 0.72) = 44.711 88.
    expect(p.job.ampHours).toBeCloseTo(44.71188, 4);
    expect(cents(p)).toEqual({
      // (39.265 536 + 0.2 × 0.344 × 7.5 = 0.516) g = 0.039 781 5 kg × 380 ¢ = 15.117 ¢ → 15.
      metal: 15,
      additives: 8, // 0.044 711 88 kA·h × 180 = 8.048 ¢
      power: 7, // 9 V × 44.711 88 ÷ 1000 ÷ 0.85 = 0.473 420 kWh × 14 = 6.628 ¢
      labour: 1400, // 1 load × 20 min = 1/3 h × 4200
      tankTime: 4549, // 44.711 88 A·h ÷ (0.8 × 34.4 = 27.52 A) = 1.624 705 h × 2800 = 4549.17 ¢
      masking: 0,
      bake: 4500, // 1 load × 4500
    });
  });

  it('raises the total to the minimum charge, then applies the rush multiplier', () => {
    expect(p.subtotalCents).toBe(10479);
    expect(p.marginCents).toBe(3668); // 35 % of 10 479 = 3667.65
    expect(p.beforeMinimumCents).toBe(17647); // + 3500 lot charge
    expect(p.minimumApplied).toBe(true);
    expect(p.rushCents).toBe(12500); // 150 % of 25 000
    expect(p.totalCents).toBe(37500);
    expect(p.perPieceCents).toBe(187.5);
    // 200 × 31.5 g = 6.3 kg: 37 500 ÷ 6.3 = 5952.380 95 → 5952.381 0.
    expect(p.basisQuantity).toBeCloseTo(6.3, 12);
    expect(p.unitPriceCents).toBe(5952.381);
  });
});

describe('priceLine refusals', () => {
  it('names the missing metal price', () => {
    const e = catchError(() => priceLine({ ...nickelJob, rates: { ...rates, metalPerKgCents: { Zn: 380 } } }));
    expect(e).toMatchObject({ field: 'metalPerKgCents' });
    expect(e.message).toMatch(/no metal price for Ni/);
  });

  it('refuses a per-weight basis for a part without a weight', () => {
    const e = catchError(() => priceLine({ ...nickelJob, part: { ...nickelJob.part, weightG: null }, basis: 'lb' }));
    expect(e).toMatchObject({ field: 'basis' });
  });

  it('refuses fractional cents in the rates and an out-of-range margin', () => {
    expect(catchError(() => priceLine({ ...nickelJob, rates: { ...rates, labourPerHourCents: 42.5 } }))).toMatchObject({ field: 'labourPerHourCents' });
    expect(catchError(() => priceLine({ ...nickelJob, rates: { ...rates, marginPct: -5 } }))).toMatchObject({ field: 'marginPct' });
    expect(catchError(() => priceLine({ ...nickelJob, quantity: 0 }))).toMatchObject({ field: 'quantity' });
  });
});
