import { describe, expect, it } from 'vitest';
import { BATH_TEMPLATES, getTemplate, TEMPLATE_NOTE, validateTemplate } from '@/lib/bath/templates';
import { cautionsFor } from '@/lib/bath/hazards';
import { metalFraction } from '@/lib/chemistry/formula';

const IDS = [
  'watts-nickel',
  'sulfamate-nickel',
  'acid-copper',
  'cyanide-copper-strike',
  'alkaline-zinc',
  'acid-chloride-zinc',
  'alkaline-zinc-nickel',
  'acid-tin',
  'cyanide-silver',
  'acid-gold',
  'hexavalent-chromium',
  'trivalent-chromium',
  'alkaline-electrocleaner',
  'hydrochloric-acid-dip',
  'trivalent-passivate',
  // the other process families' baths (lib/families)
  'electroless-nickel-mid-phos',
  'sulfuric-anodize',
  'hard-anodize',
  'hot-water-seal',
  'nickel-acetate-seal',
  'nitric-passivation',
  'citric-passivation',
];

describe('bath templates', () => {
  it("include every family's baths, each consistent and carrying the supplier note", () => {
    expect(BATH_TEMPLATES.map((t) => t.id).sort()).toEqual([...IDS].sort());
    for (const t of BATH_TEMPLATES) {
      expect(validateTemplate(t), t.id).toEqual([]);
      expect(t.note).toBe(TEMPLATE_NOTE);
      expect(t.analytes.length, t.id).toBeGreaterThan(0);
      for (const a of t.analytes) expect(a.basis.length, `${t.id}/${a.key}`).toBeGreaterThan(3);
    }
  });

  it('tag the hazards that need a caution', () => {
    for (const id of ['cyanide-copper-strike', 'cyanide-silver', 'acid-gold']) expect(getTemplate(id)?.hazards).toContain('cyanide');
    expect(getTemplate('hexavalent-chromium')?.hazards).toContain('hexavalent_chromium');
    expect(getTemplate('hydrochloric-acid-dip')?.hazards).toContain('strong_acid');
    expect(getTemplate('alkaline-electrocleaner')?.hazards).toEqual(expect.arrayContaining(['caustic', 'hydrogen', 'heat']));
    const cautions = cautionsFor(getTemplate('cyanide-silver')!.hazards);
    expect(cautions.at(-1)).toMatch(/safety data sheet/);
    expect(cautions.join(' ')).toMatch(/hydrogen cyanide/);
  });

  it('use the electrons per atom of reference §1.2', () => {
    // Source: reference §1.2 (n for each bath ion): Cu⁺ in cyanide copper, Cr(VI) n = 6, Au⁺ cyanide gold.
    expect(getTemplate('cyanide-copper-strike')?.deposit).toMatchObject({ element: 'Cu', charge: 1 });
    expect(getTemplate('acid-copper')?.deposit).toMatchObject({ element: 'Cu', charge: 2 });
    expect(getTemplate('hexavalent-chromium')?.deposit).toMatchObject({ element: 'Cr', charge: 6 });
    expect(getTemplate('trivalent-chromium')?.deposit).toMatchObject({ element: 'Cr', charge: 3 });
    expect(getTemplate('acid-gold')?.deposit).toMatchObject({ element: 'Au', charge: 1 });
    expect(getTemplate('alkaline-electrocleaner')?.deposit).toBeNull();
  });

  it('carry the published ranges of reference §2–3', () => {
    // Source: Wikipedia "Nickel electroplating" (Watts 150–300 / 60–150 / 37–52 g/L; 2–10 A/dm²).
    const watts = getTemplate('watts-nickel')!;
    const by = (k: string) => watts.analytes.find((a) => a.key === k)!;
    expect([by('nickelSulfate').lowerControl, by('nickelSulfate').upperControl]).toEqual([150, 300]);
    expect([by('boricAcid').lowerControl, by('boricAcid').upperControl]).toEqual([37, 52]);
    expect(watts.currentDensityAdm2).toEqual({ low: 2, high: 10 });
    // Nickel metal limits follow from the salt ranges: 150 × 22.33 % + 60 × 24.69 % = 48.3 g/L.
    expect(by('nickel').lowerControl).toBeCloseTo(150 * metalFraction('NiSO4·6H2O', 'Ni') + 60 * metalFraction('NiCl2·6H2O', 'Ni'), 1);
    // Source: J. Surface Finishing Soc. Japan 22(4) 181: K2CO3 ≥ 90 g/L narrows the CD range.
    expect(getTemplate('cyanide-silver')!.analytes.find((a) => a.key === 'carbonate')?.upperSpec).toBe(90);
    // Source: finishing.com 169/76: trivalent chromium 4 g/L maximum.
    expect(getTemplate('hexavalent-chromium')!.analytes.find((a) => a.key === 'trivalentChromium')?.upperSpec).toBe(4);
  });

  it('give additive rates only on additives', () => {
    for (const t of BATH_TEMPLATES) {
      for (const a of t.analytes) if (a.additiveRateMlPerKAh !== undefined) expect(a.unit).toBe('mL/L');
    }
  });

  it('validateTemplate catches a broken copy', () => {
    const watts = getTemplate('watts-nickel')!;
    const broken = {
      ...watts,
      analytes: [{ ...watts.analytes[0]!, methodId: 'nope', target: 500, upperSpec: 50 }, watts.analytes[0]!],
    };
    const problems = validateTemplate(broken);
    expect(problems.join('\n')).toMatch(/unknown method/);
    expect(problems.join('\n')).toMatch(/target above/);
    expect(problems.join('\n')).toMatch(/upper specification limit inside/);
    expect(problems.join('\n')).toMatch(/duplicate key/);
  });
});
