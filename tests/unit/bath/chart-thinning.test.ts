import { describe, expect, it } from 'vitest';
import { thinForChart } from '@/lib/bath/chart';

// 20,000 readings of a sine with one rule hit and one reading outside specification.
const points = Array.from({ length: 20_000 }, (_, i) => ({ i, value: 50 + 5 * Math.sin(i / 300), rules: i === 12_345 ? ['beyond 3σ'] : [] }));
points[7_777]!.value = 80; // outside an upper specification of 60

describe('thinning a long range for the chart', () => {
  const outside = (p: { value: number }) => p.value > 60;
  const thin = thinForChart(points, 1500, outside);

  it('draws at most the budget, in time order', () => {
    expect(thin.length).toBeLessThanOrEqual(1500);
    expect(thin.length).toBeGreaterThan(1000);
    expect(thin.map((p) => p.i)).toEqual([...thin.map((p) => p.i)].sort((a, b) => a - b));
  });

  it('keeps every reading a rule fired on or outside specification, and the extremes of the range', () => {
    expect(thin.some((p) => p.i === 12_345)).toBe(true);
    expect(thin.some((p) => p.i === 7_777)).toBe(true);
    const values = points.map((p) => p.value).filter((v) => v <= 60);
    const shown = thin.map((p) => p.value).filter((v) => v <= 60);
    expect(Math.max(...shown)).toBe(Math.max(...values));
    expect(Math.min(...shown)).toBe(Math.min(...values));
  });

  it('leaves a range within the budget as it is', () => {
    expect(thinForChart(points.slice(0, 900), 1500, outside)).toHaveLength(900);
  });
});
