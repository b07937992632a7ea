import { describe, expect, it } from 'vitest';
import { describeRecommendation, readRecommendation, recommendCorrection, type AdviceAnalyte } from '@/lib/bath/recommend';
import { metalFraction } from '@/lib/chemistry/formula';

const nickel: AdviceAnalyte = { key: 'nickel', name: 'Nickel metal', unit: 'g/L', target: 70, supply: { kind: 'salt', saltId: 'nickel-sulfate-hexahydrate' } };

describe('recommendCorrection', () => {
  it('low nickel metal: adds nickel sulfate hexahydrate by its metal fraction', () => {
    // Source: reference sheet §5 worked example — Ni 62 → 70 g/L in 2000 L: 16.0 kg Ni ÷ 0.2233 = 71.65 kg NiSO4·6H2O.
    const rec = recommendCorrection({ analyte: nickel, volumeL: 2000, measured: 62, verdict: 'out_of_range' });
    expect(rec.kind).toBe('add');
    if (rec.kind !== 'add') return;
    expect(rec.material).toBe('Nickel sulfate hexahydrate');
    expect(rec.unit).toBe('kg');
    expect(rec.amount).toBeCloseTo(16 / metalFraction('NiSO4·6H2O', 'Ni'), 9);
    expect(rec.amount).toBeCloseTo(71.65, 1);
  });

  it('high: decant and make up with water, X = V (C − Ct)/C', () => {
    // Source: reference sheet §5 worked example — 2000 L at 300 g/L, target 270: X = 200 L.
    const rec = recommendCorrection({ analyte: { ...nickel, target: 270 }, volumeL: 2000, measured: 300, verdict: 'out_of_range' });
    expect(rec).toMatchObject({ kind: 'decant', volumeL: 2000 });
    if (rec.kind === 'decant') expect(rec.decantL).toBeCloseTo(200, 9);
  });

  it('an additive in mL/L is dosed in litres: Δ mL/L × V ÷ 1000', () => {
    // Hand computed: (1.0 − 0.4) mL/L × 1500 L = 900 mL = 0.9 L.
    const brightener: AdviceAnalyte = { key: 'brightener', name: 'Brightener', unit: 'mL/L', target: 1, supply: { kind: 'additive', name: 'Nickel brightener' } };
    const rec = recommendCorrection({ analyte: brightener, volumeL: 1500, measured: 0.4, verdict: 'out_of_range' });
    expect(rec).toMatchObject({ kind: 'add', unit: 'L', material: 'Nickel brightener' });
    if (rec.kind === 'add') expect(rec.amount).toBeCloseTo(0.9, 12);
  });

  it('a concentrate is dosed in litres of concentrate', () => {
    // Source: reference sheet §5 — 16 kg Ni from a 100 g/L concentrate is 160 L.
    const rec = recommendCorrection({
      analyte: { ...nickel, supply: { kind: 'concentrate', saltId: 'nickel-sulfamate-concentrate' } },
      volumeL: 2000,
      measured: 62,
      verdict: 'out_of_range',
    });
    expect(rec).toMatchObject({ kind: 'add', unit: 'L' });
    if (rec.kind === 'add') expect(rec.amount).toBeCloseTo(160, 9);
  });

  it('mg/L analytes are worked in g/L', () => {
    // Hand computed: chloride 40 → 80 mg/L in 1000 L is 0.040 g/L × 1000 L = 40 g = 0.040 kg.
    const rec = recommendCorrection({
      analyte: { key: 'chloride', name: 'Chloride', unit: 'mg/L', target: 80, supply: { kind: 'as_measured', name: 'Chloride' } },
      volumeL: 1000,
      measured: 40,
      verdict: 'out_of_range',
    });
    if (rec.kind !== 'add') throw new Error(`expected an addition, got ${rec.kind}`);
    expect(rec.amount).toBeCloseTo(0.04, 12);
  });

  it('says so when no calculator applies, and recommends nothing in range', () => {
    const ph: AdviceAnalyte = { key: 'ph', name: 'pH', unit: 'pH', target: 4.9, supply: null };
    expect(recommendCorrection({ analyte: ph, volumeL: 2000, measured: 4.1, verdict: 'out_of_range' })).toMatchObject({ kind: 'none' });
    expect(recommendCorrection({ analyte: ph, volumeL: 2000, measured: 5.6, verdict: 'out_of_range' }).kind).toBe('none');
    expect(recommendCorrection({ analyte: nickel, volumeL: 2000, measured: 62, verdict: 'near_limit' })).toEqual({ kind: 'none', reason: 'No correction needed.' });
  });

  it('reads in US units for a US reader', () => {
    // Source: NIST SP 811 App. B.8 — 1 lb = 0.45359237 kg, so 71.65 kg = 157.96 lb, shown to 4 figures as 158; 1 gal = 3.785411784 L.
    const rec = recommendCorrection({ analyte: nickel, volumeL: 2000, measured: 62, verdict: 'out_of_range' });
    expect(describeRecommendation(rec, 'us')).toBe('Add 158 lb of Nickel sulfate hexahydrate.');
    expect(describeRecommendation({ kind: 'decant', decantL: 378.5411784, volumeL: 3785.411784, notes: [] }, 'us')).toBe(
      'Decant 100 gal and make back up to 1000 gal with water.',
    );
  });

  it('reads stored recommendations back and refuses odd shapes', () => {
    expect(readRecommendation({ kind: 'add', material: 'X', amount: 2, unit: 'kg', notes: [] })).toMatchObject({ kind: 'add', amount: 2 });
    expect(readRecommendation({ kind: 'add', material: 'X', amount: '2', unit: 'kg' })).toBeNull();
    expect(readRecommendation(null)).toBeNull();
  });
});
