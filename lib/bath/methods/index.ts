// Seeded wet-chemistry methods. Each names its published source (reference sheet §4); the
// per-mL factors printed in comments are what ./titration.ts derives from the formula and
// IUPAC atomic weights, and tests/unit/bath/methods.test.ts checks them against the sources.
import type { DerivedMethod, DirectMethod, TitrationMethod } from './titration';
import { FAMILIES } from '@/lib/families';
import { INSTRUMENT_METHODS } from './instrumental';

type TitrationSeed = Omit<TitrationMethod, 'kind' | 'blankMl' | 'unit'> & { blankMl?: number; unit?: TitrationMethod['unit'] };
const titration = (m: TitrationSeed): TitrationMethod => ({ kind: 'titration', blankMl: 0, unit: 'g/L', ...m });

const EDTA_01 = { name: 'EDTA (disodium salt)', concentration: 0.1, concentrationUnit: 'mol/L' } as const;
const AGNO3_01 = { name: 'Silver nitrate', concentration: 0.1, concentrationUnit: 'mol/L' } as const;
const NAOH_01 = { name: 'Sodium hydroxide', concentration: 0.1, concentrationUnit: 'mol/L' } as const;
const NAOH_1 = { name: 'Sodium hydroxide', concentration: 1.0, concentrationUnit: 'mol/L' } as const;
const CYANIDE_CAUTION =
  'Cyanide solution: never let it meet acid (hydrogen cyanide gas). Follow the safety data sheet and local codes.';
const CHROMIUM_CAUTION =
  'Hexavalent chromium is a carcinogen: gloves, eye protection, no mist. Follow the safety data sheet.';

