import { describe, expect, it } from 'vitest';
import { lotEfficiency, type EfficiencyRun } from '@/lib/quality/efficiency';

const run = (over: Partial<EfficiencyRun> = {}): EfficiencyRun => ({
  tankId: 't-ni', tankElement: 'Ni', ampHours: 1.711, loads: 1, partsPerLoad: 10, predictedThicknessUm: 2, ...over,
});

describe('lotEfficiency', () => {
  // Source: reference worked example E5 (nickel thickness chart at 95 % CE, S. Rudy, CEF):
  // 2 µm of Ni needs 0.1711 A·h/dm² at 95 %. Ten 1 dm² parts and 1.711 A·h measuring 2 µm → 95 %.
  it('gives back the efficiency of a published worked example', () => {
    const r = lotEfficiency({ element: 'Ni', ionCharge: 2, partAreaDm2: 1, measuredMeanUm: 2, runs: [run()] });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.efficiency).toBeCloseTo(0.95, 3);
    expect(r.areaDm2).toBe(10);
    expect(r.theoreticalUm).toBeCloseTo(2 / 0.95, 3);
    expect(r.ratioToPredicted).toBeCloseTo(1, 10);
  });

  // Source: reference worked example E1 (15 A for 1 h at 60 % CE on 8 cm²): d = 0.1384 cm = 1384 µm.
  it('agrees with the classic nickel problem: 15 A·h on 0.08 dm² at 60 % gives 1384 µm', () => {
    const r = lotEfficiency({ element: 'Ni', ionCharge: 2, partAreaDm2: 0.08, measuredMeanUm: 1384, runs: [run({ ampHours: 15, partsPerLoad: 1 })] });
    expect(r.ok && r.efficiency).toBeCloseTo(0.6, 2);
  });

  it('sums the runs of one tank, weights the prediction by parts, and ignores other metals', () => {
    const r = lotEfficiency({
      element: 'Ni', ionCharge: 2, partAreaDm2: 1, measuredMeanUm: 2,
      runs: [run({ ampHours: 1, partsPerLoad: 5, predictedThicknessUm: 1.5 }), run({ ampHours: 0.711, partsPerLoad: 5, predictedThicknessUm: 2.5 }), run({ tankId: 't-cu', tankElement: 'Cu', ampHours: 50 })],
    });
    expect(r.ok && r.efficiency).toBeCloseTo(0.95, 3);
    expect(r.ok && r.predictedUm).toBeCloseTo(2, 10);
  });

  it('says why when the lot cannot be credited to one tank', () => {
    expect(lotEfficiency({ element: 'Zn', ionCharge: 2, partAreaDm2: 1, measuredMeanUm: 2, runs: [run()] })).toEqual({ ok: false, reason: 'No run in a Zn tank.' });
    expect(lotEfficiency({ element: 'Ni', ionCharge: 2, partAreaDm2: 1, measuredMeanUm: 2, runs: [run(), run({ tankId: 't-ni2' })] })).toMatchObject({ ok: false, reason: expect.stringMatching(/more than one tank/) });
    expect(lotEfficiency({ element: 'Ni', ionCharge: 2, partAreaDm2: 1, measuredMeanUm: 0, runs: [run()] })).toMatchObject({ ok: false });
  });
});
