import { ATOMIC_WEIGHTS } from '../chemistry/atomic-weights';
import { PlatingInputError } from './errors';

// Plating metals by the ion (or oxidation state) they are reduced from. The electrons per atom (n)
// follow from the reduction Mⁿ⁺ + n e⁻ → M; chromium from Cr(VI) needs six electrons per atom.

export type PlatingElement =
  | 'Ni' | 'Cu' | 'Zn' | 'Cr' | 'Sn' | 'Ag' | 'Au' | 'Cd' | 'Pb' | 'Co' | 'Fe' | 'Pd' | 'Rh' | 'In';

export type PlatingMetal = {
  readonly key: string; // 'Ni2+', 'Cr6+' …: unique per element and charge
  readonly element: PlatingElement;
  readonly charge: number;
  readonly electrons: number;
  readonly molarMassGPerMol: number;
  readonly densityGPerCm3: number;
  readonly name: string;
  readonly ion: string; // as printed: 'Ni²⁺', 'Cr(VI)'
  readonly sources: { readonly molarMass: string; readonly density: string };
  readonly caution: string | null; // shown wherever the metal is chosen
};

const MOLAR_MASS_SOURCE = 'IUPAC standard atomic weight (lib/chemistry/atomic-weights.ts)';
// Source: CRC Handbook "near room temperature" densities as compiled in S8/S9 (reference §1.2, [V]).
const CRC_CHECKED = 'CRC Handbook density, checked against S8/S9 (reference §1.2)';
// Source: CRC Handbook values recalled from memory; they agree within 0.5 % with S9/S10 (§1.2).
const CRC_MEMORY = 'CRC Handbook density, from memory; agrees within 0.5 % with S9/S10 (reference §1.2)';

const CYANIDE =
  'Usually plated from a cyanide bath: never let cyanide solutions or rinses meet acid, which ' +
  'releases hydrogen cyanide gas. Follow the safety data sheet and local codes.';
const NICKEL =
  'Nickel and cobalt salts are skin and respiratory sensitisers; some compounds are carcinogens. ' +
  'Follow the safety data sheet.';

type Row = [PlatingElement, number, string, string, number, string, string | null];

// [element, charge, ion, name, density g/cm³, density source, caution]
const ROWS: readonly Row[] = [
  ['Ni', 2, 'Ni²⁺', 'Nickel', 8.9, CRC_CHECKED, NICKEL],
  ['Cu', 2, 'Cu²⁺', 'Copper (acid, Cu²⁺)', 8.96, CRC_CHECKED, null],
  ['Cu', 1, 'Cu⁺', 'Copper (cyanide, Cu⁺)', 8.96, CRC_CHECKED, CYANIDE],
  ['Zn', 2, 'Zn²⁺', 'Zinc', 7.134, CRC_CHECKED, null],
  [
    'Cr', 6, 'Cr(VI)', 'Chromium from hexavalent baths', 7.15, CRC_CHECKED,
    'Hexavalent chromium is a carcinogen (OSHA PEL 5 µg/m³, 29 CFR 1910.1026): mist control, ' +
      'exposure monitoring and medical surveillance apply. Follow the safety data sheet and local codes.',
  ],
  ['Cr', 3, 'Cr(III)', 'Chromium from trivalent baths', 7.15, CRC_CHECKED, null],
  ['Sn', 2, 'Sn²⁺', 'Tin (acid, Sn²⁺)', 7.287, CRC_CHECKED, null],
  ['Sn', 4, 'Sn(IV)', 'Tin (alkaline stannate, Sn(IV))', 7.287, CRC_CHECKED, null],
  ['Ag', 1, 'Ag⁺', 'Silver', 10.5, CRC_MEMORY, CYANIDE],
  ['Au', 1, 'Au⁺', 'Gold (cyanide, Au⁺)', 19.3, CRC_MEMORY, CYANIDE],
  ['Au', 3, 'Au³⁺', 'Gold (Au³⁺)', 19.3, CRC_MEMORY, null],
  [
    'Cd', 2, 'Cd²⁺', 'Cadmium', 8.69, CRC_CHECKED,
    'Cadmium is toxic and a carcinogen (OSHA 29 CFR 1910.1027); baths are often cyanide-based. ' +
      'Follow the safety data sheet and local codes.',
  ],
  ['Pb', 2, 'Pb²⁺', 'Lead', 11.3, CRC_MEMORY, 'Lead is toxic. Follow the safety data sheet.'],
  ['Co', 2, 'Co²⁺', 'Cobalt', 8.86, CRC_CHECKED, NICKEL],
  ['Fe', 2, 'Fe²⁺', 'Iron', 7.874, CRC_CHECKED, null],
  ['Pd', 2, 'Pd²⁺', 'Palladium', 12.0, CRC_MEMORY, null],
  ['Rh', 3, 'Rh³⁺', 'Rhodium', 12.4, CRC_MEMORY, null],
  ['In', 3, 'In³⁺', 'Indium', 7.31, CRC_CHECKED, null],
];

export const PLATING_METALS: readonly PlatingMetal[] = Object.freeze(
  ROWS.map(([element, charge, ion, name, density, densitySource, caution]) =>
    Object.freeze({
      key: `${element}${charge}+`,
      element,
      charge,
      electrons: charge,
      molarMassGPerMol: ATOMIC_WEIGHTS[element],
      densityGPerCm3: density,
      name,
      ion,
      sources: Object.freeze({ molarMass: MOLAR_MASS_SOURCE, density: densitySource }),
      caution,
    }),
  ),
);

const BY_KEY = new Map(PLATING_METALS.map((m) => [m.key, m]));

export function listKnownMetals(): string {
  return PLATING_METALS.map((m) => m.ion).join(', ');
}

export function findMetal(element: string, charge: number): PlatingMetal | null {
  return BY_KEY.get(`${element}${charge}+`) ?? null;
}

export function getMetal(element: string, charge: number): PlatingMetal {
  const metal = findMetal(element, charge);
  if (metal) return metal;
  const known = PLATING_METALS.some((m) => m.element === element);
  throw new PlatingInputError(
    known ? 'charge' : 'element',
    `No plating data for element "${String(element)}" with charge ${String(charge)}. ` +
      `Known metals and ions: ${listKnownMetals()}.`,
  );
}
