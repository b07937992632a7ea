// Passivation tanks for stainless steel: nitric or citric acid. Values are typical, from memory,
// except the A967 Nitric 2 concentration (ASTM A967, checked); the supplier's data sheet governs.
import { DAILY_H, EVERY_SHIFT_H, TEMPLATE_NOTE, temperature, type BathTemplate } from '@/lib/bath/templates/types';
import type { TitrationMethod } from '@/lib/bath/methods/titration';

// vol % of 67 % nitric acid (about 1.40 g/mL, so about 14.9 mol/L, from memory): HNO3 + NaOH.
// 5 mL sample, 1.0 M NaOH: HNO3 g/L = mL × 12.60 (factor computed); the tank card shows g/L.
export const PASSIVATION_METHODS: readonly TitrationMethod[] = [
  {
    kind: 'titration',
    id: 'nitric-acid-naoh',
    name: 'Nitric acid by sodium hydroxide',
    reportedAs: 'HNO3',
    unit: 'g/L',
    sample: { volumeMl: 5 },
    titrant: { name: 'Sodium hydroxide', concentration: 1.0, concentrationUnit: 'mol/L' },
    blankMl: 0,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Phenolphthalein or methyl orange',
    caution: 'Nitric acid: fumes (nitrogen oxides) and a strong oxidiser; work under extraction.',
    source: 'Acid–base stoichiometry (factor computed)',
    status: 'computed',
  },
  {
    // C6H8O7 is triprotic: 3 NaOH per citric acid. 10 mL, 1.0 M NaOH: g/L = mL × 6.404 (computed).
    kind: 'titration',
    id: 'citric-acid-naoh',
    name: 'Citric acid by sodium hydroxide',
    reportedAs: 'C6H8O7',
    unit: 'g/L',
    sample: { volumeMl: 10 },
    titrant: { name: 'Sodium hydroxide', concentration: 1.0, concentrationUnit: 'mol/L' },
    blankMl: 0,
    stoichiometry: { reported: 1, titrant: 3 },
    indicator: 'Phenolphthalein, colourless to pink',
    source: 'Acid–base stoichiometry (factor computed)',
    status: 'computed',
  },
];

/** g/L of HNO3 in a vol % of 67 % nitric acid (density about 1.40 kg/L, from memory). */
export const NITRIC_G_PER_L_PER_VOL_PCT = 0.67 * 1400 / 100;

export const PASSIVATION_TEMPLATES: readonly BathTemplate[] = [
  {
    id: 'nitric-passivation',
    name: 'Nitric acid passivation (ASTM A967 Nitric 2)',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: null,
    analytes: [
      {
        // 20–45 vol % (ASTM A967 Nitric 2) × 9.38 g/L per vol % = 188–422 g/L HNO3 (computed).
        key: 'nitricAcid', name: 'Nitric acid', unit: 'g/L', methodId: 'nitric-acid-naoh',
        target: 280, lowerControl: 230, upperControl: 380, lowerSpec: 188, upperSpec: 422, frequencyHours: DAILY_H,
        basis: 'Specification limits: ASTM A967 Nitric 2 (20–45 vol %), converted at 67 % acid (from memory)',
      },
      { key: 'iron', name: 'Dissolved iron', unit: 'g/L', methodId: 'instrumental-metal', target: 0.5, upperControl: 2, upperSpec: 3, frequencyHours: DAILY_H * 7, basis: 'From memory' },
      temperature(27, 21, 32, 'ASTM A967 Nitric 2 lowest band 21–32 °C (from memory)'),
    ],
    hazards: ['strong_acid', 'oxidiser'],
    note: TEMPLATE_NOTE,
    basis: 'ASTM A967 Nitric 2 concentration; the rest from memory',
  },
  {
    id: 'citric-passivation',
    name: 'Citric acid passivation (ASTM A967 Citric 2)',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: null,
    analytes: [
      { key: 'citricAcid', name: 'Citric acid', unit: 'g/L', methodId: 'citric-acid-naoh', target: 70, lowerControl: 50, upperControl: 90, lowerSpec: 40, upperSpec: 100, frequencyHours: DAILY_H, basis: 'From memory (4–10 wt %)' },
      { key: 'ph', name: 'pH', unit: 'pH', methodId: 'ph-meter', target: 2, lowerControl: 1.5, upperControl: 2.5, frequencyHours: EVERY_SHIFT_H, basis: 'From memory' },
      temperature(55, 49, 60, 'ASTM A967 Citric 2 band 49–60 °C (from memory)'),
    ],
    hazards: ['heat'],
    note: TEMPLATE_NOTE,
    basis: 'From memory',
  },
];
