import { describe, expect, it } from 'vitest';
import { additiveDoses, ampHoursSince } from '@/lib/bath/amp-hours';

const at = (h: number) => new Date(Date.UTC(2026, 10, 1) + h * 3600_000);

describe('ampHoursSince', () => {
  const readings = [
    { at: at(0), ampHours: 1000 },
    { at: at(8), ampHours: 4000 },
    { at: at(16), ampHours: 9000 },
    { at: at(24), ampHours: 500 }, // meter reset, then 500 A·h run
    { at: at(32), ampHours: 2500 },
  ];

  it('sums the rises after the last reading at or before `since`, counting a reset from zero', () => {
    // Hand computed: from the 8 h reading: (9000 − 4000) + 500 + (2500 − 500) = 7500 A·h.
    const r = ampHoursSince(readings, at(10));
    expect(r).toMatchObject({ ampHours: 7500, resets: 1, complete: true });
    expect(r.from).toEqual(at(8));
  });

  it('counts everything with no `since`, and flags a count that starts after `since`', () => {
    expect(ampHoursSince(readings, null).ampHours).toBe(3000 + 5000 + 500 + 2000);
    expect(ampHoursSince(readings, at(-5))).toMatchObject({ ampHours: 10500, complete: false });
    expect(ampHoursSince(readings, at(40)).ampHours).toBe(0);
    expect(ampHoursSince([], null)).toMatchObject({ ampHours: 0, from: null, complete: false });
  });

  it('refuses readings that are not numbers', () => {
    expect(() => ampHoursSince([{ at: at(0), ampHours: Number.NaN }], null)).toThrow(/Meter reading must be a number/);
  });
});

describe('additiveDoses', () => {
  it('12 000 A·h at 150 mL/kA·h calls for 1.80 L', () => {
    // Source: reference sheet §5 worked example (rate illustrative).
    const [d] = additiveDoses(
      [{ analyteId: 'a', name: 'Brightener', rateMlPerKAh: 150, lastAdditionAt: at(1) }],
      [
        { at: at(0), ampHours: 30_000 },
        { at: at(20), ampHours: 42_000 },
      ],
    );
    expect(d?.kiloAmpHours).toBeCloseTo(12, 12);
    expect(d?.doseL).toBeCloseTo(1.8, 12);
  });
});
