// A mid-phosphorus electroless nickel bath (acid hypophosphite). Values are typical, from memory
// (reference sheet process-families §2 marks them [M]); the supplier's data sheet governs.
import { DAILY_H, EVERY_SHIFT_H, TEMPLATE_NOTE, temperature, type BathTemplate } from '@/lib/bath/templates/types';
import type { TitrationMethod } from '@/lib/bath/methods/titration';

const HYPO_CAUTION = 'Hypophosphite is a strong reducer: keep it away from oxidisers. The bath runs near 90 °C.';

export const EN_METHODS: readonly TitrationMethod[] = [
  {
    // 5 mL, 0.05 M EDTA: Ni g/L = mL × 0.5869 (factor computed from IUPAC weights).
    kind: 'titration',
    id: 'en-nickel-edta',
    name: 'Electroless nickel: nickel by EDTA (murexide)',
    reportedAs: 'Ni',
    unit: 'g/L',
    sample: { volumeMl: 5 },
    titrant: { name: 'EDTA (disodium salt)', concentration: 0.05, concentrationUnit: 'mol/L' },
    blankMl: 0,
    stoichiometry: { reported: 1, titrant: 1 },
    indicator: 'Murexide in ammonia buffer, pH about 9–10; yellow to violet',
    source: 'Complexometric nickel by EDTA/murexide (as the nickel-edta method); sample size from memory, factor computed',
    status: 'from memory',
  },
  {
    // H2PO2⁻ + 2 I2 + 2 H2O → H2PO4⁻ + 4 I⁻ + 4 H⁺ (four electrons), and each I2 takes two
    // thiosulfates: one hypophosphite uses the iodine of four thiosulfates. A back-titration: the
    // iodine left over is titrated, so the hypophosphite is (blank − sample) mL of thiosulfate.
    // 1 mL effective sample, 0.1 M thiosulfate: NaH2PO2·H2O g/L = (blank − mL) × 2.650.
    kind: 'titration',
    id: 'hypophosphite-iodometric',
    name: 'Sodium hypophosphite by iodine back-titration',
    reportedAs: 'NaH2PO2·H2O',
    unit: 'g/L',
    sample: { volumeMl: 10, dilutedToMl: 100, aliquotMl: 10 },
    titrant: { name: 'Sodium thiosulfate', concentration: 0.1, concentrationUnit: 'mol/L' },
    blankMl: 0,
    back: true,
    stoichiometry: { reported: 1, titrant: 4 },
    indicator: 'Starch near the end point, blue to colourless',
    procedure: 'Add a measured excess of 0.05 M iodine in acid, stopper and stand 30 min in the dark, then titrate the iodine left with thiosulfate. Run a blank with the same iodine and no sample.',
    caution: HYPO_CAUTION,
    source: 'Iodometric back-titration of hypophosphite (redox stoichiometry computed; procedure from memory)',
    status: 'from memory',
  },
];

export const EN_TEMPLATES: readonly BathTemplate[] = [
  {
    id: 'electroless-nickel-mid-phos',
    name: 'Electroless nickel, mid-phosphorus',
    // Autocatalytic: no current; the deposit's nickel is priced by mass, not by Faraday's law.
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: null,
    analytes: [
      { key: 'nickel', name: 'Nickel metal', unit: 'g/L', methodId: 'en-nickel-edta', target: 6, lowerControl: 5.4, upperControl: 6.6, lowerSpec: 4.8, upperSpec: 7.2, frequencyHours: EVERY_SHIFT_H, basis: 'From memory (about 6 g/L at make-up)' },
      { key: 'hypophosphite', name: 'Sodium hypophosphite', unit: 'g/L', methodId: 'hypophosphite-iodometric', target: 30, lowerControl: 25, upperControl: 35, lowerSpec: 20, frequencyHours: EVERY_SHIFT_H, basis: 'From memory' },
      { key: 'orthophosphite', name: 'Orthophosphite', unit: 'g/L', methodId: 'additive-supplier-method', target: 60, upperControl: 150, upperSpec: 200, frequencyHours: DAILY_H, basis: 'From memory: builds up with each metal turnover and ends the bath’s life' },
      { key: 'ph', name: 'pH', unit: 'pH', methodId: 'ph-meter', target: 4.75, lowerControl: 4.5, upperControl: 5, frequencyHours: EVERY_SHIFT_H, basis: 'Reference sheet process-families §2 (about 4.5–5.0, from memory)' },
      temperature(88, 85, 90, 'Reference sheet process-families §2 (about 85–90 °C, from memory)'),
    ],
    hazards: ['nickel', 'heat'],
    note: TEMPLATE_NOTE,
    basis: 'Reference sheet process-families §2 (values from memory)',
  },
];

export const EN_SUPPLIES = {
  'electroless-nickel-mid-phos': {
    nickel: { kind: 'salt', saltId: 'nickel-sulfate-hexahydrate' },
    hypophosphite: { kind: 'as_measured', name: 'Sodium hypophosphite monohydrate' },
  },
} as const;
