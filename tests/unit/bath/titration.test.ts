import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  baumeToSpecificGravity,
  computeAnalysis,
  effectiveSampleMl,
  GRAMS_PER_LITRE_PER_OZ_PER_GAL,
  specificGravityToBaume,
  validateMethod,
  type TitrationMethod,
} from '@/lib/bath/methods/titration';

const nickel: TitrationMethod = {
  kind: 'titration',
  id: 'test-ni',
  name: 'Nickel test',
  reportedAs: 'Ni',
  unit: 'g/L',
  sample: { volumeMl: 2 },
  titrant: { name: 'EDTA', concentration: 0.1, concentrationUnit: 'mol/L' },
  blankMl: 0,
  stoichiometry: { reported: 1, titrant: 1 },
  indicator: 'murexide',
  source: 'test',
  status: 'computed',
};

describe('generic titration formula (reference §4.1)', () => {
  it('value = (V − blank) × C × f × F ÷ sample', () => {
    // Source: reference §4.1 generic formula; Ni 58.6934 g/mol (IUPAC 2007), 2 mL sample.
    const r = computeAnalysis(nickel, { buretteMl: 25.3, blankMl: 0.3, titrantFactor: 1.002 });
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.value).toBeCloseTo((25 * 0.1 * 1.002 * 58.6934) / 2, 9);
  });

  it('uses the effective sample after dilution (5 mL to 100 mL, 5 mL aliquot → 0.25 mL)', () => {
    // Source: reference §4.1 dilution example.
    expect(effectiveSampleMl({ ...nickel, sample: { volumeMl: 5, dilutedToMl: 100, aliquotMl: 5 } })).toBeCloseTo(0.25, 12);
  });

  it('converts to oz/gal with 7.4892 g/L per oz/gal', () => {
    // Source: reference §1.1 (1 oz/gal = 7.4892 g/L; handbook factor 7.49, Metal Finishing Guide Book).
    expect(GRAMS_PER_LITRE_PER_OZ_PER_GAL).toBeCloseTo(7.4892, 4);
    const g = computeAnalysis(nickel, { buretteMl: 20 });
    const oz = computeAnalysis({ ...nickel, unit: 'oz/gal' }, { buretteMl: 20 });
    if (g.ok && oz.ok) expect(oz.value * 7.4892).toBeCloseTo(g.value, 3);
    else throw new Error('expected results');
  });

  it('uses a standardised concentration entered on the day', () => {
    const r = computeAnalysis(nickel, { buretteMl: 10, titrantConcentration: 0.0985 });
    if (r.ok) expect(r.value).toBeCloseTo((10 * 0.0985 * 58.6934) / 2, 9);
    else throw new Error(r.message);
  });

  it('returns a clear error for bad inputs instead of NaN', () => {
    expect(computeAnalysis(nickel, {})).toMatchObject({ ok: false, field: 'buretteMl' });
    expect(computeAnalysis(nickel, { buretteMl: Number.NaN })).toMatchObject({ ok: false, field: 'buretteMl' });
    expect(computeAnalysis(nickel, { buretteMl: -1 })).toMatchObject({ ok: false });
    const belowBlank = computeAnalysis(nickel, { buretteMl: 0.2, blankMl: 0.5 });
    expect(belowBlank).toMatchObject({ ok: false, field: 'buretteMl' });
    if (!belowBlank.ok) expect(belowBlank.message).toMatch(/below the blank/);
    expect(computeAnalysis(nickel, { buretteMl: 5, titrantFactor: 0 })).toMatchObject({ ok: false, field: 'titrantFactor' });
  });

  it('refuses a stored method with impossible data', () => {
    const broken = { ...nickel, sample: { volumeMl: 0 }, reportedAs: 'Qq' };
    expect(validateMethod(broken).length).toBeGreaterThanOrEqual(2);
    const r = computeAnalysis(broken, { buretteMl: 5 });
    expect(r).toMatchObject({ ok: false, field: 'method' });
    expect(validateMethod({ ...nickel, sample: { volumeMl: 10, dilutedToMl: 5 } })).toContain(
      'The sample cannot be diluted to less than its own volume.',
    );
  });

  it('reads incomplete stored JSON as a problem, not a crash', () => {
    const partial = JSON.parse('{"kind":"titration","id":"x","name":"X"}') as TitrationMethod;
    expect(validateMethod(partial)).toEqual(['The method data is incomplete.']);
    expect(computeAnalysis(partial, { buretteMl: 1 })).toMatchObject({ ok: false, field: 'method' });
    const odd = JSON.parse('{"kind":"direct","id":"y","name":"Y","quantity":"colour"}') as TitrationMethod;
    expect(computeAnalysis(odd, { reading: 1 })).toMatchObject({ ok: false, field: 'method' });
  });

  it('survives a JSON round trip unchanged', () => {
    const copy = JSON.parse(JSON.stringify(nickel)) as TitrationMethod;
    expect(computeAnalysis(copy, { buretteMl: 12 })).toEqual(computeAnalysis(nickel, { buretteMl: 12 }));
  });

  it('never returns NaN or a negative value for valid readings', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 100, noNaN: true }), fc.double({ min: 0, max: 5, noNaN: true }), (v, blank) => {
        const r = computeAnalysis(nickel, { buretteMl: v, blankMl: blank });
        if (r.ok) expect(Number.isFinite(r.value) && r.value >= 0).toBe(true);
        else expect(v).toBeLessThan(blank);
      }),
    );
  });
});

describe('direct readings', () => {
  const baume = { kind: 'direct', id: 'b', name: 'Baumé', quantity: 'baume', unit: '°Bé', reportAs: 'specific_gravity', source: 't', status: 'published' } as const;

  it('Baumé to specific gravity, heavier than water: SG = 145/(145 − °Bé)', () => {
    // Source: Marks' Handbook via Engineers Edge; AIC/CAMEO "Baumé" (reference §4.3 test values).
    expect(baumeToSpecificGravity(20)).toBeCloseTo(1.16, 4);
    expect(baumeToSpecificGravity(30)).toBeCloseTo(1.2609, 4);
    expect(baumeToSpecificGravity(66)).toBeCloseTo(1.8354, 4);
    expect(specificGravityToBaume(1.8354)).toBeCloseTo(66, 2);
    expect(computeAnalysis(baume, { reading: 30 })).toMatchObject({ ok: true, unit: 'SG' });
  });

  it('lighter than water: SG = 140/(130 + °Bé)', () => {
    // Source: Marks' Handbook via Engineers Edge (reference §4.3); 10 °Bé light = water.
    expect(baumeToSpecificGravity(10, 'light')).toBeCloseTo(1, 12);
  });

  it('rejects readings outside the physical window', () => {
    const ph = { kind: 'direct', id: 'p', name: 'pH', quantity: 'ph', unit: 'pH', source: 't', status: 'published' } as const;
    expect(computeAnalysis(ph, { reading: 4.2 })).toMatchObject({ ok: true, value: 4.2 });
    expect(computeAnalysis(ph, { reading: 22 })).toMatchObject({ ok: false, field: 'reading' });
    expect(computeAnalysis(ph, {})).toMatchObject({ ok: false, field: 'reading' });
    expect(() => baumeToSpecificGravity(145)).toThrow(/Baumé/);
  });
});
