// One workbench calculation: part geometry, the job estimate, and the safety and galvanic checks.
// The browser runs this on every keystroke and the server runs it again when a calculation is
// saved, so what is stored never depends on figures sent by the browser. Pure.
import {
  estimateJob,
  getSubstrate,
  measureShape,
  partMassG,
  PlatingInputError,
  type JobEstimate,
  type JobInput,
  type SubstrateId,
} from '@/lib/plating';
import type { BakeRequirement } from '@/lib/quality/bake';
import { CALCULATION_VERSION, type CalculationInput, type Geometry } from './calculation-schema';
import { bakeFor, coatingVerdict, contactVerdict, safetyNotes, type CoatingVerdict, type ContactVerdict, type SafetyNote } from './safety';

export type GeometryFigures = {
  source: Geometry['kind'];
  areaDm2: number;
  volumeCm3: number | null;
  weightG: number | null; // volume × the substrate's density
  boundingBoxMm: [number, number, number] | null;
  triangleCount: number | null;
};

export type CalculationResult = {
  version: typeof CALCULATION_VERSION;
  geometry: GeometryFigures;
  estimate: JobEstimate;
  galvanic: CoatingVerdict | null;
  contact: ContactVerdict | null;
  bake: BakeRequirement | null;
  safety: SafetyNote[];
};

export function measureGeometry(geometry: Geometry, substrate: SubstrateId): GeometryFigures {
  const density = getSubstrate(substrate).densityGPerCm3;
  switch (geometry.kind) {
    case 'area':
      return { source: 'area', areaDm2: geometry.areaDm2, volumeCm3: null, weightG: null, boundingBoxMm: null, triangleCount: null };
    case 'shape': {
      const m = measureShape(geometry.shape);
      return { source: 'shape', areaDm2: m.areaDm2, volumeCm3: m.volumeCm3, weightG: partMassG(m.volumeCm3, density), boundingBoxMm: null, triangleCount: null };
    }
    case 'stl': {
      // An open (not watertight) mesh has no meaningful volume, so no weight either.
      const volume = Number.isFinite(geometry.volumeCm3) && geometry.volumeCm3 > 0 ? geometry.volumeCm3 : null;
      return {
        source: 'stl',
        areaDm2: geometry.areaDm2,
        volumeCm3: volume,
        weightG: volume === null ? null : partMassG(volume, density),
        boundingBoxMm: geometry.boundingBoxMm,
        triangleCount: geometry.triangleCount,
      };
    }
  }
}

/**
 * estimateJob with two guards for inputs the engine accepts one by one but cannot combine: a
 * minimum ÷ distribution ratio too large to represent (e.g. a ratio of 5e-324), and, as a net,
 * any engine message that would show "Infinity" or "NaN" to the user.
 */
export function estimateJobChecked(job: JobInput): JobEstimate {
  const ratio = job.process.distributionRatio;
  const min = job.minimumThicknessUm;
  if (typeof ratio === 'number' && ratio > 0 && min > 0 && Number.isFinite(min) && !Number.isFinite(min / ratio)) {
    const field = min > 1e300 ? 'minimumThicknessUm' : 'distributionRatio';
    throw new PlatingInputError(field, `A minimum of ${min} µm with a distribution ratio of ${ratio} gives an average thickness too large to work with.`);
  }
  try {
    return estimateJob(job);
  } catch (e) {
    if (e instanceof PlatingInputError && /\b(NaN|Infinity)\b/.test(e.message)) {
      throw new PlatingInputError(e.field, 'These inputs together are outside the range this calculation can represent; check their scale.');
    }
    throw e;
  }
}

export function computeCalculation(input: CalculationInput): CalculationResult {
  const geometry = measureGeometry(input.geometry, input.substrate);
  const estimate = estimateJobChecked({
    areaPerPartDm2: geometry.areaDm2,
    quantity: input.quantity,
    minimumThicknessUm: input.minimumThicknessUm,
    process: input.process,
  });
  const { element, charge } = input.process;
  const bake = bakeFor(input.substrate, input.hardnessHrc, input.tensileMpa);
  return {
    version: CALCULATION_VERSION,
    geometry,
    estimate,
    galvanic: coatingVerdict(element, input.substrate),
    contact: contactVerdict(element, input.contact),
    bake,
    safety: safetyNotes(element, charge, bake),
  };
}

/**
 * An engine error as field errors keyed the caller's way (a form's field names, a request's JSON
 * paths). Shape dimensions keep their own names; anything unmapped goes under `fallback`.
 */
export function fieldErrorsOf(err: PlatingInputError, map: Readonly<Record<string, string>>, fallback: string): Record<string, string[]> {
  const lookup = (k: string) => (Object.hasOwn(map, k) ? map[k] : undefined);
  const key = lookup(err.field) ?? lookup(err.field.split('.')[0] ?? '') ?? fallback;
  return { [key]: [err.message] };
}

/** Engine fields as paths of the stored input, for the save action's messages. */
export const INPUT_PATHS: Readonly<Record<string, string>> = {
  areaPerPartDm2: 'geometry',
  quantity: 'quantity',
  minimumThicknessUm: 'minimumThicknessUm',
  thicknessUm: 'minimumThicknessUm',
  hardnessHrc: 'hardnessHrc',
  tensileMpa: 'tensileMpa',
  element: 'process.element',
  charge: 'process.charge',
  currentDensityAdm2: 'process.currentDensityAdm2',
  efficiency: 'process.efficiency',
  distributionRatio: 'process.distributionRatio',
  loading: 'process.loading',
  partsPerLoad: 'process.partsPerLoad',
  rectifierMaxA: 'process.rectifierMaxA',
  tankVolts: 'process.tankVolts',
  rectifierEfficiency: 'process.rectifierEfficiency',
  dragOutLPerM2: 'process.dragOutLPerM2',
  bathMetalGPerL: 'process.bathMetalGPerL',
  anodes: 'process.anodes',
  anodeLossPercent: 'process.anodeLossPercent',
  formula: 'process.replenishmentSalt',
};
