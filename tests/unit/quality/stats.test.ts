import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { std, mean as mjMean } from 'mathjs';
import { judgeReadings, summarize } from '@/lib/quality/stats';

// NIST Statistical Reference Datasets (StRD), univariate summary statistics. Data layouts and
// certified values of NumAcc1/3/4 recalled from memory: NumAcc1 = 10000001, 10000003, 10000002;
// NumAcc3/4 = one value at the centre, then 500 pairs 0.1 either side.
function numAcc(centre: number): number[] {
  const xs = [centre + 0.2];
  for (let i = 0; i < 500; i++) xs.push(centre + 0.1, centre + 0.3);
  return xs;
}

describe('summarize', () => {
  it('NIST StRD NumAcc1: mean 10000002, s = 1', () => {
    const s = summarize([10000001, 10000003, 10000002]);
    expect(s).toMatchObject({ count: 3, min: 10000001, max: 10000003 });
    expect(s.mean).toBeCloseTo(10000002, 9);
    expect(s.stdDev).toBeCloseTo(1, 12);
  });

  it('NIST StRD NumAcc3 and NumAcc4: s = 0.1 despite the large offset', () => {
    const a3 = summarize(numAcc(1000000));
    expect(a3.count).toBe(1001);
    expect(a3.mean).toBeCloseTo(1000000.2, 7);
    expect(a3.stdDev).toBeCloseTo(0.1, 8);
    expect(summarize(numAcc(10000000)).stdDev).toBeCloseTo(0.1, 7);
  });

  it('agrees with mathjs (n − 1 standard deviation) on random thickness data', () => {
    // Reference library: mathjs std() with the default "unbiased" normalisation.
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 200, noNaN: true }), { minLength: 2, maxLength: 60 }), (xs) => {
        const s = summarize(xs);
        expect(s.mean).toBeCloseTo(Number(mjMean(xs)), 9);
        expect(s.stdDev!).toBeCloseTo(Number(std(xs)), 9);
        expect(s.min).toBe(Math.min(...xs));
        expect(s.max).toBe(Math.max(...xs));
      }),
    );
  });

  it('one reading has no standard deviation; no readings is an error', () => {
    expect(summarize([8.2]).stdDev).toBeNull();
    expect(() => summarize([])).toThrow(/at least one reading/);
    expect(() => summarize([5, Number.POSITIVE_INFINITY])).toThrow(/Reading 2/);
  });
});

describe('judgeReadings', () => {
  it('judges each reading against the minimum (ASTM B633 Fe/Zn 8: 8 µm minimum) and an optional maximum', () => {
    // Source for the minimum: ASTM B633 SC2 / Fe/Zn 8 = 8 µm (reference §6). The maximum is illustrative.
    const j = judgeReadings([9.1, 7.9, 8.0, 13.2], { minimum: 8, maximum: 13 });
    expect(j.readings.map((r) => r.status)).toEqual(['pass', 'below_minimum', 'pass', 'above_maximum']);
    expect(j).toMatchObject({ passCount: 2, failCount: 2, allPass: false });
    expect(j.message).toBe('1 below the minimum 8; 1 above the maximum 13.');
    expect(judgeReadings([8, 9], { minimum: 8 }).allPass).toBe(true);
  });

  it('rejects inconsistent limits', () => {
    expect(() => judgeReadings([1], { minimum: 5, maximum: 4 })).toThrow(/below the minimum/);
    expect(() => judgeReadings([1], { minimum: Number.NaN })).toThrow(/Minimum/);
  });
});
