import { describe, expect, it } from 'vitest';
import { getMethod, SEEDED_METHODS, TITRATION_METHODS } from '@/lib/bath/methods';
import { computeAnalysis, factorPerMl, gramsPerTitrantUnit, validateMethod, type TitrationMethod } from '@/lib/bath/methods/titration';
import { molarMass } from '@/lib/chemistry/formula';

function titration(id: string): TitrationMethod {
  const m = getMethod(id);
  if (!m || m.kind !== 'titration') throw new Error(`no titration ${id}`);
  return m;
}

describe('seeded methods reproduce the worked factors of their sources', () => {
  // [method, published or worked factor per mL, decimal places stated, source]
  const cases: [string, number, number, string][] = [
    ['nickel-edta', 2.935, 3, 'Reference §4.2 from the Borgmann/Anoplex EDTA–murexide method (2 mL, 0.1 M)'],
    ['nickel-chloride-silver-nitrate', 5.942, 3, 'Reference §4.2 from JM Science/Hiranuma E4 (2 mL, 0.1 M AgNO3)'],
    ['chloride-silver-nitrate', 1.7725, 4, 'Reference §4.2 from JM Science/Hiranuma E4'],
    ['boric-acid-mannitol', 1.24, 2, 'Products Finishing "Boric Acid and Mannitol": g/L = mL × 1.24 (5 mL, 0.1 M NaOH)'],
    ['copper-edta', 3.177, 3, 'Reference §4.2, copper by EDTA (2 mL, 0.1 M)'],
    ['copper-iodometric', 3.177, 3, 'Reference §4.2, iodometric copper (2 mL, 0.1 M thiosulfate)'],
    ['sulfuric-acid-naoh', 9.81, 2, 'Reference §4.2, H2SO4 by NaOH (5 mL, 1.0 M)'],
    ['zinc-edta', 3.269, 3, 'Reference §4.2, zinc by EDTA (2 mL, 0.1 M)'],
    ['sodium-hydroxide-acid', 8.0, 2, 'Reference §4.2, NaOH by acid (5 mL, 1.0 N)'],
    ['free-sodium-cyanide-silver-nitrate', 1.96, 3, '911 Metallurgist / reference §4.2: 5 mL, 0.1 M AgNO3, mL × 1.960'],
    ['chromic-acid-thiosulfate', 13.33, 2, 'finishing.com 442/93 via reference §4.2: 0.25 mL effective, 0.1 N, mL × 13.33'],
    ['tin-iodine', 1.187, 3, 'Reference §4.2, stannous tin by 0.1 N iodine, 5 mL'],
  ];
  it.each(cases)('%s: mL × %f', (id, factor, places) => {
    expect(factorPerMl(titration(id))).toBeCloseTo(factor, places);
  });

  it('boric acid: 1 mL of 0.1 M NaOH ≡ 6.183 mg H3BO3', () => {
    // Source: Metrohm Application Bulletin 195 (reference §4.2).
    expect(gramsPerTitrantUnit(titration('boric-acid-mannitol')) * 0.1).toBeCloseTo(6.183, 3);
  });

  it('free cyanide: 1 mL 0.1 M AgNO3 ≡ 9.80 mg NaCN, and 169.9 g AgNO3 ≡ 130.2 g KCN', () => {
    // Source: 911 Metallurgist free cyanide assay; "Cyanide Titration with Silver Nitrate" (reference §4.2).
    expect(gramsPerTitrantUnit(titration('free-sodium-cyanide-silver-nitrate')) * 0.1).toBeCloseTo(9.8, 2);
    const kcnPerAgno3 = gramsPerTitrantUnit(titration('free-potassium-cyanide-silver-nitrate')) / molarMass('AgNO3');
    expect(kcnPerAgno3).toBeCloseTo(130.2 / 169.9, 3);
  });

  it('chromic acid by FAS follows the published formula M × V × 0.0333 × 1000 / 0.25', () => {
    // Source: Lichang chromium-bath test method (reference §4.2).
    const r = computeAnalysis(titration('chromic-acid-ferrous'), { buretteMl: 18.6, titrantConcentration: 0.1 });
    if (!r.ok) throw new Error(r.message);
    expect(r.value).toBeCloseTo((0.1 * 18.6 * 0.0333 * 1000) / 0.25, 9);
    // The printed 0.0333 is CrO3/3 per mmol rounded: it agrees with the formula mass to 0.15 %.
    const exact = factorPerMl(titration('chromic-acid-thiosulfate'));
    expect(Math.abs(factorPerMl(titration('chromic-acid-ferrous')) / exact - 1)).toBeLessThan(0.0015);
  });

  it('a full worked nickel analysis: 23.4 mL → 68.7 g/L Ni', () => {
    // Source: reference §4.2 factor 2.935 × 23.4 mL = 68.68 g/L (worked by hand).
    const r = computeAnalysis(titration('nickel-edta'), { buretteMl: 23.4 });
    expect(r.ok && r.value).toBeCloseTo(68.68, 1);
  });
});

