import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { FormulaError, metalFraction, molarMass, parseFormula } from '@/lib/chemistry/formula';
import { ATOMIC_WEIGHTS } from '@/lib/chemistry/atomic-weights';

describe('metal fractions of plating salts', () => {
  // Source: reference sheet §5 "Metal-content fraction of a salt" (w = M_metal / M_salt), computed
  // there from IUPAC atomic weights; checked to 0.01 % (two decimals of a percentage).
  const cases: [string, string, number][] = [
    ['NiSO4·6H2O', 'Ni', 22.33],
    ['NiSO4·7H2O', 'Ni', 20.9],
    ['NiCl2·6H2O', 'Ni', 24.69],
    ['Ni(SO3NH2)2·4H2O', 'Ni', 18.18],
    ['CuSO4·5H2O', 'Cu', 25.45],
    ['CuCN', 'Cu', 70.95],
    ['ZnO', 'Zn', 80.34],
    ['ZnCl2', 'Zn', 47.97],
    ['ZnSO4·7H2O', 'Zn', 22.74],
    ['SnSO4', 'Sn', 55.27],
    ['K2SnO3·3H2O', 'Sn', 39.71],
    ['Na2SnO3·3H2O', 'Sn', 44.51],
    ['AgCN', 'Ag', 80.57],
    ['KAg(CN)2', 'Ag', 54.2],
    ['KAu(CN)2', 'Au', 68.37],
    ['CrO3', 'Cr', 52.0],
  ];
  it.each(cases)('%s is %s %f %%', (formula, element, percent) => {
    expect(metalFraction(formula, element) * 100).toBeCloseTo(percent, 2);
  });
});

describe('molar masses', () => {
  // Source: reference sheet §5 (salt molar masses printed beside the fractions) and §4.2.
  it.each([
    ['NiSO4·6H2O', 262.84],
    ['NiCl2·6H2O', 237.68],
    ['Ni(SO3NH2)2·4H2O', 322.91],
    ['CuSO4·5H2O', 249.68],
    ['H3BO3', 61.83],
    ['H2SO4', 98.072],
    ['CrO3', 99.993],
  ])('%s = %f g/mol', (formula, mass) => {
    const places = String(mass).split('.')[1]?.length ?? 0;
    expect(molarMass(formula)).toBeCloseTo(mass, places);
  });

  it('reads the hydrate dot, the full stop and subscript digits the same way', () => {
    const m = molarMass('NiSO4·6H2O');
    expect(molarMass('NiSO4.6H2O')).toBe(m);
    expect(molarMass('NiSO4*6H2O')).toBe(m);
    expect(molarMass('NiSO₄·6H₂O')).toBe(m);
  });

  it('multiplies bracketed groups and hydrate coefficients', () => {
    expect(parseFormula('Ni(SO3NH2)2·4H2O')).toEqual({ Ni: 1, S: 2, O: 10, N: 2, H: 12 });
    expect(parseFormula('KAu(CN)2')).toEqual({ K: 1, Au: 1, C: 2, N: 2 });
    expect(parseFormula('K2SnO3·3H2O')).toEqual({ K: 2, Sn: 1, O: 6, H: 6 });
    expect(parseFormula('NiSO4·0.5H2O')).toEqual({ Ni: 1, S: 1, O: 4.5, H: 1 });
  });
});

describe('bad formulas get a clear message', () => {
  it.each([
    ['', /empty/],
    ['Xx2', /"Xx" is not an element/],
    ['Ni(SO4', /never closed/],
    ['NiSO4)', /no opening bracket/],
    ['NiSO4··6H2O', /expected an element/],
    ['nickel', /unexpected "n"/],
    ['Ni0', /subscript of 0/],
  ])('%j', (formula, message) => {
    expect(() => parseFormula(formula)).toThrow(FormulaError);
    expect(() => parseFormula(formula)).toThrow(message);
  });

  it('refuses an element the compound does not contain', () => {
    expect(() => metalFraction('ZnO', 'Ni')).toThrow(/contains no Ni/);
    expect(() => metalFraction('ZnO', 'Qq')).toThrow(/not an element/);
  });
});

describe('properties', () => {
  const symbols = Object.keys(ATOMIC_WEIGHTS);
  const formulaArb = fc
    .array(fc.tuple(fc.constantFrom(...symbols), fc.integer({ min: 1, max: 12 })), { minLength: 1, maxLength: 5 })
    .map((parts) => parts.map(([s, n]) => (n === 1 ? s : `${s}${n}`)).join(''));

  it('a hydrate adds n × M(H2O) and the mass is finite and positive', () => {
    fc.assert(
      fc.property(formulaArb, fc.integer({ min: 1, max: 12 }), (f, n) => {
        const anhydrous = molarMass(f);
        expect(Number.isFinite(anhydrous) && anhydrous > 0).toBe(true);
        expect(molarMass(`${f}·${n}H2O`)).toBeCloseTo(anhydrous + n * molarMass('H2O'), 9);
      }),
    );
  });

  it('every metal fraction lies in (0, 1]', () => {
    fc.assert(
      fc.property(formulaArb, (f) => {
        for (const el of Object.keys(parseFormula(f))) {
          const w = metalFraction(f, el);
          expect(w > 0 && w <= 1 + 1e-12).toBe(true);
        }
      }),
    );
  });
});