export const TITRATION_METHODS: readonly TitrationMethod[] = [
  titration({
    // 2 mL, 0.1 M EDTA: Ni g/L = mL × 2.935.
    id: 'nickel-edta',
    name: 'Nickel metal by EDTA (murexide)',
    reportedAs: 'Ni',
    sample: { volumeMl: 2 },
    titrant: EDTA_01,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Murexide in ammonia buffer, pH about 9–10; yellow to violet',
    source: 'Complexometric nickel by EDTA/murexide (Anoplex complexometric notes; Borgmann nickel method)',
    status: 'published',
  }),
  titration({
    // 2 mL, 0.1 M AgNO3: NiCl2·6H2O g/L = mL × 5.942 (two chlorides per nickel).
    id: 'nickel-chloride-silver-nitrate',
    name: 'Nickel chloride by silver nitrate',
    reportedAs: 'NiCl2·6H2O',
    sample: { volumeMl: 2 },
    titrant: AGNO3_01,
    stoichiometry: { reported: 1, titrant: 2 },
    indicator: 'Silver electrode (potentiometric) or potassium chromate',
    source: 'JM Science/Hiranuma application E4, nickel chloride in nickel plating solution',
    status: 'published',
  }),
  titration({
    // 2 mL, 0.1 M AgNO3: Cl⁻ g/L = mL × 1.7725.
    id: 'chloride-silver-nitrate',
    name: 'Total chloride by silver nitrate',
    reportedAs: 'Cl',
    sample: { volumeMl: 2 },
    titrant: AGNO3_01,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Silver electrode (potentiometric) or potassium chromate',
    source: 'JM Science/Hiranuma application E4 (silver nitrate chloride titration)',
    status: 'published',
  }),
  titration({
    // Low chloride in acid copper: 50 mL, 0.01 M AgNO3, mg/L = mL × 7.09. Sizes from memory.
    id: 'chloride-silver-nitrate-low',
    name: 'Chloride (mg/L) by dilute silver nitrate',
    reportedAs: 'Cl',
    unit: 'mg/L',
    sample: { volumeMl: 50 },
    titrant: { name: 'Silver nitrate', concentration: 0.01, concentrationUnit: 'mol/L' },
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Silver electrode (potentiometric)',
    source: 'Silver nitrate chloride chemistry per JM Science/Hiranuma E4; sample and titrant sizes from memory',
    status: 'from memory',
  }),
  titration({
    // 5 mL, 0.1 M NaOH: g/L = mL × 1.2366 (Products Finishing prints mL × 1.24).
    id: 'boric-acid-mannitol',
    name: 'Boric acid by sodium hydroxide with mannitol',
    reportedAs: 'H3BO3',
    sample: { volumeMl: 5 },
    titrant: NAOH_01,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Bromocresol purple or phenolphthalein after adding mannitol, or potentiometric',
    source:
      'Metrohm Application Bulletin 195; Products Finishing "Boric Acid and Mannitol"; JM Science/Hiranuma J8 (K = 61.83)',
    status: 'published',
  }),
  titration({
    // 2 mL, 0.1 M EDTA: Cu g/L = mL × 3.177.
    id: 'copper-edta',
    name: 'Copper metal by EDTA',
    reportedAs: 'Cu',
    sample: { volumeMl: 2 },
    titrant: EDTA_01,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'PAN or murexide',
    source: 'Standard complexometric copper titration (chemistry from memory; factor computed)',
    status: 'from memory',
  }),
  titration({
    // 2 mL, 0.1 M EDTA reported as the pentahydrate: g/L = mL × 12.48.
    id: 'copper-sulfate-edta',
    name: 'Copper sulfate pentahydrate by EDTA',
    reportedAs: 'CuSO4·5H2O',
    sample: { volumeMl: 2 },
    titrant: EDTA_01,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'PAN or murexide',
    source: 'Standard complexometric copper titration (chemistry from memory; factor computed)',
    status: 'from memory',
  }),
  titration({
    // 2Cu²⁺ + 4I⁻ → 2CuI + I₂; I₂ + 2S₂O₃²⁻: one thiosulfate per copper. 2 mL, 0.1 M: mL × 3.177.
    id: 'copper-iodometric',
    name: 'Copper metal, iodometric (thiosulfate)',
    reportedAs: 'Cu',
    sample: { volumeMl: 2 },
    titrant: { name: 'Sodium thiosulfate', concentration: 0.1, concentrationUnit: 'mol/L' },
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Starch; add thiocyanate near the end point',
    procedure: 'Cyanide baths: destroy the cyanide under a fume hood before acidifying.',
    caution: CYANIDE_CAUTION,
    source: 'Standard iodometric copper method (from memory; factor computed)',
    status: 'from memory',
  }),
  titration({
    // H2SO4 + 2NaOH. 5 mL, 1.0 M NaOH: g/L = mL × 9.81.
    id: 'sulfuric-acid-naoh',
    name: 'Sulfuric acid by sodium hydroxide',
    reportedAs: 'H2SO4',
    sample: { volumeMl: 5 },
    titrant: NAOH_1,
    stoichiometry: { reported: 1, titrant: 2 },
    indicator: 'Methyl orange, or potentiometric (copper baths: to about pH 4)',
    source: 'Acid–base stoichiometry (computed)',
    status: 'computed',
  }),
  titration({
    // 2 mL, 0.1 M EDTA: Zn g/L = mL × 3.269.
    id: 'zinc-edta',
    name: 'Zinc metal by EDTA',
    reportedAs: 'Zn',
    sample: { volumeMl: 2 },
    titrant: EDTA_01,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Eriochrome Black T, pH 10 buffer',
    procedure: 'Cyanide baths: demask with formaldehyde (from memory).',
    source: 'Standard complexometric zinc titration (from memory; factor computed)',
    status: 'from memory',
  }),
  titration({
    // 5 mL, 1.0 N acid: NaOH g/L = mL × 8.00.
    id: 'sodium-hydroxide-acid',
    name: 'Sodium hydroxide (caustic) by acid',
    reportedAs: 'NaOH',
    sample: { volumeMl: 5 },
    titrant: { name: 'Hydrochloric acid', concentration: 1.0, concentrationUnit: 'eq/L' },
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Phenolphthalein',
    procedure: 'Cyanide baths: precipitate carbonate with barium chloride first.',
    source: 'Acid–base stoichiometry (computed)',
    status: 'computed',
  }),
  titration({
    // Ag⁺ + 2CN⁻ → Ag(CN)₂⁻. 5 mL, 0.1 M AgNO3: NaCN g/L = mL × 1.960.
    id: 'free-sodium-cyanide-silver-nitrate',
    name: 'Free sodium cyanide by silver nitrate',
    reportedAs: 'NaCN',
    sample: { volumeMl: 5 },
    titrant: AGNO3_01,
    stoichiometry: { reported: 2, titrant: 1 },
    indicator: 'Potassium iodide; first permanent turbidity',
    caution: CYANIDE_CAUTION,
    source: '911 Metallurgist free cyanide assay (Liebig/Denigès); "Cyanide Titration with Silver Nitrate" (Ag : 2CN)',
    status: 'published',
  }),
  titration({
    // Same stoichiometry reported as KCN: 5 mL, 0.1 M: mL × 2.605.
    id: 'free-potassium-cyanide-silver-nitrate',
    name: 'Free potassium cyanide by silver nitrate',
    reportedAs: 'KCN',
    sample: { volumeMl: 5 },
    titrant: AGNO3_01,
    stoichiometry: { reported: 2, titrant: 1 },
    indicator: 'Potassium iodide; first permanent turbidity',
    caution: CYANIDE_CAUTION,
    source: '911 Metallurgist free cyanide assay; "Cyanide Titration with Silver Nitrate" (169.9 g AgNO3 ≡ 130.2 g KCN)',
    status: 'published',
  }),
  titration({
    // 1 CrO3 ≡ 3 e⁻. 5 mL made to 100 mL, 5 mL aliquot (0.25 mL), 0.1 N: mL × 13.33.
    id: 'chromic-acid-thiosulfate',
    name: 'Chromic acid, iodometric (thiosulfate)',
    reportedAs: 'CrO3',
    sample: { volumeMl: 5, dilutedToMl: 100, aliquotMl: 5 },
    titrant: { name: 'Sodium thiosulfate', concentration: 0.1, concentrationUnit: 'eq/L' },
    stoichiometry: { reported: 1, titrant: 3 },
    indicator: 'Starch after acid and potassium iodide',
    caution: CHROMIUM_CAUTION,
    source: 'finishing.com thread 442/93, iodometric hexavalent chromium',
    status: 'published',
  }),
  titration({
    // Published: CrO3 g/L = M × V × 0.0333 × 1000 / 0.25 (Lichang test method); 33.3 g per mol Fe²⁺.
    id: 'chromic-acid-ferrous',
    name: 'Chromic acid by ferrous ammonium sulfate',
    reportedAs: 'CrO3',
    sample: { volumeMl: 5, dilutedToMl: 100, aliquotMl: 5 },
    titrant: { name: 'Ferrous ammonium sulfate', concentration: 0.1, concentrationUnit: 'mol/L' },
    stoichiometry: { reported: 1, titrant: 3 },
    gramsPerTitrantUnit: 33.3,
    indicator: 'Phenylanthranilic acid or diphenylamine sulfonate',
    caution: CHROMIUM_CAUTION,
    source: 'Lichang chromium-bath test method (ferrous ammonium sulfate, factor 0.0333)',
    status: 'published',
  }),
  titration({
    // Same titration after alkaline peroxide oxidation: total chromium expressed as CrO3.
    id: 'total-chromium-thiosulfate',
    name: 'Total chromium as chromic acid (after oxidation), iodometric',
    reportedAs: 'CrO3',
    sample: { volumeMl: 5, dilutedToMl: 100, aliquotMl: 5 },
    titrant: { name: 'Sodium thiosulfate', concentration: 0.1, concentrationUnit: 'eq/L' },
    stoichiometry: { reported: 1, titrant: 3 },
    indicator: 'Starch after acid and potassium iodide',
    procedure: 'Oxidise with alkaline peroxide, boil off the excess peroxide, then titrate.',
    caution: CHROMIUM_CAUTION,
    source: 'finishing.com thread 442/93 (trivalent chromium by oxidation and re-titration)',
    status: 'published',
  }),
  titration({
    // Sn²⁺ + I₂ → Sn⁴⁺ + 2I⁻: one Sn per two equivalents. 5 mL, 0.1 N I2: mL × 1.187.
    id: 'tin-iodine',
    name: 'Stannous tin by iodine',
    reportedAs: 'Sn',
    sample: { volumeMl: 5 },
    titrant: { name: 'Iodine', concentration: 0.1, concentrationUnit: 'eq/L' },
    stoichiometry: { reported: 1, titrant: 2 },
    indicator: 'Starch, under a CO2 or N2 blanket or with HCl',
    source: 'Standard iodimetric stannous tin method (from memory; factor computed)',
    status: 'from memory',
  }),
  titration({
    // HCl + NaOH. 5 mL, 1.0 M NaOH: mL × 7.29.
    id: 'hydrochloric-acid-naoh',
    name: 'Hydrochloric acid by sodium hydroxide',
    reportedAs: 'HCl',
    sample: { volumeMl: 5 },
    titrant: NAOH_1,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Methyl orange or phenolphthalein',
    source: 'Acid–base stoichiometry (computed)',
    status: 'computed',
  }),
  titration({
    // BaCO3 precipitate titrated with 1 N acid: Na2CO3 per 2 eq. 10 mL: mL × 5.30. From memory.
    id: 'sodium-carbonate-barium',
    name: 'Sodium carbonate by barium precipitation and acid',
    reportedAs: 'Na2CO3',
    sample: { volumeMl: 10 },
    titrant: { name: 'Hydrochloric acid', concentration: 1.0, concentrationUnit: 'eq/L' },
    stoichiometry: { reported: 1, titrant: 2 },
    indicator: 'Methyl orange',
    procedure: 'Wash the precipitate free of cyanide before it meets any acid.',
    caution: CYANIDE_CAUTION,
    source: 'Barium carbonate precipitation method (from memory; factor computed)',
    status: 'from memory',
  }),
  titration({
    // Same method reported as K2CO3: 10 mL, 1 N: mL × 6.91. From memory.
    id: 'potassium-carbonate-barium',
    name: 'Potassium carbonate by barium precipitation and acid',
    reportedAs: 'K2CO3',
    sample: { volumeMl: 10 },
    titrant: { name: 'Hydrochloric acid', concentration: 1.0, concentrationUnit: 'eq/L' },
    stoichiometry: { reported: 1, titrant: 2 },
    indicator: 'Methyl orange',
    procedure: 'Wash the precipitate free of cyanide before it meets any acid.',
    caution: CYANIDE_CAUTION,
    source: 'Barium carbonate precipitation method (from memory; factor computed)',
    status: 'from memory',
  }),
  titration({
    // Volhard after digestion: Ag⁺ + SCN⁻, 1:1. 5 mL, 0.1 M: mL × 2.157. From memory.
    id: 'silver-thiocyanate',
    name: 'Silver metal by thiocyanate (after digestion)',
    reportedAs: 'Ag',
    sample: { volumeMl: 5 },
    titrant: { name: 'Potassium thiocyanate', concentration: 0.1, concentrationUnit: 'mol/L' },
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Ferric alum',
    procedure: 'Digest with sulfuric and nitric acid under a fume hood first: this releases hydrogen cyanide.',
    caution: CYANIDE_CAUTION,
    source: 'Volhard silver titration (from memory; factor computed)',
    status: 'from memory',
  }),
];

export const SEEDED_METHODS: readonly (TitrationMethod | DirectMethod | DerivedMethod)[] = [
  ...TITRATION_METHODS,
  ...INSTRUMENT_METHODS,
  ...FAMILIES.flatMap((f) => f.methods),
];

export function getMethod(id: string): TitrationMethod | DirectMethod | DerivedMethod | null {
  return SEEDED_METHODS.find((m) => m.id === id) ?? null;
}
