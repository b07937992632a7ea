// Silver, gold, chromium and pretreatment templates. Sources are reference-sheet IDs' documents.
import { DAILY_H, EVERY_SHIFT_H, TEMPLATE_NOTE, WEEKLY_H, temperature, type BathTemplate } from './types';

export const OTHER_TEMPLATES: readonly BathTemplate[] = [
  {
    id: 'cyanide-silver',
    name: 'Cyanide silver',
    deposit: { element: 'Ag', charge: 1 },
    efficiencyPercent: { typical: 98, low: 95, high: 100 }, // from memory
    currentDensityAdm2: { low: 0.5, high: 1.5 }, // from memory
    analytes: [
      { key: 'silver', name: 'Silver metal', unit: 'g/L', methodId: 'silver-thiocyanate', target: 40, lowerControl: 30, upperControl: 50, frequencyHours: DAILY_H, basis: 'J. Surface Finishing Soc. Japan 22(4) 181' },
      { key: 'freeCyanide', name: 'Free potassium cyanide', unit: 'g/L', methodId: 'free-potassium-cyanide-silver-nitrate', target: 55, lowerControl: 40, upperControl: 70, frequencyHours: DAILY_H, basis: 'J. Surface Finishing Soc. Japan 22(4) 181' },
      {
        // 90 g/L and above narrows the usable current-density range: treated as the hard limit.
        key: 'carbonate', name: 'Potassium carbonate', unit: 'g/L', methodId: 'potassium-carbonate-barium',
        target: 45, lowerControl: 30, upperControl: 60, upperSpec: 90, frequencyHours: WEEKLY_H,
        basis: 'J. Surface Finishing Soc. Japan 22(4) 181',
      },
      temperature(25, 20, 30, 'From memory'),
    ],
    hazards: ['cyanide', 'caustic', 'electrical'],
    note: TEMPLATE_NOTE,
    basis: 'Composition: J. Surface Finishing Soc. Japan 22(4) 181; efficiency and current density from memory',
  },
  {
    id: 'acid-gold',
    name: 'Acid hard gold (cobalt-hardened)',
    deposit: { element: 'Au', charge: 1 },
    efficiencyPercent: { typical: 45, low: 30, high: 60 }, // from memory
    currentDensityAdm2: { low: 0.5, high: 1.5 }, // from memory
    analytes: [
      { key: 'gold', name: 'Gold metal', unit: 'g/L', methodId: 'instrumental-metal', target: 8, lowerControl: 4, upperControl: 12, frequencyHours: DAILY_H, basis: 'From memory' },
      { key: 'cobalt', name: 'Cobalt (hardener)', unit: 'g/L', methodId: 'instrumental-metal', target: 0.3, lowerControl: 0.1, upperControl: 0.5, frequencyHours: WEEKLY_H, basis: 'From memory' },
      { key: 'ph', name: 'pH', unit: 'pH', methodId: 'ph-meter', target: 4.25, lowerControl: 3.5, upperControl: 5, frequencyHours: EVERY_SHIFT_H, basis: 'From memory' },
      temperature(40, 30, 50, 'From memory'),
    ],
    // The gold salt is a cyanide complex (KAu(CN)2).
    hazards: ['cyanide', 'heat', 'electrical'],
    note: TEMPLATE_NOTE,
    basis: 'From memory (reference §2–3 marks these values unverified)',
  },
  {
    id: 'hexavalent-chromium',
    name: 'Hexavalent chromium (conventional sulfate-catalysed, hard)',
    // Cr(VI) → Cr metal: six electrons per atom.
    deposit: { element: 'Cr', charge: 6 },
    // Conventional sulfate baths 12–18 % (reference §2, Aqua Bond; 31 A/dm² at 55 °C ≈ 25 µm/h).
    efficiencyPercent: { typical: 15, low: 12, high: 18 },
    currentDensityAdm2: { low: 30, high: 60 },
    analytes: [
      { key: 'chromicAcid', name: 'Chromic acid (CrO3)', unit: 'g/L', methodId: 'chromic-acid-thiosulfate', target: 250, lowerControl: 187, upperControl: 375, frequencyHours: DAILY_H, basis: 'Aqua Bond hard chrome bath types; Galvanica Partenopea' },
      {
        // CrO3 : SO4 = 100 : 1 (80 : 1 to 120 : 1) at 250 g/L CrO3.
        key: 'sulfate', name: 'Sulfate', unit: 'g/L', methodId: 'sulfate-centrifuge',
        target: 2.5, lowerControl: 2.1, upperControl: 3.1, frequencyHours: WEEKLY_H,
        basis: 'Aqua Bond (100 : 1 ratio, 80–120 : 1) at 250 g/L CrO3',
      },
      {
        key: 'trivalentChromium', name: 'Trivalent chromium', unit: 'g/L', methodId: 'trivalent-chromium-by-difference',
        target: 1.5, upperControl: 3, upperSpec: 4, frequencyHours: WEEKLY_H,
        basis: 'Control limit from memory; 4 g/L maximum from finishing.com thread 169/76',
      },
      temperature(55, 50, 60, 'Chromium plating operating ranges (hard chrome about 55 °C)'),
    ],
    hazards: ['hexavalent_chromium', 'strong_acid', 'oxidiser', 'hydrogen', 'heat', 'electrical'],
    note: TEMPLATE_NOTE,
    basis: 'Aqua Bond; chromium plating operating ranges; Galvanica Partenopea; finishing.com 169/76',
  },
  {
    id: 'trivalent-chromium',
    name: 'Trivalent chromium (decorative)',
    deposit: { element: 'Cr', charge: 3 },
    efficiencyPercent: { typical: 20, low: 15, high: 30 }, // from memory
    currentDensityAdm2: { low: 5, high: 15 }, // from memory
    analytes: [
      { key: 'chromium', name: 'Chromium (III)', unit: 'g/L', methodId: 'instrumental-metal', target: 15, lowerControl: 5, upperControl: 25, frequencyHours: DAILY_H, basis: 'From memory' },
      { key: 'ph', name: 'pH', unit: 'pH', methodId: 'ph-meter', target: 3.25, lowerControl: 2.5, upperControl: 4, frequencyHours: EVERY_SHIFT_H, basis: 'From memory' },
      temperature(35, 25, 45, 'From memory'),
      { key: 'additive', name: 'Additive', unit: 'mL/L', methodId: 'additive-supplier-method', target: 10, lowerControl: 5, upperControl: 15, frequencyHours: DAILY_H, additiveRateMlPerKAh: 100, basis: 'From memory; supplier data sheet governs' },
    ],
    hazards: ['hydrogen', 'electrical'],
    note: TEMPLATE_NOTE,
    basis: 'From memory (reference §2–3 marks these values unverified)',
  },
  {
    id: 'alkaline-electrocleaner',
    name: 'Alkaline electrocleaner',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: { low: 5, high: 10 }, // from memory
    analytes: [
      { key: 'alkalinity', name: 'Total alkalinity as NaOH', unit: 'g/L', methodId: 'sodium-hydroxide-acid', target: 30, lowerControl: 20, upperControl: 40, frequencyHours: DAILY_H, basis: 'From memory' },
      temperature(65, 50, 80, 'From memory'),
    ],
    hazards: ['caustic', 'hydrogen', 'heat', 'electrical'],
    note: TEMPLATE_NOTE,
    basis: 'From memory',
  },
  {
    id: 'hydrochloric-acid-dip',
    name: 'Hydrochloric acid dip',
    deposit: null,
    efficiencyPercent: null,
    currentDensityAdm2: null,
    analytes: [
      { key: 'hydrochloricAcid', name: 'Hydrochloric acid', unit: 'g/L', methodId: 'hydrochloric-acid-naoh', target: 150, lowerControl: 100, upperControl: 200, frequencyHours: DAILY_H, basis: 'From memory' },
      { key: 'iron', name: 'Dissolved iron', unit: 'g/L', methodId: 'instrumental-metal', target: 5, upperControl: 15, upperSpec: 20, frequencyHours: WEEKLY_H, basis: 'From memory' },
    ],
    // Acid on steel releases hydrogen; the dip also fumes.
    hazards: ['strong_acid', 'hydrogen'],
    note: TEMPLATE_NOTE,
    basis: 'From memory',
  },
];
