import { describe, expect, it } from 'vitest';
import { describeRules, rulesAtLast, RULE_MIN_POINTS } from '@/lib/bath/run-rules';

// A steady series: values alternate around 10 so the moving range (and sigma) is known.
// MR̄ = 0.2, σ̂ = 0.2/1.128 = 0.1773 (Source: NIST/SEMATECH e-Handbook §6.3.2, d2 = 1.128 for n = 2).
const steady = (n: number) => Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 10.1 : 9.9));

describe('rulesAtLast (Western Electric rules at the newest point; Source: Western Electric SQC Handbook 1956 via NIST/SEMATECH §6.3.2)', () => {
  it('fires rule 1 when the new point is beyond 3σ of the last 30', () => {
    expect(rulesAtLast([...steady(29), 11])).toContain('we1_beyond_3s');
  });

  it('fires nothing for a new point inside the band', () => {
    expect(rulesAtLast([...steady(29), 10.05])).toEqual([]);
  });

  it('fires the run rule after eight points on one side', () => {
    const series = [...steady(22), 10.12, 10.1, 10.15, 10.11, 10.13, 10.1, 10.14, 10.12];
    expect(rulesAtLast(series)).toContain('we4_run_one_side');
  });

  it('judges only the last 30 points', () => {
    // An old wild point beyond the window does not widen sigma for the newest one.
    const old = [50, 0, 50, 0, 50];
    expect(rulesAtLast([...old, ...steady(29), 11])).toContain('we1_beyond_3s');
  });

  it('needs enough history, and copes with identical readings', () => {
    expect(rulesAtLast([...steady(RULE_MIN_POINTS - 2), 50])).toEqual([]);
    expect(rulesAtLast(Array.from({ length: 30 }, () => 7))).toEqual([]);
  });

  it('describes rules in words', () => {
    expect(describeRules(['we1_beyond_3s'])).toBe('One point beyond 3σ');
  });
});
