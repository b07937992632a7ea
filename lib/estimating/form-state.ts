// The workbench's form: what the estimator typed, as text in their own units, and the ways it is
// filled (defaults, a finish from the library, a free metal, a saved calculation). Pure.
import {
  displayUnit,
  fromStorage,
  type JobProcess,
  type Loading,
  type ServiceEnvironment,
  type SubstrateId,
  type UnitOf,
  type UnitSystem,
} from '@/lib/plating';
import { SHAPES, type ShapeEntry, type ShapeKind } from '@/lib/parts/shapes';
import type { CalculationInput, StlGeometry } from './calculation-schema';
import { DRAG_OUT_UNIT, dragOutFromStorage, LENGTH_UNIT, lengthFromMm, type DragOutUnit } from './display-units';
import { freeProcessFor, type LibraryProcess } from './process-library';

export type GeometryMode = 'shape' | 'area' | 'stl';
export type AreaUnit = UnitOf<'area'>;

export type WorkbenchForm = {
  geometryMode: GeometryMode;
  shape: ShapeEntry;
  area: string;
  areaUnit: AreaUnit;
  stl: StlGeometry | null;
  substrate: SubstrateId;
  hardnessHrc: string;
  tensileMpa: string;
  quantity: string;
  minimumThickness: string;
  finishId: string; // '' for a free process
  metalKey: string; // 'Ni2+'
  currentDensity: string;
  efficiencyPct: string;
  distributionRatio: string; // '' for the default of the loading
  loading: Loading;
  partsPerLoad: string;
  tankVolts: string;
  rectifierMaxA: string;
  rectifierEfficiencyPct: string;
  dragOut: string;
  bathMetal: string;
  anodes: 'soluble' | 'insoluble';
  anodeLossPct: string;
  replenishmentSalt: string;
  contactMaterial: string; // '' for no contact check
  environment: ServiceEnvironment;
};

export type ProcessFields = Pick<
  WorkbenchForm,
  | 'metalKey' | 'currentDensity' | 'efficiencyPct' | 'distributionRatio' | 'loading' | 'partsPerLoad' | 'tankVolts'
  | 'rectifierMaxA' | 'rectifierEfficiencyPct' | 'dragOut' | 'bathMetal' | 'anodes' | 'anodeLossPct' | 'replenishmentSalt'
>;

export type FormUnits = {
  thickness: UnitOf<'thickness'>;
  currentDensity: UnitOf<'currentDensity'>;
  concentration: UnitOf<'concentration'>;
  area: AreaUnit;
  dragOut: DragOutUnit;
};

export function formUnits(system: UnitSystem): FormUnits {
  return {
    thickness: displayUnit('thickness', system),
    currentDensity: displayUnit('currentDensity', system),
    concentration: displayUnit('concentration', system),
    // A single part is easier to read in in² than in ft²; the unit box offers every area unit.
    area: system === 'us' ? 'in2' : 'dm2',
    dragOut: DRAG_OUT_UNIT[system],
  };
}

/**
 * A number as an input shows it, without binary noise (0.1 + 0.2). Counts and values typed in
 * the box's own unit keep ten significant figures; values converted from another unit get six,
 * which is finer than any gauge reads (25 µm → 0.984252 mil, not 0.9842519685).
 */
export function text(value: number | null | undefined, significantFigures = 10): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(significantFigures)));
}

const converted = (value: number) => text(value, 6);
const pct = (fraction: number) => text(fraction * 100);

export function processFields(p: JobProcess, system: UnitSystem): ProcessFields {
  const u = formUnits(system);
  return {
    metalKey: `${p.element}${p.charge}+`,
    currentDensity: converted(fromStorage(p.currentDensityAdm2, u.currentDensity)),
    efficiencyPct: pct(p.efficiency),
    distributionRatio: text(p.distributionRatio),
    loading: p.loading,
    partsPerLoad: text(p.partsPerLoad),
    tankVolts: text(p.tankVolts),
    rectifierMaxA: text(p.rectifierMaxA),
    rectifierEfficiencyPct: pct(p.rectifierEfficiency),
    dragOut: converted(dragOutFromStorage(p.dragOutLPerM2, u.dragOut)),
    bathMetal: converted(fromStorage(p.bathMetalGPerL, u.concentration)),
    anodes: p.anodes ?? 'soluble',
    anodeLossPct: text(p.anodeLossPercent ?? 0),
    replenishmentSalt: p.replenishmentSalt ?? '',
  };
}

