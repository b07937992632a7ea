// Sulfuric (Type II) and hard (Type III) anodizing baths and the seal tanks after them. Values are
// typical, from memory unless a source is named (reference sheet: process-families §1); the
// supplier's data sheet and the customer's specification govern.
import { DAILY_H, EVERY_SHIFT_H, TEMPLATE_NOTE, WEEKLY_H, temperature, type BathTemplate } from '@/lib/bath/templates/types';
import type { TitrationMethod } from '@/lib/bath/methods/titration';
import { PlatingInputError } from '@/lib/plating/errors';

export const ANODIZE_METHODS: readonly TitrationMethod[] = [
  {
    // H2SO4 + 2 NaOH. 5 mL sample, 1.0 M NaOH: g/L = mL × 9.808 (factor computed from IUPAC weights).
    kind: 'titration',
    id: 'anodize-free-sulfuric-naoh',
    name: 'Free sulfuric acid by sodium hydroxide (aluminium complexed)',
    reportedAs: 'H2SO4',
    unit: 'g/L',
    sample: { volumeMl: 5 },
    titrant: { name: 'Sodium hydroxide', concentration: 1.0, concentrationUnit: 'mol/L' },
    blankMl: 0,
    stoichiometry: { reported: 1, titrant: 2 },
    indicator: 'Phenolphthalein, colourless to pink',
    procedure: 'Add potassium fluoride solution first so the dissolved aluminium does not take up titrant.',
    caution: 'Sulfuric acid: eye protection and gloves; add acid to water, never water to acid.',
    source: 'Acid–base stoichiometry (factor computed); aluminium complexing step from memory',
    status: 'from memory',
  },
];

const ACID = 'Reference sheet process-families §1 (from memory: about 15–20 wt % sulfuric acid)';

export const ANODIZE_TEMPLATES: readonly BathTemplate[] = [
  {
    id: 'sulfuric-anodize',
    name: 'Sulfuric acid anodize (Type II)',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: { low: 1, high: 2 }, // from memory (about 10–20 A/ft²)
    analytes: [
      { key: 'sulfuricAcid', name: 'Free sulfuric acid', unit: 'g/L', methodId: 'anodize-free-sulfuric-naoh', target: 180, lowerControl: 165, upperControl: 200, lowerSpec: 150, upperSpec: 220, frequencyHours: DAILY_H, basis: ACID },
      { key: 'aluminium', name: 'Dissolved aluminium', unit: 'g/L', methodId: 'instrumental-metal', target: 8, upperControl: 15, upperSpec: 20, frequencyHours: WEEKLY_H, basis: 'From memory: keep below about 15–20 g/L by decanting' },
      temperature(20, 18, 22, 'From memory (about 18–22 °C for Type II)'),
    ],
    hazards: ['strong_acid', 'hydrogen', 'electrical'],
    note: TEMPLATE_NOTE,
    basis: ACID,
  },
  {
    id: 'hard-anodize',
    name: 'Hard anodize (Type III)',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: { low: 2, high: 4 }, // from memory (about 24–36 A/ft²)
    analytes: [
      { key: 'sulfuricAcid', name: 'Free sulfuric acid', unit: 'g/L', methodId: 'anodize-free-sulfuric-naoh', target: 200, lowerControl: 180, upperControl: 220, lowerSpec: 160, upperSpec: 240, frequencyHours: DAILY_H, basis: ACID },
      { key: 'aluminium', name: 'Dissolved aluminium', unit: 'g/L', methodId: 'instrumental-metal', target: 6, upperControl: 12, upperSpec: 15, frequencyHours: WEEKLY_H, basis: 'From memory' },
      temperature(2, 0, 5, 'Reference sheet process-families §1 (hard at about 0–5 °C, from memory)'),
    ],
    hazards: ['strong_acid', 'hydrogen', 'electrical'],
    note: TEMPLATE_NOTE,
    basis: ACID,
  },
  {
    id: 'hot-water-seal',
    name: 'Hot deionised-water seal',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: null,
    analytes: [
      { key: 'ph', name: 'pH', unit: 'pH', methodId: 'ph-meter', target: 6, lowerControl: 5.5, upperControl: 6.5, frequencyHours: EVERY_SHIFT_H, basis: 'From memory' },
      { key: 'conductivity', name: 'Conductivity', unit: 'µS/cm', methodId: 'conductivity-meter', target: 20, upperControl: 50, upperSpec: 100, frequencyHours: DAILY_H, basis: 'From memory' },
      temperature(98, 96, 100, 'From memory (near boiling)'),
    ],
    hazards: ['heat'],
    note: TEMPLATE_NOTE,
    basis: 'From memory',
  },
  {
    id: 'nickel-acetate-seal',
    name: 'Nickel acetate seal',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: null,
    analytes: [
      { key: 'nickel', name: 'Nickel', unit: 'g/L', methodId: 'instrumental-metal', target: 1.5, lowerControl: 1, upperControl: 2, frequencyHours: DAILY_H, basis: 'From memory' },
      { key: 'ph', name: 'pH', unit: 'pH', methodId: 'ph-meter', target: 5.5, lowerControl: 5.2, upperControl: 5.8, frequencyHours: EVERY_SHIFT_H, basis: 'From memory' },
      temperature(96, 92, 99, 'From memory'),
    ],
    hazards: ['nickel', 'heat'],
    note: TEMPLATE_NOTE,
    basis: 'From memory',
  },
];

/**
 * Decant and refill to bring dissolved aluminium down: take out part of the bath and refill with
 * fresh acid at the bath's target. Fresh acid holds no aluminium, so what stays is diluted in
 * proportion: decant = V × (c − target) ÷ c (a mass balance, computed).
 */
export function aluminiumDecant(input: { volumeL: number; aluminiumGPerL: number; targetAluminiumGPerL: number; acidTargetGPerL: number }) {
  const { volumeL, aluminiumGPerL: c, targetAluminiumGPerL: t, acidTargetGPerL } = input;
  const bad = (field: string, message: string) => new PlatingInputError(field, message);
  if (!(volumeL > 0) || !Number.isFinite(volumeL)) throw bad('volumeL', 'The tank volume must be above 0 L.');
  if (!(c > 0) || !Number.isFinite(c)) throw bad('aluminiumGPerL', 'Enter the dissolved aluminium measured, above 0 g/L.');
  if (!(t >= 0) || !Number.isFinite(t)) throw bad('targetAluminiumGPerL', 'Enter the aluminium wanted after the refill, 0 g/L or more.');
  if (!(acidTargetGPerL > 0) || !Number.isFinite(acidTargetGPerL)) throw bad('acidTargetGPerL', 'The acid target must be above 0 g/L.');
  if (t >= c) return { decantL: 0, refillL: 0, sulfuricAcidKg: 0, note: 'The aluminium is already at or below the target: nothing to decant.' };
  const decantL = (volumeL * (c - t)) / c;
  return { decantL, refillL: decantL, sulfuricAcidKg: (decantL * acidTargetGPerL) / 1000, note: null };
}
