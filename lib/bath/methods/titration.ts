// Analysis methods stored as plain JSON data, and the one function that turns a reading into a
// bath value. Pure: no I/O. Seeded methods live in ./methods.ts; a supervisor may edit copies.
import { molarMass } from '../../chemistry/formula';
import { AppError } from '../../errors';
import { badInput, finiteResult, optionalNumber, requireNumber } from '../checks';

// 1 oz/gal (US) = 28.349523125 g / 3.785411784 L = 7.48915 g/L (exact definitions, NIST Handbook 44
// App. C); the handbook factor printed in the Metal Finishing Guide Book is 7.49 (reference §1.1).
export const GRAMS_PER_LITRE_PER_OZ_PER_GAL = 28.349523125 / 3.785411784;

export type ConcentrationUnit = 'mol/L' | 'eq/L';
export type TitrationUnit = 'g/L' | 'mg/L' | 'oz/gal';
export type SourceStatus = 'published' | 'computed' | 'from memory';

export type TitrationMethod = {
  kind: 'titration';
  id: string;
  name: string;
  /** Formula of the species the result is expressed as (Ni, NiCl2·6H2O, H3BO3 …). */
  reportedAs: string;
  unit: TitrationUnit;
  /**
   * Bath sample. If it is diluted before an aliquot is taken, the effective sample is
   * volumeMl × aliquotMl ÷ dilutedToMl (reference §4.1: 5 mL to 100 mL, 5 mL aliquot → 0.25 mL).
   */
  sample: { volumeMl: number; dilutedToMl?: number; aliquotMl?: number };
  /**
   * Normality pitfall (reference §4.2): the concentration unit is explicit. With 'eq/L' the
   * stoichiometry below is per equivalent of titrant, with 'mol/L' per mole.
   */
  titrant: { name: string; concentration: number; concentrationUnit: ConcentrationUnit };
  blankMl: number;
  /** `reported` mol of the reported species react with `titrant` mol (or eq) of titrant. */
  stoichiometry: { reported: number; titrant: number };
  /**
   * A back-titration: a measured excess of reagent is added and what is left is titrated, so the
   * analyte is what the sample took away, (blank − burette) mL. The blank is then required.
   */
  back?: boolean;
  /** A printed shop factor in g per mol (or eq) of titrant; when absent it comes from the formula. */
  gramsPerTitrantUnit?: number;
  indicator: string;
  procedure?: string;
  caution?: string;
  source: string;
  status: SourceStatus;
};

export type DirectQuantity = 'ph' | 'temperature' | 'specific_gravity' | 'baume' | 'conductivity' | 'concentration';

export type DirectMethod = {
  kind: 'direct';
  id: string;
  name: string;
  quantity: DirectQuantity;
  unit: string;
  /** Baumé readings may be reported as specific gravity (heavier-than-water scale). */
  reportAs?: 'specific_gravity';
  procedure?: string;
  caution?: string;
  source: string;
  status: SourceStatus;
};

/** One term of a derived value: sign × input (g/L) ÷ M(from) × toPerFrom × M(to). */
export type DerivedTerm = { input: string; sign: 1 | -1; fromFormula: string; toFormula: string; toPerFrom: number };

export type DerivedMethod = {
  kind: 'derived';
  id: string;
  name: string;
  reportedAs: string;
  unit: 'g/L';
  inputs: { key: string; label: string }[];
  terms: DerivedTerm[];
  procedure?: string;
  source: string;
  status: SourceStatus;
};

export type AnalysisMethod = TitrationMethod | DirectMethod | DerivedMethod;

export type AnalysisInputs = {
  buretteMl?: number;
  blankMl?: number;
  /** Today's standardised titrant concentration, replacing the method's nominal value. */
  titrantConcentration?: number;
  /** Titrant standardisation factor f (e.g. 1.001), reference §4.1. */
  titrantFactor?: number;
  reading?: number;
  values?: Record<string, number>;
};

export type AnalysisResult =
  | { ok: true; value: number; unit: string; detail: string }
  | { ok: false; field: string; message: string };

/** SG = 145/(145 − °Bé) for liquids heavier than water; 140/(130 + °Bé) for lighter (Marks' Handbook). */
export function baumeToSpecificGravity(baume: number, scale: 'heavy' | 'light' = 'heavy'): number {
  requireNumber(baume, 'reading', 'Degrees Baumé', { min: 0, max: scale === 'heavy' ? 144.99 : 1000 });
  return scale === 'heavy' ? 145 / (145 - baume) : 140 / (130 + baume);
}

