import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  additionAsMeasuredKg,
  ampHourAdditionMl,
  concentrateAdditionL,
  decantForDilutionL,
  planCorrection,
  saltAdditionKg,
} from '@/lib/bath/additions';
import { metalFraction } from '@/lib/chemistry/formula';

describe('reference §5 worked examples (computed by hand)', () => {
  it('NiSO4·6H2O 240 → 280 g/L in 2000 L: 80.0 kg', () => {
    // (280 − 240) g/L × 2000 L / 1000 = 80.0 kg.
    expect(additionAsMeasuredKg({ volumeL: 2000, measured: 240, target: 280 })).toBeCloseTo(80.0, 6);
  });

  it('Ni metal 62 → 70 g/L in 2000 L as NiSO4·6H2O: 71.65 kg', () => {
    // 16.0 kg Ni ÷ 0.2233 = 71.65 kg.
    const kg = saltAdditionKg({ volumeL: 2000, measured: 62, target: 70, metalFraction: metalFraction('NiSO4·6H2O', 'Ni') });
    expect(kg).toBeCloseTo(71.65, 1);
  });

  it('the same 16 kg Ni from a 100 g/L concentrate: 160 L', () => {
    expect(concentrateAdditionL({ volumeL: 2000, measured: 62, target: 70, contentGramsPerLitre: 100 })).toBeCloseTo(160, 6);
  });

  it('2000 L at 300 g/L, target 270: decant 200 L', () => {
    // X = V (C − Ct)/C = 2000 × 30/300 = 200 L.
    expect(decantForDilutionL({ volumeL: 2000, measured: 300, target: 270 })).toBeCloseTo(200, 9);
  });

  it('12 000 A·h at 150 mL/kA·h: 1.80 L of brightener', () => {
    expect(ampHourAdditionMl({ ampHours: 12000, rateMlPerKAh: 150 })).toBeCloseTo(1800, 9);
  });
});

describe('combined correction', () => {
  it('dilutes for the most-over component, then adds the rest back from diluted values', () => {
    // Hand check: NiCl2·6H2O 165 vs 150 target → keep 150/165 of the bath = decant 181.8 L of 2000 L.
    // Boric acid 40 × 150/165 = 36.36 → add (45 − 36.36) × 2 = 17.27 kg.
    const plan = planCorrection({
      volumeL: 2000,
      components: [
        { key: 'chloride', name: 'Nickel chloride', measured: 165, target: 150, supply: { kind: 'salt', saltId: 'nickel-chloride-hexahydrate' } },
        { key: 'boric', name: 'Boric acid', measured: 40, target: 45, supply: { kind: 'as_measured', name: 'Boric acid' } },
      ],
    });
    expect(plan.dilutedFor).toBe('chloride');
    expect(plan.decantL).toBeCloseTo((2000 * 15) / 165, 6);
    const boric = plan.additions.find((a) => a.key === 'boric')!;
    expect(boric.amount).toBeCloseTo(((45 - (40 * 150) / 165) * 2000) / 1000, 6);
    expect(plan.additions.find((a) => a.key === 'chloride')!.amount).toBeCloseTo(0, 9);
  });

  it('without a high component it only adds', () => {
    const plan = planCorrection({
      volumeL: 1000,
      components: [{ key: 'ni', name: 'Nickel', measured: 70, target: 80, supply: { kind: 'concentrate', saltId: 'nickel-sulfamate-concentrate' } }],
    });
    expect(plan.decantL).toBe(0);
    expect(plan.additions[0]).toMatchObject({ unit: 'L' });
    expect(plan.additions[0]!.amount).toBeCloseTo(100, 9); // 10 g/L × 1000 L ÷ 100 g/L
  });

  it('warns when a forced dilution leaves another component high, and on big solid additions', () => {
    const plan = planCorrection({
      volumeL: 100,
      diluteFor: 'a',
      components: [
        { key: 'a', name: 'A', measured: 110, target: 100, supply: { kind: 'as_measured', name: 'A' } },
        { key: 'b', name: 'B', measured: 300, target: 100, supply: { kind: 'as_measured', name: 'B' } },
        { key: 'c', name: 'C', measured: 0, target: 80, supply: { kind: 'as_measured', name: 'C' } },
      ],
    });
    expect(plan.notes.join(' ')).toMatch(/B stays above target/);
    expect(plan.notes.join(' ')).toMatch(/5 % of the bath mass/);
  });

  it('rejects bad input with a message', () => {
    expect(() => planCorrection({ volumeL: 0, components: [] })).toThrow(/Bath volume/);
    expect(() => planCorrection({ volumeL: 10, components: [] })).toThrow(/at least one/);
    expect(() => saltAdditionKg({ volumeL: 10, measured: 1, target: 2, metalFraction: 0 })).toThrow(/Metal fraction/);
    expect(() => additionAsMeasuredKg({ volumeL: 10, measured: Number.NaN, target: 2 })).toThrow(/Measured/);
    expect(() =>
      planCorrection({ volumeL: 10, components: [{ key: 'x', name: 'X', measured: 1, target: 2, supply: { kind: 'concentrate', saltId: 'zinc-oxide' } }] }),
    ).toThrow(/not a liquid concentrate/);
  });
});

describe('properties', () => {
  const conc = fc.double({ min: 0, max: 1000, noNaN: true });
  const vol = fc.double({ min: 0.1, max: 1e5, noNaN: true });

  it('additions and decants are never negative or NaN, and decant never exceeds the bath', () => {
    fc.assert(
      fc.property(vol, conc, conc, fc.double({ min: 0.01, max: 1, noNaN: true }), (v, m, t, w) => {
        for (const x of [
          additionAsMeasuredKg({ volumeL: v, measured: m, target: t }),
          saltAdditionKg({ volumeL: v, measured: m, target: t, metalFraction: w }),
          decantForDilutionL({ volumeL: v, measured: m, target: t }),
        ]) {
          expect(Number.isFinite(x) && x >= 0).toBe(true);
        }
        expect(decantForDilutionL({ volumeL: v, measured: m, target: t })).toBeLessThanOrEqual(v);
      }),
    );
  });

  it('a plan leaves every component at target (to rounding) when dilution is chosen automatically', () => {
    fc.assert(
      fc.property(vol, fc.array(fc.tuple(conc, fc.double({ min: 1, max: 1000, noNaN: true })), { minLength: 1, maxLength: 4 }), (v, pairs) => {
        const plan = planCorrection({
          volumeL: v,
          components: pairs.map(([m, t], i) => ({ key: `k${i}`, name: `K${i}`, measured: m, target: t, supply: { kind: 'as_measured', name: `K${i}` } })),
        });
        plan.additions.forEach((a, i) => {
          const t = pairs[i]![1];
          expect(a.amount).toBeGreaterThanOrEqual(0);
          const final = a.afterDilution + (a.amount * 1000) / v;
          expect(Math.abs(final - t)).toBeLessThanOrEqual(1e-6 * Math.max(1, t));
        });
      }),
    );
  });
});