describe('derived values', () => {
  it('trivalent chromium = (total − hexavalent) × 52.00/99.99', () => {
    // Source: finishing.com 442/93 method; conversion factor as printed in reference §4.2.
    const r = computeAnalysis(getMethod('trivalent-chromium-by-difference')!, { values: { totalAsCrO3: 262, chromicAcid: 250 } });
    expect(r.ok && r.value).toBeCloseTo((12 * 52.0) / 99.99, 2);
  });

  it('nickel sulfate from total nickel and nickel chloride', () => {
    // Worked by hand with reference §5 molar masses: Ni 58.69, NiSO4·6H2O 262.84, NiCl2·6H2O 237.68.
    const r = computeAnalysis(getMethod('nickel-sulfate-by-difference')!, { values: { nickel: 76, nickelChloride: 105 } });
    const hand = (76 / 58.69 - 105 / 237.68) * 262.84;
    expect(r.ok && r.value).toBeCloseTo(hand, 0);
    expect(r.ok && Math.abs(r.value / hand - 1)).toBeLessThan(0.001);
  });

  it('potassium chloride from total chloride and zinc', () => {
    // Worked by hand: KCl 74.55, Cl 35.45, Zn 65.38 (IUPAC); 140 g/L Cl, 37.5 g/L Zn.
    const r = computeAnalysis(getMethod('potassium-chloride-by-difference')!, { values: { chloride: 140, zinc: 37.5 } });
    const hand = (140 / 35.45 - (2 * 37.5) / 65.38) * 74.55;
    expect(r.ok && Math.abs(r.value / hand - 1)).toBeLessThan(0.001);
  });

  it('a negative difference is an error, not a value', () => {
    const r = computeAnalysis(getMethod('trivalent-chromium-by-difference')!, { values: { totalAsCrO3: 240, chromicAcid: 250 } });
    expect(r).toMatchObject({ ok: false });
    expect(computeAnalysis(getMethod('trivalent-chromium-by-difference')!, { values: {} })).toMatchObject({ ok: false, field: 'totalAsCrO3' });
  });
});

describe('the seeded list', () => {
  it('has unique ids, valid data and a source on every method', () => {
    expect(new Set(SEEDED_METHODS.map((m) => m.id)).size).toBe(SEEDED_METHODS.length);
    for (const m of SEEDED_METHODS) {
      expect(validateMethod(m), m.id).toEqual([]);
      expect(m.source.length, m.id).toBeGreaterThan(5);
    }
  });

  it('is plain JSON', () => {
    expect(JSON.parse(JSON.stringify(SEEDED_METHODS))).toEqual(SEEDED_METHODS);
  });

  it('puts a cyanide caution on every method that handles a cyanide bath', () => {
    for (const m of TITRATION_METHODS.filter((x) => /cyanide|silver-thiocyanate|carbonate/.test(x.id))) {
      expect(m.caution, m.id).toMatch(/hydrogen cyanide/);
    }
  });
});