/** Inverse of the heavy-liquid scale: °Bé = 145 − 145/SG. */
export function specificGravityToBaume(sg: number): number {
  requireNumber(sg, 'reading', 'Specific gravity', { min: 1 });
  return 145 - 145 / sg;
}

export function effectiveSampleMl(method: TitrationMethod): number {
  const { volumeMl, dilutedToMl, aliquotMl } = method.sample;
  if (dilutedToMl === undefined && aliquotMl === undefined) return volumeMl;
  return (volumeMl * (aliquotMl ?? dilutedToMl ?? volumeMl)) / (dilutedToMl ?? volumeMl);
}

export function gramsPerTitrantUnit(method: TitrationMethod): number {
  if (method.gramsPerTitrantUnit !== undefined) return method.gramsPerTitrantUnit;
  return (molarMass(method.reportedAs) * method.stoichiometry.reported) / method.stoichiometry.titrant;
}

function toUnit(gramsPerLitre: number, unit: TitrationUnit): number {
  if (unit === 'mg/L') return gramsPerLitre * 1000;
  if (unit === 'oz/gal') return gramsPerLitre / GRAMS_PER_LITRE_PER_OZ_PER_GAL;
  return gramsPerLitre;
}

/** Result per mL of titrant at the nominal concentration, e.g. "Ni g/L = mL × 2.935". */
export function factorPerMl(method: TitrationMethod): number {
  assertValidMethod(method);
  return toUnit((method.titrant.concentration * gramsPerTitrantUnit(method)) / effectiveSampleMl(method), method.unit);
}

/** Problems with a method's stored data; empty when it can be used. */
export function validateMethod(method: AnalysisMethod): string[] {
  // Stored methods are edited JSON: a missing object must read as a problem, not a crash.
  try {
    return methodProblems(method);
  } catch {
    return ['The method data is incomplete.'];
  }
}

function methodProblems(method: AnalysisMethod): string[] {
  const problems: string[] = [];
  if (!method || !['titration', 'direct', 'derived'].includes(method.kind)) return ['Unknown kind of method.'];
  const positive = (v: unknown, label: string) => {
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) problems.push(`${label} must be greater than zero.`);
  };
  if (!method.id || !method.name) problems.push('A method needs an id and a name.');
  if (method.kind === 'titration') {
    positive(method.sample.volumeMl, 'Sample volume');
    if (method.sample.dilutedToMl !== undefined) positive(method.sample.dilutedToMl, 'Diluted volume');
    if (method.sample.aliquotMl !== undefined) positive(method.sample.aliquotMl, 'Aliquot volume');
    if ((method.sample.aliquotMl ?? 0) > (method.sample.dilutedToMl ?? Infinity)) {
      problems.push('The aliquot cannot be larger than the diluted volume.');
    }
    if ((method.sample.dilutedToMl ?? Infinity) < method.sample.volumeMl) {
      problems.push('The sample cannot be diluted to less than its own volume.');
    }
    positive(method.titrant.concentration, 'Titrant concentration');
    positive(method.stoichiometry.reported, 'Stoichiometry (reported)');
    positive(method.stoichiometry.titrant, 'Stoichiometry (titrant)');
    if (method.gramsPerTitrantUnit !== undefined) positive(method.gramsPerTitrantUnit, 'Factor');
    if (!Number.isFinite(method.blankMl) || method.blankMl < 0) problems.push('Blank must be zero or more.');
    try {
      molarMass(method.reportedAs);
    } catch (e) {
      problems.push(e instanceof Error ? e.message : 'Unreadable formula.');
    }
  } else if (method.kind === 'derived') {
    if (method.terms.length === 0) problems.push('A derived value needs at least one term.');
    for (const t of method.terms) {
      if (!method.inputs.some((i) => i.key === t.input)) problems.push(`Term uses unknown input "${t.input}".`);
      positive(t.toPerFrom, 'Mole ratio');
      for (const f of [t.fromFormula, t.toFormula]) {
        try {
          molarMass(f);
        } catch (e) {
          problems.push(e instanceof Error ? e.message : 'Unreadable formula.');
        }
      }
    }
  } else {
    if (!Object.prototype.hasOwnProperty.call(DIRECT_RANGES, method.quantity)) problems.push('Unknown kind of reading.');
    if (method.reportAs === 'specific_gravity' && method.quantity !== 'baume') {
      problems.push('Only a Baumé reading can be reported as specific gravity.');
    }
  }
  return problems;
}

function assertValidMethod(method: AnalysisMethod): void {
  const problems = validateMethod(method);
  if (problems.length > 0) throw badInput('method', `Method "${method.name || method.id}" is not usable: ${problems.join(' ')}`);
}

