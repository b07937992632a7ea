// Seeded meter readings and values derived from other analyses (reference §4.2–4.3).
import type { DerivedMethod, DirectMethod } from './titration';

const direct = (m: Omit<DirectMethod, 'kind'>): DirectMethod => ({ kind: 'direct', ...m });

export const DIRECT_METHODS: readonly DirectMethod[] = [
  direct({
    id: 'ph-meter',
    name: 'pH by glass electrode',
    quantity: 'ph',
    unit: 'pH',
    // Plating baths are high ionic strength: papers and colour comparators differ from a meter.
    procedure: 'Record the meter temperature and the calibration buffers used.',
    source: 'Reference §4.3 (store pH as measured, not computed)',
    status: 'from memory',
  }),
  direct({
    id: 'thermometer',
    name: 'Temperature',
    quantity: 'temperature',
    unit: '°C',
    source: 'Direct reading',
    status: 'published',
  }),
  direct({
    id: 'baume-hydrometer',
    name: 'Density by Baumé hydrometer',
    quantity: 'baume',
    unit: '°Bé',
    source: "Baumé scale for liquids heavier than water, SG = 145/(145 − °Bé) (Marks' Handbook via Engineers Edge)",
    status: 'published',
  }),
  direct({
    id: 'baume-as-specific-gravity',
    name: 'Specific gravity from a Baumé hydrometer',
    quantity: 'baume',
    unit: '°Bé',
    reportAs: 'specific_gravity',
    source: "SG = 145/(145 − °Bé) (Marks' Handbook via Engineers Edge; AIC/CAMEO)",
    status: 'published',
  }),
  direct({
    id: 'specific-gravity-hydrometer',
    name: 'Specific gravity by hydrometer',
    quantity: 'specific_gravity',
    unit: 'SG',
    source: 'Direct reading',
    status: 'published',
  }),
  direct({
    id: 'conductivity-meter',
    name: 'Conductivity',
    quantity: 'conductivity',
    unit: 'mS/cm',
    source: 'Direct reading',
    status: 'published',
  }),
  direct({
    id: 'instrumental-metal',
    name: 'Metal by instrument (AA, ICP or XRF solution analyser)',
    quantity: 'concentration',
    unit: 'g/L',
    procedure: 'Follow the instrument method; the supplier data sheet governs.',
    source: 'Instrumental reading (method per the laboratory procedure)',
    status: 'from memory',
  }),
  direct({
    id: 'instrumental-contaminant',
    name: 'Contaminant metal by instrument (AA or ICP)',
    quantity: 'concentration',
    unit: 'mg/L',
    source: 'Instrumental reading (method per the laboratory procedure)',
    status: 'from memory',
  }),
  direct({
    id: 'additive-supplier-method',
    name: 'Additive by the supplier method (Hull cell comparison or CVS)',
    quantity: 'concentration',
    unit: 'mL/L',
    procedure: 'Use the method on the additive supplier data sheet.',
    source: 'Supplier data sheet governs',
    status: 'from memory',
  }),
  direct({
    id: 'sulfate-centrifuge',
    name: 'Sulfate by centrifuge tube (read from the tube chart)',
    quantity: 'concentration',
    unit: 'g/L',
    source: 'Barium sulfate centrifuge method (from memory; use the tube maker chart)',
    status: 'from memory',
  }),
];

export const DERIVED_METHODS: readonly DerivedMethod[] = [
  {
    // Cr³⁺ = (total chromium − hexavalent chromium), both titrated as CrO3, expressed as Cr.
    kind: 'derived',
    id: 'trivalent-chromium-by-difference',
    name: 'Trivalent chromium by difference',
    reportedAs: 'Cr',
    unit: 'g/L',
    inputs: [
      { key: 'totalAsCrO3', label: 'Total chromium as CrO3 (after oxidation)' },
      { key: 'chromicAcid', label: 'Chromic acid (CrO3)' },
    ],
    terms: [
      { input: 'totalAsCrO3', sign: 1, fromFormula: 'CrO3', toFormula: 'Cr', toPerFrom: 1 },
      { input: 'chromicAcid', sign: -1, fromFormula: 'CrO3', toFormula: 'Cr', toPerFrom: 1 },
    ],
    source: 'finishing.com thread 442/93 (oxidise, re-titrate, subtract)',
    status: 'published',
  },
  {
    // EDTA titrates all nickel; the sulfate is what the chloride does not account for.
    kind: 'derived',
    id: 'nickel-sulfate-by-difference',
    name: 'Nickel sulfate hexahydrate from total nickel and nickel chloride',
    reportedAs: 'NiSO4·6H2O',
    unit: 'g/L',
    inputs: [
      { key: 'nickel', label: 'Nickel metal (EDTA)' },
      { key: 'nickelChloride', label: 'Nickel chloride hexahydrate (silver nitrate)' },
    ],
    terms: [
      { input: 'nickel', sign: 1, fromFormula: 'Ni', toFormula: 'NiSO4·6H2O', toPerFrom: 1 },
      { input: 'nickelChloride', sign: -1, fromFormula: 'NiCl2·6H2O', toFormula: 'NiSO4·6H2O', toPerFrom: 1 },
    ],
    source: 'Stoichiometry from the nickel (EDTA) and chloride (silver nitrate) methods (computed)',
    status: 'computed',
  },
  {
    // All-potassium chloride zinc: total chloride minus the two chlorides carried by each zinc.
    kind: 'derived',
    id: 'potassium-chloride-by-difference',
    name: 'Potassium chloride from total chloride and zinc',
    reportedAs: 'KCl',
    unit: 'g/L',
    inputs: [
      { key: 'chloride', label: 'Total chloride as Cl (silver nitrate)' },
      { key: 'zinc', label: 'Zinc metal (EDTA)' },
    ],
    terms: [
      { input: 'chloride', sign: 1, fromFormula: 'Cl', toFormula: 'KCl', toPerFrom: 1 },
      { input: 'zinc', sign: -1, fromFormula: 'Zn', toFormula: 'KCl', toPerFrom: 2 },
    ],
    source: 'Stoichiometry from the chloride and zinc methods (computed)',
    status: 'computed',
  },
];

export const INSTRUMENT_METHODS: readonly (DirectMethod | DerivedMethod)[] = [...DIRECT_METHODS, ...DERIVED_METHODS];
