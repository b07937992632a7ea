// Plating salts and liquid concentrates that additions are made from. Pure data plus look-ups.
// Molar masses and metal fractions are computed from the formula (./formula), never typed in.
import type { ElementSymbol } from './atomic-weights';
import { metalFraction, molarMass } from './formula';
import { AppError } from '../errors';

export const SUPPLIER_GOVERNS = 'Supplier data sheet governs.';

export type SolidSalt = {
  kind: 'solid';
  id: string;
  name: string;
  formula: string;
  /** The plating metal it supplies; null for acids, buffers and conducting salts. */
  metal: ElementSymbol | null;
  note?: string;
};

export type LiquidConcentrate = {
  kind: 'liquid';
  id: string;
  name: string;
  /** Formula of the active species the content figure refers to. */
  formula: string;
  metal: ElementSymbol | null;
  /** What `contentGramsPerLitre` counts: the metal, or the whole compound. */
  contentBasis: 'metal' | 'compound';
  contentGramsPerLitre: number;
  densityKgPerL: number;
  source: string;
};

export type Salt = SolidSalt | LiquidConcentrate;

const solid = (
  id: string,
  name: string,
  formula: string,
  metal: ElementSymbol | null,
  note?: string,
): SolidSalt => ({ kind: 'solid', id, name, formula, metal, ...(note ? { note } : {}) });

// Formulas as printed in reference §5 (metal-content table) and §3 (bath make-ups).
export const SALTS: readonly Salt[] = [
  solid('nickel-sulfate-hexahydrate', 'Nickel sulfate hexahydrate', 'NiSO4·6H2O', 'Ni'),
  solid('nickel-sulfate-heptahydrate', 'Nickel sulfate heptahydrate', 'NiSO4·7H2O', 'Ni'),
  solid('nickel-chloride-hexahydrate', 'Nickel chloride hexahydrate', 'NiCl2·6H2O', 'Ni'),
  solid('nickel-sulfamate-tetrahydrate', 'Nickel sulfamate tetrahydrate', 'Ni(SO3NH2)2·4H2O', 'Ni'),
  solid('copper-sulfate-pentahydrate', 'Copper sulfate pentahydrate', 'CuSO4·5H2O', 'Cu'),
  solid('copper-cyanide', 'Copper(I) cyanide', 'CuCN', 'Cu', 'Cyanide: see the safety data sheet.'),
  solid('zinc-oxide', 'Zinc oxide', 'ZnO', 'Zn'),
  solid('zinc-chloride', 'Zinc chloride', 'ZnCl2', 'Zn'),
  solid('zinc-sulfate-heptahydrate', 'Zinc sulfate heptahydrate', 'ZnSO4·7H2O', 'Zn'),
  solid('stannous-sulfate', 'Tin(II) sulfate', 'SnSO4', 'Sn'),
  solid('potassium-stannate', 'Potassium stannate trihydrate', 'K2SnO3·3H2O', 'Sn'),
  solid('sodium-stannate', 'Sodium stannate trihydrate', 'Na2SnO3·3H2O', 'Sn'),
  solid('silver-cyanide', 'Silver cyanide', 'AgCN', 'Ag', 'Cyanide: see the safety data sheet.'),
  solid('potassium-silver-cyanide', 'Potassium silver cyanide', 'KAg(CN)2', 'Ag', 'Cyanide: see the safety data sheet.'),
  solid('potassium-gold-cyanide', 'Potassium gold(I) cyanide', 'KAu(CN)2', 'Au', 'Cyanide: see the safety data sheet.'),
  solid('chromic-acid', 'Chromium trioxide (chromic acid)', 'CrO3', 'Cr', 'Hexavalent chromium: carcinogen; see the safety data sheet.'),
  solid('boric-acid', 'Boric acid', 'H3BO3', null),
  solid('sodium-cyanide', 'Sodium cyanide', 'NaCN', null, 'Cyanide: see the safety data sheet.'),
  solid('potassium-cyanide', 'Potassium cyanide', 'KCN', null, 'Cyanide: see the safety data sheet.'),
  solid('sodium-hydroxide', 'Sodium hydroxide', 'NaOH', null, 'Caustic: see the safety data sheet.'),
  solid('potassium-chloride', 'Potassium chloride', 'KCl', null),
  solid('ammonium-chloride', 'Ammonium chloride', 'NH4Cl', null),
  solid('sodium-carbonate', 'Sodium carbonate', 'Na2CO3', null),
  solid('potassium-carbonate', 'Potassium carbonate', 'K2CO3', null),
  {
    // Reference §5 works its concentrate example at 100 g/L Ni (S20, Growel sulfamate data sheet);
    // the density is from memory. The supplier data sheet governs both.
    kind: 'liquid',
    id: 'nickel-sulfamate-concentrate',
    name: 'Nickel sulfamate concentrate',
    formula: 'Ni(SO3NH2)2',
    metal: 'Ni',
    contentBasis: 'metal',
    contentGramsPerLitre: 100,
    densityKgPerL: 1.25,
    source: `Reference §5 worked example (100 g/L Ni); density from memory. ${SUPPLIER_GOVERNS}`,
  },
  {
    // 66 °Bé sulfuric acid: SG = 145/(145 − 66) = 1.8354 (Marks' Handbook via Engineers Edge, ref §4.3).
    // The 96 % strength is from memory.
    kind: 'liquid',
    id: 'sulfuric-acid-66-baume',
    name: 'Sulfuric acid, 66 °Bé (about 96 %)',
    formula: 'H2SO4',
    metal: null,
    contentBasis: 'compound',
    contentGramsPerLitre: 1762,
    densityKgPerL: 1.835,
    source: `SG from the Baumé relation (Marks' Handbook); strength from memory. ${SUPPLIER_GOVERNS}`,
  },
  {
    // 20 °Bé hydrochloric acid: SG = 145/(145 − 20) = 1.160; about 31.5 % HCl (from memory).
    kind: 'liquid',
    id: 'hydrochloric-acid-20-baume',
    name: 'Hydrochloric acid, 20 °Bé (about 31.5 %)',
    formula: 'HCl',
    metal: null,
    contentBasis: 'compound',
    contentGramsPerLitre: 365,
    densityKgPerL: 1.16,
    source: `SG from the Baumé relation (Marks' Handbook); strength from memory. ${SUPPLIER_GOVERNS}`,
  },
];

export function getSalt(id: string): Salt | null {
  return SALTS.find((s) => s.id === id) ?? null;
}

export function requireSalt(id: string): Salt {
  const salt = getSalt(id);
  if (!salt) throw new AppError('BAD_INPUT', `Unknown salt or concentrate "${id}"`, { saltId: [`Unknown "${id}"`] });
  return salt;
}

/** Molar mass (g/mol) of a salt's formula. */
export function saltMolarMass(salt: Salt): number {
  return molarMass(salt.formula);
}

/** Mass fraction of the supplied metal in a solid salt (0–1). */
export function saltMetalFraction(salt: SolidSalt): number {
  if (!salt.metal) {
    throw new AppError('BAD_INPUT', `${salt.name} supplies no plating metal`, { saltId: [`${salt.name} supplies no metal`] });
  }
  return metalFraction(salt.formula, salt.metal);
}