// Plausible physical windows: readings outside them are meter or typing faults, not bath values.
const DIRECT_RANGES: Record<DirectQuantity, { min: number; max: number; label: string }> = {
  ph: { min: -1, max: 15, label: 'pH' },
  temperature: { min: -10, max: 110, label: 'Temperature' },
  specific_gravity: { min: 0.6, max: 2.5, label: 'Specific gravity' },
  baume: { min: 0, max: 100, label: 'Degrees Baumé' },
  conductivity: { min: 0, max: 2000, label: 'Conductivity' },
  concentration: { min: 0, max: 2000, label: 'Concentration' },
};

function computeTitration(method: TitrationMethod, inputs: AnalysisInputs): Extract<AnalysisResult, { ok: true }> {
  const burette = requireNumber(inputs.buretteMl, 'buretteMl', 'Burette reading', { min: 0, max: 1000 });
  const blank = optionalNumber(inputs.blankMl, 'blankMl', 'Blank', { min: 0 }) ?? method.blankMl;
  const conc =
    optionalNumber(inputs.titrantConcentration, 'titrantConcentration', 'Titrant concentration', { positive: true }) ??
    method.titrant.concentration;
  const f = optionalNumber(inputs.titrantFactor, 'titrantFactor', 'Titrant factor', { min: 0.5, max: 1.5 }) ?? 1;
  if (method.back) {
    if (!(blank > 0)) throw badInput('blankMl', 'Enter the blank titration: this method titrates what the sample left over.');
    if (burette > blank) throw badInput('buretteMl', `The burette reading (${burette} mL) is above the blank (${blank} mL): repeat the titration.`);
  } else if (burette < blank) {
    throw badInput('buretteMl', `The burette reading (${burette} mL) is below the blank (${blank} mL): repeat the titration.`);
  }
  const [first, second] = method.back ? [blank, burette] : [burette, blank];
  const gramsPerLitre = ((first - second) * conc * f * gramsPerTitrantUnit(method)) / effectiveSampleMl(method);
  const value = finiteResult(toUnit(gramsPerLitre, method.unit), method.name);
  return {
    ok: true,
    value,
    unit: method.unit,
    detail: `(${first} − ${second}) mL × ${conc} ${method.titrant.concentrationUnit} × ${f} × ${gramsPerTitrantUnit(method).toFixed(3)} g ÷ ${effectiveSampleMl(method)} mL`,
  };
}

function computeDirect(method: DirectMethod, inputs: AnalysisInputs): Extract<AnalysisResult, { ok: true }> {
  const range = DIRECT_RANGES[method.quantity];
  const reading = requireNumber(inputs.reading, 'reading', range.label, { min: range.min, max: range.max });
  if (method.quantity === 'baume' && method.reportAs === 'specific_gravity') {
    return { ok: true, value: baumeToSpecificGravity(reading), unit: 'SG', detail: `SG = 145/(145 − ${reading})` };
  }
  return { ok: true, value: reading, unit: method.unit, detail: 'direct reading' };
}

function computeDerived(method: DerivedMethod, inputs: AnalysisInputs): Extract<AnalysisResult, { ok: true }> {
  const values = inputs.values ?? {};
  let total = 0;
  for (const t of method.terms) {
    const label = method.inputs.find((i) => i.key === t.input)?.label ?? t.input;
    const v = requireNumber(values[t.input], t.input, label, { min: 0 });
    total += (t.sign * v * t.toPerFrom * molarMass(t.toFormula)) / molarMass(t.fromFormula);
  }
  // Tiny negatives are rounding between two analyses of nearly equal value.
  if (total < -1e-9) {
    throw badInput('values', `${method.name} came out negative (${total.toFixed(3)} g/L): check the input analyses.`);
  }
  return { ok: true, value: finiteResult(Math.max(0, total), method.name), unit: method.unit, detail: 'derived' };
}

/** Validates the method and the inputs and returns the bath value, or a message naming the field. */
export function computeAnalysis(method: AnalysisMethod, inputs: AnalysisInputs): AnalysisResult {
  try {
    assertValidMethod(method);
    if (method.kind === 'titration') return computeTitration(method, inputs);
    if (method.kind === 'direct') return computeDirect(method, inputs);
    return computeDerived(method, inputs);
  } catch (e) {
    if (e instanceof AppError) {
      const field = Object.keys(e.fieldErrors ?? {})[0] ?? 'method';
      return { ok: false, field, message: e.message };
    }
    throw e;
  }
}