// One default part, 50 × 30 × 10 mm, shown in the reader's length unit: the same part (and so the
// same amp-hours) whichever units the user picks.
const DEFAULT_PART_MM = { lengthMm: 50, widthMm: 30, heightMm: 10 };
const DEFAULT_DIMS: Record<UnitSystem, Record<string, string>> = {
  metric: Object.fromEntries(Object.entries(DEFAULT_PART_MM).map(([k, mm]) => [k, text(mm)])),
  us: Object.fromEntries(Object.entries(DEFAULT_PART_MM).map(([k, mm]) => [k, converted(lengthFromMm(mm, LENGTH_UNIT.us))])),
};

export function defaultForm(system: UnitSystem, library: readonly LibraryProcess[]): WorkbenchForm {
  // Nickel is the everyday case; a cyanide or chromium bath should be a deliberate choice.
  const first = library.find((l) => l.process.element === 'Ni') ?? library[0];
  const process = first?.process ?? freeProcessFor('Ni', 2);
  const u = formUnits(system);
  return {
    geometryMode: 'shape',
    shape: { kind: 'block', unit: LENGTH_UNIT[system], dims: { ...DEFAULT_DIMS[system] }, flags: {} },
    area: '',
    areaUnit: u.area,
    stl: null,
    substrate: 'carbon-steel',
    hardnessHrc: '',
    tensileMpa: '',
    quantity: '500',
    minimumThickness: converted(fromStorage(first?.minimumThicknessUm ?? 8, u.thickness)),
    finishId: first?.finishId ?? '',
    ...processFields(process, system),
    contactMaterial: '',
    environment: 'normal',
  };
}

export function applyLibrary(form: WorkbenchForm, entry: LibraryProcess, system: UnitSystem): WorkbenchForm {
  const u = formUnits(system);
  return {
    ...form,
    ...processFields(entry.process, system),
    finishId: entry.finishId,
    minimumThickness: converted(fromStorage(entry.minimumThicknessUm, u.thickness)),
  };
}

export function applyFreeMetal(form: WorkbenchForm, metalKey: string, system: UnitSystem): WorkbenchForm {
  const [, element = 'Ni', charge = '2'] = /^([A-Z][a-z]?)(\d)\+$/.exec(metalKey) ?? [];
  const keep = { partsPerLoad: form.partsPerLoad, tankVolts: form.tankVolts, rectifierMaxA: form.rectifierMaxA };
  return { ...form, ...processFields(freeProcessFor(element, Number(charge), form.loading), system), ...keep, finishId: '' };
}

function shapeEntryOf(shape: Extract<CalculationInput['geometry'], { kind: 'shape' }>['shape'], system: UnitSystem): ShapeEntry {
  const unit = LENGTH_UNIT[system];
  const dims: Record<string, string> = {};
  const flags: Record<string, boolean> = {};
  const source = shape as unknown as Record<string, unknown>;
  for (const d of SHAPES[shape.kind as ShapeKind].dims) {
    const v = source[d.key];
    if (typeof v === 'number') dims[d.key] = converted(lengthFromMm(v, unit));
  }
  for (const f of SHAPES[shape.kind as ShapeKind].flags) flags[f.key] = source[f.key] === true;
  if (shape.kind === 'plate-with-holes') {
    const holes = shape.holes[0];
    dims.holeDiameterMm = holes ? converted(lengthFromMm(holes.diameterMm, unit)) : '1';
    dims.holeCount = text(holes?.count ?? 0);
  }
  return { kind: shape.kind, unit, dims, flags };
}

/** A saved calculation back in the form, in the viewer's units. */
export function formFromInput(input: CalculationInput, system: UnitSystem): WorkbenchForm {
  const u = formUnits(system);
  const g = input.geometry;
  const base = defaultForm(system, []);
  return {
    ...base,
    geometryMode: g.kind,
    shape: g.kind === 'shape' ? shapeEntryOf(g.shape, system) : base.shape,
    area: g.kind === 'area' ? converted(fromStorage(g.areaDm2, u.area)) : '',
    stl: g.kind === 'stl' ? g : null,
    substrate: input.substrate,
    hardnessHrc: text(input.hardnessHrc),
    tensileMpa: text(input.tensileMpa),
    quantity: text(input.quantity),
    minimumThickness: converted(fromStorage(input.minimumThicknessUm, u.thickness)),
    finishId: input.finishId ?? '',
    ...processFields(input.process, system),
    contactMaterial: input.contact?.material ?? '',
    environment: input.contact?.environment ?? 'normal',
  };
}
