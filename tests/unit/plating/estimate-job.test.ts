import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ESTIMATE_CAUTION, PLATING_METALS, PlatingInputError, estimateJob, plateCalc, type JobInput } from '@/lib/plating';
import { catchError } from './catch-error';

// Every number anywhere inside a result (JSON.stringify would hide NaN as null).
function numbersIn(value: unknown): number[] {
  if (typeof value === 'number') return [value];
  if (value && typeof value === 'object') return Object.values(value).flatMap(numbersIn);
  return [];
}

const nickelJob: JobInput = {
  areaPerPartDm2: 0.5,
  quantity: 250,
  minimumThicknessUm: 25,
  process: {
    element: 'Ni',
    charge: 2,
    currentDensityAdm2: 4,
    efficiency: 0.95,
    loading: 'rack',
    distributionRatio: 1 / 1.6,
    partsPerLoad: 40,
    tankVolts: 6,
    rectifierMaxA: 500,
    rectifierEfficiency: 0.85,
    dragOutLPerM2: 0.05,
    bathMetalGPerL: 70,
    anodeLossPercent: 5,
  },
};

describe('estimateJob', () => {
  const e = estimateJob(nickelJob);

  it('§8: 25 µm minimum, factor 1.6, 95 % CE, 4 A/dm² → 40 µm average and about 51 min', () => {
    // Source: reference §8 estimating example: 40/(12.303 × 4 × 0.95) = 0.855 h ≈ 51 min.
    expect(e.averageThicknessUm).toBeCloseTo(40, 12);
    expect(e.nominal.minutesPerLoad).toBeCloseTo(0.855 * 60, 0);
    expect(e.distributionRatioIsDefault).toBe(false);
  });

  it('combines area, loads, current, amp-hours, metal and energy consistently', () => {
    expect(e.areaPerLotDm2).toBe(125);
    expect([e.partsPerLoad, e.loadLimitedBy, e.loads, e.partsInLastLoad]).toEqual([40, 'capacity', 7, 10]);
    expect(e.currentPerLoadA).toBe(80);
    expect(e.nominal.totalTankMinutes).toBeCloseTo(7 * e.nominal.minutesPerLoad, 9);
    // Hand calculation: 40 µm × 125 dm² × 100 cm²/dm² × 1e-4 cm/µm × 8.90 g/cm³ = 445 g.
    expect(e.depositMassLotG).toBeCloseTo(445, 9);
    expect(e.depositMassPerPartG).toBeCloseTo(1.78, 9);
    const lot = plateCalc({ element: 'Ni', charge: 2, areaDm2: 125, thicknessUm: 40, efficiency: 0.95, currentDensityAdm2: 4 });
    expect(e.nominal.ampHoursLot).toBeCloseTo(lot.ampHours, 9);
    expect(e.nominal.ampHoursPerLoad).toBeCloseTo((lot.ampHours * 40) / 250, 9);
    // Drag-out: 0.05 L/m² × 1.25 m² × 70 g/L = 4.375 g; anode loss 5 % of (445 + 4.375).
    expect(e.nominal.metal.dragOutG).toBeCloseTo(4.375, 9);
    expect(e.nominal.metal.totalG).toBeCloseTo((445 + 4.375) * 1.05, 9);
    expect(e.nominal.energy.acKWh).toBeCloseTo((6 * lot.ampHours) / 1000 / 0.85, 9);
    expect(e.nominal.salt).toBeNull();
    expect(e.cautions).toContain(ESTIMATE_CAUTION);
  });

  it('adds a row with efficiency 5 points lower: more amp-hours, time and energy, same metal', () => {
    const low = e.lowerEfficiency!;
    expect(low.efficiency).toBe(0.9);
    expect(low.ampHoursLot / e.nominal.ampHoursLot).toBeCloseTo(0.95 / 0.9, 12);
    expect(low.minutesPerLoad).toBeGreaterThan(e.nominal.minutesPerLoad);
    expect(low.energy.acKWh).toBeGreaterThan(e.nominal.energy.acKWh);
    expect(low.metal).toEqual(e.nominal.metal);
  });

  it('uses the common-practice distribution default when none is given', () => {
    const { distributionRatio: _, ...rest } = nickelJob.process;
    const barrel = estimateJob({ ...nickelJob, process: { ...rest, loading: 'barrel' } });
    expect(barrel.distributionRatio).toBe(0.5);
    expect(barrel.distributionRatioIsDefault).toBe(true);
    expect(barrel.averageThicknessUm).toBe(50);
  });

  it('hard chromium with insoluble anodes: metal from CrO₃, caution shown, no lower row at 5 %', () => {
    const chrome = estimateJob({
      areaPerPartDm2: 2,
      quantity: 3,
      minimumThicknessUm: 25,
      process: {
        ...nickelJob.process,
        element: 'Cr',
        charge: 6,
        efficiency: 0.05,
        currentDensityAdm2: 31,
        anodes: 'insoluble',
        anodeLossPercent: 50, // ignored: insoluble anodes do not dissolve
        replenishmentSalt: 'CrO3',
        bathMetalGPerL: 130,
      },
    });
    expect(chrome.nominal.metal.anodeLossG).toBe(0);
    // Source: reference §5, CrO₃ is 52.00 % Cr.
    expect(chrome.nominal.salt!.grams).toBeCloseTo(chrome.nominal.metal.totalG / 0.52, 0);
    expect(chrome.cautions.join(' ')).toMatch(/Hexavalent chromium/);
    expect(chrome.lowerEfficiency).toBeNull();
    expect(chrome.lowerEfficiencyNote).toMatch(/0\.05/);
  });

  it('limits parts per load by the rectifier', () => {
    // 0.5 dm² × 4 A/dm² = 2 A a part: 100 A drives 50 parts, more than the 40 the rack holds.
    const roomy = estimateJob({ ...nickelJob, process: { ...nickelJob.process, rectifierMaxA: 100 } });
    expect([roomy.partsPerLoad, roomy.loadLimitedBy]).toEqual([40, 'capacity']);
    const tight = estimateJob({ ...nickelJob, process: { ...nickelJob.process, rectifierMaxA: 60 } });
    expect([tight.partsPerLoad, tight.loadLimitedBy, tight.loads]).toEqual([30, 'rectifier', 9]);
  });

  it('refuses bad input with the field named', () => {
    const bad = (process: Partial<JobInput['process']>, top: Partial<JobInput> = {}) =>
      catchError(() => estimateJob({ ...nickelJob, ...top, process: { ...nickelJob.process, ...process } }));
    expect(bad({ loading: 'tray' as 'rack' })).toMatchObject({ field: 'loading' });
    expect(bad({ efficiency: 1.5 })).toMatchObject({ field: 'efficiency' });
    expect(bad({ rectifierEfficiency: 0 })).toMatchObject({ field: 'rectifierEfficiency' });
    expect(bad({ tankVolts: -6 })).toMatchObject({ field: 'tankVolts' });
    expect(bad({}, { quantity: 0 })).toMatchObject({ field: 'quantity' });
    expect(bad({}, { minimumThicknessUm: Number.NaN })).toMatchObject({ field: 'minimumThicknessUm' });
    expect(bad({ anodes: 'insoluble', replenishmentSalt: 'Q2' })).toMatchObject({ field: 'formula' });
    expect(bad({ element: 'Ti' })).toMatchObject({ field: 'element' });
  });

  it('never returns NaN or Infinity for valid input', () => {
    const metals = PLATING_METALS.map((m) => ({ element: m.element, charge: m.charge }));
    const positive = fc.double({ min: 1e-6, max: 1e6, noNaN: true });
    fc.assert(
      fc.property(
        fc.constantFrom(...metals), positive, fc.integer({ min: 1, max: 1e6 }), positive,
        fc.double({ min: 0.01, max: 1, noNaN: true }), positive, fc.integer({ min: 1, max: 1e4 }),
        (m, area, qty, thickness, eff, j, perLoad) => {
          let r;
          try {
            r = estimateJob({
              areaPerPartDm2: area, quantity: qty, minimumThicknessUm: thickness,
              process: { ...nickelJob.process, ...m, efficiency: eff, currentDensityAdm2: j, partsPerLoad: perLoad, rectifierMaxA: 5000 },
            });
          } catch (err) {
            expect(err).toBeInstanceOf(PlatingInputError);
            return;
          }
          const numbers = numbersIn(r);
          expect(numbers.length).toBeGreaterThan(20);
          for (const n of numbers) expect(Number.isFinite(n)).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });
});
