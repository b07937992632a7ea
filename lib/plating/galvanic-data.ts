// Reference data for galvanic checks.

// Anodic index, volts relative to gold, per the MIL-STD-889 / MIL-DTL-14072 table as reproduced in
// reference §9.1. The higher index is the more anodic member (it corrodes). Rows from 0.00 to
// 0.75 V were checked against the published table (S75); the rows from 0.85 V down are marked
// "from memory" in the reference and carry that note here.
const CHECKED = 'MIL-STD-889 anodic index (reference §9.1, checked against S75)';
const MEMORY = 'MIL-STD-889 anodic index (reference §9.1), from memory';

export const GALVANIC_MATERIALS = {
  gold: { name: 'Gold, solid or plated', anodicIndexV: 0.0, source: CHECKED, couple: 'Au+' },
  rhodium: { name: 'Rhodium plated (on silver-plated copper)', anodicIndexV: 0.05, source: CHECKED, couple: 'Rh3+' },
  silver: { name: 'Silver, solid or plated', anodicIndexV: 0.15, source: CHECKED, couple: 'Ag+' },
  monel: { name: 'Monel; high nickel–copper alloys', anodicIndexV: 0.15, source: CHECKED, couple: null },
  nickel: { name: 'Nickel, solid or plated', anodicIndexV: 0.3, source: CHECKED, couple: 'Ni2+' },
  titanium: { name: 'Titanium and its alloys', anodicIndexV: 0.3, source: CHECKED, couple: null },
  copper: { name: 'Copper, solid or plated; low brasses and bronzes', anodicIndexV: 0.35, source: CHECKED, couple: 'Cu2+' },
  brass: { name: 'Brasses and bronzes', anodicIndexV: 0.4, source: CHECKED, couple: null },
  'high-brass': { name: 'High brasses and bronzes', anodicIndexV: 0.45, source: CHECKED, couple: null },
  'stainless-steel': { name: 'Stainless steel, 18 % Cr (300 series)', anodicIndexV: 0.5, source: CHECKED, couple: null },
  chromium: { name: 'Chromium plated', anodicIndexV: 0.6, source: CHECKED, couple: 'Cr3+' },
  tin: { name: 'Tin plated', anodicIndexV: 0.6, source: CHECKED, couple: 'Sn2+' },
  'stainless-12cr': { name: 'Stainless steel, 12 % Cr (400 series)', anodicIndexV: 0.6, source: CHECKED, couple: null },
  'tin-lead': { name: 'Tin-plate; tin–lead solder', anodicIndexV: 0.65, source: CHECKED, couple: null },
  lead: { name: 'Lead, solid or plated', anodicIndexV: 0.7, source: CHECKED, couple: 'Pb2+' },
  'aluminium-2000': { name: 'Aluminium, 2000-series wrought', anodicIndexV: 0.75, source: CHECKED, couple: null },
  steel: { name: 'Iron and plain carbon or low-alloy steel', anodicIndexV: 0.85, source: MEMORY, couple: 'Fe2+' },
  aluminium: { name: 'Aluminium, wrought (not 2000 series) or cast Si-type', anodicIndexV: 0.9, source: MEMORY, couple: 'Al3+' },
  'aluminium-cast': { name: 'Aluminium, cast (not Si-type)', anodicIndexV: 0.95, source: MEMORY, couple: 'Al3+' },
  cadmium: { name: 'Cadmium plated (chromated)', anodicIndexV: 0.95, source: MEMORY, couple: 'Cd2+' },
  galvanised: { name: 'Hot-dip zinc; galvanised steel', anodicIndexV: 1.2, source: MEMORY, couple: 'Zn2+' },
  zinc: { name: 'Zinc, wrought, die-cast or plated', anodicIndexV: 1.25, source: MEMORY, couple: 'Zn2+' },
  magnesium: { name: 'Magnesium and its alloys', anodicIndexV: 1.75, source: MEMORY, couple: 'Mg2+' },
  beryllium: { name: 'Beryllium', anodicIndexV: 1.85, source: MEMORY, couple: null },
} as const;

export type GalvanicMaterial = keyof typeof GALVANIC_MATERIALS;

// Standard reduction potentials at 25 °C against the standard hydrogen electrode, volts.
// Source: CRC Handbook "Electrochemical Series", from memory (reference §9.2). For explanation
// only: passive films reorder real metals, so decisions use the anodic index above.
export const STANDARD_POTENTIALS = {
  'Au+': { couple: 'Au⁺ + e⁻ → Au', volts: 1.692 },
  'Au3+': { couple: 'Au³⁺ + 3e⁻ → Au', volts: 1.498 },
  'Pd2+': { couple: 'Pd²⁺ + 2e⁻ → Pd', volts: 0.951 },
  'Ag+': { couple: 'Ag⁺ + e⁻ → Ag', volts: 0.7996 },
  'Rh3+': { couple: 'Rh³⁺ + 3e⁻ → Rh', volts: 0.758 },
  'Cu+': { couple: 'Cu⁺ + e⁻ → Cu', volts: 0.521 },
  'Cu2+': { couple: 'Cu²⁺ + 2e⁻ → Cu', volts: 0.3419 },
  'H+': { couple: '2H⁺ + 2e⁻ → H₂', volts: 0 },
  'Pb2+': { couple: 'Pb²⁺ + 2e⁻ → Pb', volts: -0.1262 },
  'Sn2+': { couple: 'Sn²⁺ + 2e⁻ → Sn', volts: -0.1375 },
  'Ni2+': { couple: 'Ni²⁺ + 2e⁻ → Ni', volts: -0.257 },
  'Co2+': { couple: 'Co²⁺ + 2e⁻ → Co', volts: -0.28 },
  'In3+': { couple: 'In³⁺ + 3e⁻ → In', volts: -0.3382 },
  'Cd2+': { couple: 'Cd²⁺ + 2e⁻ → Cd', volts: -0.403 },
  'Fe2+': { couple: 'Fe²⁺ + 2e⁻ → Fe', volts: -0.447 },
  'Cr3+': { couple: 'Cr³⁺ + 3e⁻ → Cr', volts: -0.744 },
  'Zn2+': { couple: 'Zn²⁺ + 2e⁻ → Zn', volts: -0.7618 },
  'Al3+': { couple: 'Al³⁺ + 3e⁻ → Al', volts: -1.662 },
  'Mg2+': { couple: 'Mg²⁺ + 2e⁻ → Mg', volts: -2.372 },
} as const;

export const STANDARD_POTENTIAL_SOURCE = 'CRC Handbook Electrochemical Series, from memory (reference §9.2)';

// Allowed anodic-index difference by service environment (reference §9.1, checked against S74/S75).
export const CONTACT_LIMITS_V = { harsh: 0.15, normal: 0.25, controlled: 0.5 } as const;
export type ServiceEnvironment = keyof typeof CONTACT_LIMITS_V;
