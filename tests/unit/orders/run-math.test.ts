import { describe, expect, it } from 'vitest';
import { predictRun, runAmpHours, runCurrentDensity } from '@/lib/orders/run-math';
import { catchError } from '../plating/catch-error';

const nickel = { element: 'Ni', ionCharge: 2, distributionRatio: 1, minThicknessUm: 5 };

describe('runAmpHours', () => {
  it('multiplies amps by time and loads, or reads the meter difference', () => {
    expect(runAmpHours({ mode: 'amps', currentA: 150, minutesPerLoad: 40, loads: 3 })).toBeCloseTo(300, 12);
    expect(runAmpHours({ mode: 'meter', meterStartAh: 1234.5, meterStopAh: 1300, minutesPerLoad: 30, loads: 2 })).toBeCloseTo(65.5, 12);
  });

  it('names the field that is wrong', () => {
    expect(catchError(() => runAmpHours({ mode: 'meter', meterStartAh: 500, meterStopAh: 400, minutesPerLoad: 10, loads: 1 }))).toMatchObject({ field: 'meterStopAh' });
    expect(catchError(() => runAmpHours({ mode: 'amps', currentA: 100, minutesPerLoad: 0, loads: 1 }))).toMatchObject({ field: 'minutesPerLoad' });
    expect(catchError(() => runAmpHours({ mode: 'amps', currentA: 100, minutesPerLoad: 10, loads: 1.5 }))).toMatchObject({ field: 'loads' });
    expect(catchError(() => runAmpHours({ mode: 'amps', currentA: Number.NaN, minutesPerLoad: 10, loads: 1 }))).toMatchObject({ field: 'currentA' });
  });
});

describe('predictRun', () => {
  it('nickel at 0.40 A/dm² for 2 h at 100 % → 9.84 µm', () => {
    // Source: reference §1.4 E2 (S13): J = 40 A/m², t = 2 h → 9.84 µm.
    const ampHours = runAmpHours({ mode: 'amps', currentA: 0.4, minutesPerLoad: 120, loads: 1 });
    const p = predictRun({ ...nickel, ampHours, loads: 1, partsPerLoad: 1, areaPerPartDm2: 1, tankEfficiency: 1 });
    expect(p.averageThicknessUm).toBeCloseTo(9.84, 2);
  });

  it('15 A for 1 h at 60 % on 8 cm² of nickel → about 9.85 g and 0.138 cm', () => {
    // Source: reference §1.4 E1 (S12), which uses F = 96 500: tolerance 0.5 %.
    const p = predictRun({ ...nickel, ampHours: 15, loads: 1, partsPerLoad: 1, areaPerPartDm2: 0.08, tankEfficiency: 0.6 });
    expect(p.depositMassG / 9.856).toBeCloseTo(1, 2);
    expect(p.averageThicknessUm / 1384).toBeCloseTo(1, 2);
  });

  it('takes the thinnest significant surface as average × distribution ratio, and flags it below the minimum', () => {
    const base = { ...nickel, distributionRatio: 0.5, minThicknessUm: 6, ampHours: 0.8, loads: 2, partsPerLoad: 1, areaPerPartDm2: 0.5, tankEfficiency: 1 };
    const p = predictRun(base);
    // Same charge over the same 1 dm² as above: 9.84 µm average, 4.92 µm at the thinnest.
    expect(p.platedAreaDm2).toBe(1);
    expect(p.minimumThicknessUm).toBeCloseTo(9.84 / 2, 2);
    expect(p.isBelowMinimum).toBe(true);
    expect(predictRun({ ...base, minThicknessUm: 4.5 }).isBelowMinimum).toBe(false);
  });

  it('refuses an impossible distribution ratio and parts per load', () => {
    const base = { ...nickel, ampHours: 1, loads: 1, partsPerLoad: 1, areaPerPartDm2: 1, tankEfficiency: 1 };
    expect(catchError(() => predictRun({ ...base, distributionRatio: 1.5 }))).toMatchObject({ field: 'distributionRatio' });
    expect(catchError(() => predictRun({ ...base, partsPerLoad: 0 }))).toMatchObject({ field: 'partsPerLoad' });
  });

  it('reports the current density a run used', () => {
    expect(runCurrentDensity(80, 40, 0.5)).toBe(4);
    expect(runCurrentDensity(80, 0, 0.5)).toBeNull();
  });
});
