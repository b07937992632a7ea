import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  capability,
  capabilityFromValues,
  D2_N2,
  individualsChart,
  movingRanges,
  sigmaFromMovingRange,
  westernElectricRules,
  type RuleId,
} from '@/lib/bath/spc';

// Western Electric rules per the Western Electric Statistical Quality Control Handbook (1956),
// as listed in the NIST/SEMATECH e-Handbook §6.3.2 and the StatSoft glossary. Series are given
// as distances from the centre line in sigmas, so each zone boundary is explicit.
const fired = (zs: number[], rule: RuleId, runLength?: number) =>
  westernElectricRules(zs, runLength)
    .map((r, i) => (r.includes(rule) ? i : -1))
    .filter((i) => i >= 0);

describe('Western Electric rule 1: one point beyond 3σ', () => {
  it('fires above and below', () => expect(fired([0, 0.5, 3.1, -3.2], 'we1_beyond_3s')).toEqual([2, 3]));
  it('does not fire on the 3σ line itself', () => expect(fired([3, -3, 2.9], 'we1_beyond_3s')).toEqual([]));
});

describe('Western Electric rule 2: two of three beyond 2σ, same side', () => {
  it('fires on the point completing the pattern', () => expect(fired([2.1, 0.5, 2.2], 'we2_two_of_three_beyond_2s')).toEqual([2]));
  it('fires on two in a row at the start', () => expect(fired([-2.5, -2.1], 'we2_two_of_three_beyond_2s')).toEqual([1]));
  it('does not fire when the points are on opposite sides', () =>
    expect(fired([2.1, 0.5, -2.2], 'we2_two_of_three_beyond_2s')).toEqual([]));
  it('does not fire when they are four apart', () =>
    expect(fired([2.1, 0.5, 0.3, 2.2], 'we2_two_of_three_beyond_2s')).toEqual([]));
  it('does not count points on the 2σ line', () => expect(fired([2, 2, 2.5], 'we2_two_of_three_beyond_2s')).toEqual([]));
});

describe('Western Electric rule 3: four of five beyond 1σ, same side', () => {
  it('fires', () => expect(fired([1.5, 1.2, 0.2, 1.1, 1.3], 'we3_four_of_five_beyond_1s')).toEqual([4]));
  it('fires below the line too', () => expect(fired([-1.5, -1.2, -1.1, -1.3], 'we3_four_of_five_beyond_1s')).toEqual([3]));
  it('does not fire with one of them on the other side', () =>
    expect(fired([1.5, 1.2, 0.2, -1.1, 1.3], 'we3_four_of_five_beyond_1s')).toEqual([]));
  it('does not fire with only three beyond', () => expect(fired([1.5, 1.2, 0.2, 0.3, 1.3], 'we3_four_of_five_beyond_1s')).toEqual([]));
});

describe('Western Electric rule 4: eight in a row on one side', () => {
  const eight = [0.1, 0.4, 0.2, 0.9, 0.3, 0.5, 0.2, 0.1];
  it('fires on the eighth point', () => expect(fired(eight, 'we4_run_one_side')).toEqual([7]));
  it('keeps firing while the run continues', () => expect(fired([...eight, 0.6], 'we4_run_one_side')).toEqual([7, 8]));
  it('does not fire on seven', () => expect(fired(eight.slice(0, 7), 'we4_run_one_side')).toEqual([]));
  it('a point on the centre line breaks the run', () =>
    expect(fired([0.1, 0.4, 0.2, 0, 0.3, 0.5, 0.2, 0.1], 'we4_run_one_side')).toEqual([]));
  it('with a nine-point run (used by some SPC references, reference §10.2) it fires one point later', () =>
    expect(fired([...eight, 0.6], 'we4_run_one_side', 9)).toEqual([8]));
  it('does not fire on an alternating series', () =>
    expect(fired([0.5, -0.5, 0.5, -0.5, 0.5, -0.5, 0.5, -0.5, 0.5], 'we4_run_one_side')).toEqual([]));
});

