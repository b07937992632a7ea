// The workbench's recompute: the form as typed → field errors, part geometry and the whole
// calculation. The page calls it on every keystroke (in the browser) and the benchmark times it.
// Pure and synchronous.
import { PLATING_METALS, PlatingInputError, type UnitSystem } from '@/lib/plating';
import type { CautionKind } from '@/components/ui/caution';
import { cautionKindsOf, type Hazard } from '@/lib/bath/hazards';
import { platingCautions } from '@/lib/finishes/hazards';
import { freeProcessHazards } from './process-library';
import { bakeFor, safetyNotes, type SafetyNote } from './safety';
import type { CalculationInput } from './calculation-schema';
import { computeCalculation, fieldErrorsOf, measureGeometry, type CalculationResult, type GeometryFigures } from './calculation';
import { readForm, type FieldErrors } from './form-read';
import type { WorkbenchForm } from './form-state';

// Engine field → the form's field, so each message sits beside the box that caused it.
const FORM_FIELDS: Readonly<Record<string, string>> = {
  quantity: 'quantity',
  minimumThicknessUm: 'minimumThickness',
  thicknessUm: 'minimumThickness',
  depositMassG: 'minimumThickness',
  currentDensityAdm2: 'currentDensity',
  efficiency: 'efficiencyPct',
  distributionRatio: 'distributionRatio',
  partsPerLoad: 'partsPerLoad',
  rectifierMaxA: 'rectifierMaxA',
  tankVolts: 'tankVolts',
  ampHours: 'quantity',
  rectifierEfficiency: 'rectifierEfficiencyPct',
  dragOutLPerM2: 'dragOut',
  bathMetalGPerL: 'bathMetal',
  anodeLossPercent: 'anodeLossPct',
  formula: 'replenishmentSalt',
  element: 'metalKey',
  charge: 'metalKey',
  hardnessHrc: 'hardnessHrc',
  tensileMpa: 'tensileMpa',
};

export type WorkbenchView = {
  input: CalculationInput | null;
  result: CalculationResult | null;
  geometry: GeometryFigures | null; // shown even while the process fields have errors
  // Cautions follow the metal and the part alone, so they stay up while other fields are wrong.
  safety: SafetyNote[];
  /** The bath's own cautions (current, hydrogen, nickel salts, acid, caustic) that `safety` does not already give. */
  bathCautions: CautionKind[];
  fieldErrors: FieldErrors;
};

function optionalNumber(text: string): number | null {
  const n = Number(text.trim());
  return text.trim() === '' || !Number.isFinite(n) ? null : n;
}

function cautionsOf(form: WorkbenchForm, finish: FinishContext): Pick<WorkbenchView, 'safety' | 'bathCautions'> {
  const metal = PLATING_METALS.find((m) => m.key === form.metalKey);
  if (!metal) return { safety: [], bathCautions: [] };
  let bake = null;
  try {
    bake = bakeFor(form.substrate, optionalNumber(form.hardnessHrc), optionalNumber(form.tensileMpa));
  } catch (e) {
    if (!(e instanceof PlatingInputError)) throw e; // the hardness field shows the message
  }
  const safety = safetyNotes(metal.element, metal.charge, bake);
  const said = new Set<string>(safety.map((n) => n.kind));
  const fromBath = cautionKindsOf(finish.bathHazards ?? freeProcessHazards(metal.element, metal.charge));
  const kinds = new Set([...platingCautions(metal.element, metal.charge, finish.words ?? ''), ...fromBath]);
  return { safety, bathCautions: [...kinds].filter((k) => !said.has(k)) };
}

function engineErrors(e: unknown, form: WorkbenchForm): FieldErrors {
  if (!(e instanceof PlatingInputError)) throw e;
  // Area problems belong to the area box, or to the geometry as a whole for shapes and STL files.
  const geometryKey = form.geometryMode === 'area' ? 'area' : 'geometry';
  return fieldErrorsOf(e, { ...FORM_FIELDS, areaPerPartDm2: geometryKey, areaDm2: geometryKey, volumeCm3: geometryKey }, '_form');
}

/** The chosen finish's name and specification, and its bath's hazards; a free process uses its metal's first bath template. */
export type FinishContext = { words?: string; bathHazards?: readonly Hazard[] };

export function recomputeWorkbench(form: WorkbenchForm, system: UnitSystem, finish: FinishContext = {}): WorkbenchView {
  const reading = readForm(form, system);
  const cautions = cautionsOf(form, finish);
  let geometry: GeometryFigures | null = null;
  let fieldErrors = reading.fieldErrors;
  if (reading.geometry) {
    try {
      geometry = measureGeometry(reading.geometry, form.substrate);
    } catch (e) {
      fieldErrors = { ...fieldErrors, ...engineErrors(e, form) };
    }
  }
  if (!reading.input || !geometry) return { input: null, result: null, geometry, ...cautions, fieldErrors };
  try {
    return { input: reading.input, result: computeCalculation(reading.input), geometry, ...cautions, fieldErrors };
  } catch (e) {
    return { input: null, result: null, geometry, ...cautions, fieldErrors: { ...fieldErrors, ...engineErrors(e, form) } };
  }
}
