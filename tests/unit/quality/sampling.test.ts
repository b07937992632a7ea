import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { sampleSizeFor, validateSamplingTable, Z14_LEVEL_II, type SamplingRow } from '@/lib/quality/sampling';

describe('ANSI/ASQ Z1.4 general inspection level II', () => {
  // Source: ANSI/ASQ Z1.4-2008 Table I (code letters, level II) and Table II-A (sample sizes).
  it.each([
    [3, 'A', 2],
    [8, 'A', 2],
    [9, 'B', 3],
    [25, 'C', 5],
    [26, 'D', 8],
    [90, 'E', 13],
    [150, 'F', 20],
    [280, 'G', 32],
    [500, 'H', 50],
    [501, 'J', 80],
    [1200, 'J', 80],
    [3200, 'K', 125],
    [10000, 'L', 200],
    [35000, 'M', 315],
    [150000, 'N', 500],
    [500000, 'P', 800],
    [500001, 'Q', 1250],
    [10_000_000, 'Q', 1250],
  ])('lot of %i → %s, sample %i', (lot, letter, n) => {
    expect(sampleSizeFor(lot)).toEqual({ lotSize: lot, codeLetter: letter, sampleSize: n, inspectAll: false });
  });

  it('inspects the whole lot when the sample would be as large (Z1.4 note to Table II-A)', () => {
    expect(sampleSizeFor(2)).toEqual({ lotSize: 2, codeLetter: 'A', sampleSize: 2, inspectAll: true });
    expect(sampleSizeFor(1)).toEqual({ lotSize: 1, codeLetter: null, sampleSize: 1, inspectAll: true });
  });

  it('rejects a lot of zero, a negative lot or a part-piece lot', () => {
    expect(() => sampleSizeFor(0)).toThrow(/greater than zero/);
    expect(() => sampleSizeFor(-5)).toThrow(/greater than zero/);
    expect(() => sampleSizeFor(10.5)).toThrow(/whole number/);
    expect(() => sampleSizeFor(Number.NaN)).toThrow(/Lot size/);
  });

  it('the seeded table is valid and sample size never falls as lots grow', () => {
    expect(validateSamplingTable(Z14_LEVEL_II)).toEqual([]);
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2_000_000 }), fc.integer({ min: 0, max: 2_000_000 }), (a, d) => {
        const small = sampleSizeFor(a);
        const big = sampleSizeFor(a + d);
        expect(small.sampleSize).toBeLessThanOrEqual(a);
        expect(big.sampleSize).toBeGreaterThanOrEqual(small.sampleSize);
      }),
    );
  });
});

describe('an edited table', () => {
  it('is used when valid', () => {
    const table: SamplingRow[] = [
      { minLot: 1, maxLot: 50, codeLetter: 'S1', sampleSize: 5 },
      { minLot: 51, maxLot: null, codeLetter: 'S2', sampleSize: 10 },
    ];
    expect(sampleSizeFor(40, table)).toMatchObject({ codeLetter: 'S1', sampleSize: 5 });
    expect(sampleSizeFor(4, table)).toMatchObject({ sampleSize: 4, inspectAll: true });
  });

  it('is refused with reasons when gapped, unordered or closed', () => {
    const bad: SamplingRow[] = [
      { minLot: 2, maxLot: 10, codeLetter: 'A', sampleSize: 5 },
      { minLot: 12, maxLot: 20, codeLetter: 'B', sampleSize: 3 },
    ];
    const problems = validateSamplingTable(bad).join(' ');
    expect(problems).toMatch(/must start right after/);
    expect(problems).toMatch(/must not decrease/);
    expect(problems).toMatch(/and over/);
    expect(() => sampleSizeFor(5, bad)).toThrow(/not usable/);
  });
});