describe('individuals chart', () => {
  it('moving ranges: 3.4, 3.7, 3.6 → 0.3, 0.1', () => {
    // Source: SAS/QC IRCHART documentation, moving-range example.
    const mr = movingRanges([3.4, 3.7, 3.6]);
    expect(mr[0]).toBeCloseTo(0.3, 12);
    expect(mr[1]).toBeCloseTo(0.1, 12);
  });

  it('σ̂ = MR̄/d2 with d2 = 1.128; I-chart limits X̄ ± 2.66 MR̄; MR UCL 3.267 MR̄', () => {
    // Source: d2(2) = 1.128 (ASTM E2587; Montgomery, Introduction to SQC, Appendix VI);
    // 2.66 and 3.267 per reference §10.1. Series worked by hand: MR = 2, 1, 2, 1 → MR̄ = 1.5.
    expect(D2_N2).toBe(1.128);
    const chart = individualsChart([10, 12, 11, 13, 12]);
    expect(chart.mrBar).toBeCloseTo(1.5, 12);
    expect(chart.sigma).toBeCloseTo(1.5 / 1.128, 12);
    expect(chart.centre).toBeCloseTo(11.6, 12);
    expect(chart.ucl).toBeCloseTo(11.6 + 2.66 * 1.5, 2);
    expect(chart.lcl).toBeCloseTo(11.6 - 2.66 * 1.5, 2);
    expect(chart.mrUcl).toBeCloseTo(3.267 * 1.5, 9);
    expect(chart.sigmaBasis).toMatch(/1\.128/);
    expect(chart.warnings[0]).toMatch(/provisional/);
  });

  it('reports zones and rules per point against baseline limits', () => {
    // 9 sits on the −1σ line, which counts as inside zone C.
    const chart = individualsChart([10, 10.5, 13.5, 9, 8.5, 7.5], { centre: 10, sigma: 1 });
    expect(chart.points.map((p) => p.zone)).toEqual(['C', 'C', 'beyond', 'C', 'B', 'A']);
    expect(chart.points.map((p) => p.side)).toEqual(['on', 'above', 'above', 'below', 'below', 'below']);
    expect(chart.points[2]!.rules).toContain('we1_beyond_3s');
    expect(chart.points[0]!.rules).toEqual([]);
  });

  it('refuses data it cannot chart', () => {
    expect(() => individualsChart([5])).toThrow(/At least 2/);
    expect(() => individualsChart([5, 5, 5])).toThrow(/moving range is zero/);
    expect(() => individualsChart([5, Number.NaN])).toThrow(/Value 2/);
  });

  it('is unchanged in shape by shifting and scaling the data (no NaN)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: 3, maxLength: 40 }),
        fc.double({ min: -1e3, max: 1e3, noNaN: true }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (xs, shift, scale) => {
          if (sigmaFromMovingRange(xs).sigma < 1e-6) return;
          const a = individualsChart(xs);
          // Points within rounding of a zone line or the centre may legitimately flip sides.
          if (a.points.some((p) => [0, 1, 2, 3].some((k) => Math.abs(Math.abs(p.z) - k) < 1e-9))) return;
          const b = individualsChart(xs.map((x) => x * scale + shift));
          expect(Number.isFinite(a.ucl) && Number.isFinite(a.lcl) && a.ucl > a.lcl).toBe(true);
          expect(b.points.map((p) => p.rules)).toEqual(a.points.map((p) => p.rules));
        },
      ),
    );
  });
});

describe('capability', () => {
  it('reference §10.4: USL 300, LSL 240, σ 8, μ 280 → Cp 1.25, Cpk 0.833', () => {
    // Formulas: SAS SHEWHART procedure documentation; ggQC Cpk (reference S85, S86).
    const c = capability({ mean: 280, sigma: 8, lsl: 240, usl: 300 });
    expect(c.cp).toBeCloseTo(1.25, 9);
    expect(c.cpu).toBeCloseTo(0.833, 3);
    expect(c.cpl).toBeCloseTo(1.667, 3);
    expect(c.cpk).toBeCloseTo(0.833, 3);
  });

  it('textbook example: target 16.0 ± 0.2 oz, μ 15.9, σ 0.1 → Cpk 0.33', () => {
    // Source: Heizer & Render, Operations Management, Supplement 6, "Cocoa Fizz" Cpk example
    // (as reproduced in a public slide set; the book attribution is from memory).
    const c = capability({ mean: 15.9, sigma: 0.1, lsl: 15.8, usl: 16.2 });
    expect(c.cpk).toBeCloseTo(0.33, 2);
    expect(c.cp).toBeCloseTo(0.667, 3);
  });

  it('one-sided and from readings, stating the sigma used', () => {
    const upperOnly = capability({ mean: 2, sigma: 0.5, usl: 4 });
    expect(upperOnly.cp).toBeNull();
    expect(upperOnly.cpk).toBeCloseTo(4 / 3, 12);
    const fromValues = capabilityFromValues([10, 12, 11, 13, 12], { lsl: 5, usl: 20 });
    expect(fromValues.sigma).toBeCloseTo(1.5 / 1.128, 12);
    expect(fromValues.sigmaBasis).toMatch(/within: MR̄\/d2/);
    expect(() => capability({ mean: 1, sigma: 0, usl: 2 })).toThrow(/Sigma/);
    expect(() => capability({ mean: 1, sigma: 1 })).toThrow(/at least one/);
    expect(() => capability({ mean: 1, sigma: 1, lsl: 3, usl: 2 })).toThrow(/below the upper/);
  });
});
