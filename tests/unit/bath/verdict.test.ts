import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { judgeValue, NEAR_LIMIT_FRACTION, type Limits } from '@/lib/bath/verdict';

// Watts nickel sulfate band (Wikipedia "Nickel electroplating"), with illustrative spec limits.
const band: Limits = { target: 225, lowerControl: 150, upperControl: 300, lowerSpec: 120, upperSpec: 330 };

describe('judgeValue', () => {
  it('near = within 10 % of the band width of a control limit (common practice)', () => {
    expect(NEAR_LIMIT_FRACTION).toBe(0.1);
    expect(judgeValue(225, band).status).toBe('in_range');
    expect(judgeValue(165.1, band).status).toBe('in_range');
    expect(judgeValue(165, band)).toMatchObject({ status: 'near_limit', limit: 'lower_control' });
    expect(judgeValue(285, band)).toMatchObject({ status: 'near_limit', limit: 'upper_control' });
    expect(judgeValue(300, band)).toMatchObject({ status: 'near_limit', limit: 'upper_control' });
  });

  it('out of control and out of spec name the limit crossed; out of spec is worse', () => {
    const outControl = judgeValue(310, band);
    const outSpec = judgeValue(331, band);
    expect(outControl).toMatchObject({ status: 'out_of_range', limit: 'upper_control', outOfSpec: false, severity: 2 });
    expect(outSpec).toMatchObject({ status: 'out_of_range', limit: 'upper_spec', outOfSpec: true, severity: 3 });
    expect(judgeValue(100, band)).toMatchObject({ limit: 'lower_spec', outOfSpec: true });
    expect(judgeValue(140, band)).toMatchObject({ limit: 'lower_control', outOfSpec: false });
    expect(outSpec.message).toMatch(/above the upper specification limit \(330\)/);
  });

  it('says the value once, to four significant figures, with its unit when given', () => {
    const zinc: Limits = { target: 60, lowerControl: 50, upperControl: 70, lowerSpec: 45, upperSpec: 75 };
    expect(judgeValue(41.08538, zinc, { unit: 'g/L' }).message).toBe('41.09 g/L is below the lower specification limit (45 g/L).');
    expect(judgeValue(41.08538, zinc).message).toBe('41.09 is below the lower specification limit (45).');
  });

  it('handles one-sided limits (a contaminant with only a maximum)', () => {
    const cr3: Limits = { target: 1.5, upperControl: 3, upperSpec: 4 };
    expect(judgeValue(0, cr3).status).toBe('in_range');
    expect(judgeValue(2.9, cr3)).toMatchObject({ status: 'near_limit', limit: 'upper_control' });
    expect(judgeValue(3.5, cr3)).toMatchObject({ status: 'out_of_range', limit: 'upper_control' });
    expect(judgeValue(4.1, cr3)).toMatchObject({ status: 'out_of_range', limit: 'upper_spec' });
  });

  it('uses specification limits as the band when no control limits are set', () => {
    expect(judgeValue(5, { lowerSpec: 10, upperSpec: 20 })).toMatchObject({ limit: 'lower_spec', outOfSpec: true });
    expect(judgeValue(19.5, { lowerSpec: 10, upperSpec: 20 })).toMatchObject({ status: 'near_limit', limit: 'upper_spec' });
  });

  it('rejects bad values and inconsistent limits with a message', () => {
    expect(() => judgeValue(Number.NaN, band)).toThrow(/must be a number/);
    expect(() => judgeValue(1, {})).toThrow(/at least one/);
    expect(() => judgeValue(1, { lowerControl: 5, upperControl: 2 })).toThrow(/lower limit is above/);
    expect(() => judgeValue(1, { lowerControl: 5, upperControl: 10, upperSpec: 8 })).toThrow(/inside the control band/);
    expect(() => judgeValue(1, { lowerControl: 5, upperControl: 10, target: 11 })).toThrow(/target/);
  });

  it('is monotone: moving away from the centre never improves the verdict', () => {
    const arbLimits = fc
      .tuple(
        fc.double({ min: -1e3, max: 1e3, noNaN: true }),
        fc.double({ min: 0.01, max: 1e3, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
      )
      .map(([lo, width, specLo, specHi]) => ({ lowerControl: lo, upperControl: lo + width, lowerSpec: lo - specLo, upperSpec: lo + width + specHi }));
    fc.assert(
      fc.property(arbLimits, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 2e3, noNaN: true }), (l, a, b) => {
        const mid = (l.lowerControl + l.upperControl) / 2;
        const [near, far] = a * 2e3 <= b ? [a * 2e3, b] : [b, a * 2e3];
        expect(judgeValue(mid + near, l).severity).toBeLessThanOrEqual(judgeValue(mid + far, l).severity);
        expect(judgeValue(mid - near, l).severity).toBeLessThanOrEqual(judgeValue(mid - far, l).severity);
      }),
    );
  });
});
