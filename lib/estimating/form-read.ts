// Reads the workbench form: text in the estimator's units → the stored input in storage units,
// with a message per field for anything missing or impossible. Range checks here only word the
// message in the user's units; the engine still judges every value. Pure.
import { PLATING_METALS, toStorage, UNITS, type UnitId, type UnitSystem } from '@/lib/plating';
import { measureShapeEntry } from '@/lib/parts/shapes';
import { CALCULATION_VERSION, type CalculationInput, type Geometry } from './calculation-schema';
import { dragOutToStorage } from './display-units';
import { formUnits, type WorkbenchForm } from './form-state';

export type FieldErrors = Record<string, string[]>;

type Rule = 'positive' | 'nonNegative' | 'count' | 'percent' | 'percentOrZero' | 'fraction';

const RULE_TEXT: Record<Rule, string> = {
  positive: 'must be more than 0',
  nonNegative: 'cannot be negative',
  count: 'must be a whole number of at least 1',
  percent: 'must be more than 0 % and at most 100 %',
  percentOrZero: 'must be from 0 up to (not including) 100 %',
  fraction: 'must be more than 0 and at most 1 (minimum ÷ average)',
};

function fits(rule: Rule, n: number): boolean {
  switch (rule) {
    case 'positive':
      return n > 0;
    case 'nonNegative':
      return n >= 0;
    case 'count':
      return Number.isSafeInteger(n) && n >= 1;
    case 'percent':
      return n > 0 && n <= 100;
    case 'percentOrZero':
      return n >= 0 && n < 100;
    case 'fraction':
      return n > 0 && n <= 1;
  }
}

function reader(errors: FieldErrors) {
  function read(key: string, raw: string, label: string, rule: Rule): number | null;
  function read(key: string, raw: string, label: string, rule: Rule, optional: true): number | null | undefined;
  function read(key: string, raw: string, label: string, rule: Rule, optional = false): number | null | undefined {
    const t = raw.trim();
    if (t === '') {
      if (optional) return undefined;
      errors[key] = [`Enter the ${label.toLowerCase()}.`];
      return null;
    }
    const n = Number(t);
    if (!Number.isFinite(n)) {
      errors[key] = [`${label} must be a number; got "${t}".`];
      return null;
    }
    if (!fits(rule, n)) {
      errors[key] = [`${label} ${RULE_TEXT[rule]}; got ${t}.`];
      return null;
    }
    return n;
  }
  return read;
}

function readGeometry(form: WorkbenchForm, errors: FieldErrors, read: ReturnType<typeof reader>): Geometry | null {
  if (form.geometryMode === 'stl') {
    if (!form.stl) errors.stl = ['Choose an STL file of the part.'];
    return form.stl;
  }
  if (form.geometryMode === 'area') {
    const area = read('area', form.area, 'Area per part', 'positive');
    if (area === null) return null;
    const areaDm2 = storedIn(errors, 'area', area, form.areaUnit);
    return Number.isFinite(areaDm2) ? { kind: 'area', areaDm2 } : null;
  }
  const outcome = measureShapeEntry(form.shape);
  if (!outcome.ok) {
    Object.assign(errors, outcome.fieldErrors);
    return null;
  }
  return { kind: 'shape', shape: outcome.shape };
}

// Converting a huge value can overflow (1e308 ft² → dm²): say so beside the field instead.
function storedIn(errors: FieldErrors, key: string, value: number, unit: UnitId): number {
  const v = toStorage(value, unit);
  if (!Number.isFinite(v)) errors[key] = [`${value} ${UNITS[unit].symbol} is too large to work with.`];
  return v;
}

export type FormReading = { input: CalculationInput | null; geometry: Geometry | null; fieldErrors: FieldErrors };

export function readForm(form: WorkbenchForm, system: UnitSystem): FormReading {
  const errors: FieldErrors = {};
  const read = reader(errors);
  const u = formUnits(system);
  const geometry = readGeometry(form, errors, read);

  const metal = PLATING_METALS.find((m) => m.key === form.metalKey);
  if (!metal) errors.metalKey = ['Choose the metal and ion.'];
  const quantity = read('quantity', form.quantity, 'Quantity', 'count');
  const minimum = read('minimumThickness', form.minimumThickness, 'Minimum thickness', 'positive');
  const cd = read('currentDensity', form.currentDensity, 'Current density', 'positive');
  const efficiency = read('efficiencyPct', form.efficiencyPct, 'Cathode efficiency', 'percent');
  const ratio = read('distributionRatio', form.distributionRatio, 'Distribution ratio', 'fraction', true);
  const partsPerLoad = read('partsPerLoad', form.partsPerLoad, 'Parts per load', 'count');
  const volts = read('tankVolts', form.tankVolts, 'Tank voltage', 'positive');
  const maxA = read('rectifierMaxA', form.rectifierMaxA, 'Rectifier maximum current', 'positive');
  const rectEff = read('rectifierEfficiencyPct', form.rectifierEfficiencyPct, 'Rectifier efficiency', 'percent');
  const dragOut = read('dragOut', form.dragOut, 'Drag-out', 'nonNegative');
  const bathMetal = read('bathMetal', form.bathMetal, 'Bath metal', 'nonNegative');
  const insoluble = form.anodes === 'insoluble';
  const anodeLoss = insoluble ? 0 : read('anodeLossPct', form.anodeLossPct, 'Anode loss', 'percentOrZero', true);
  const hardness = read('hardnessHrc', form.hardnessHrc, 'Hardness', 'nonNegative', true);
  const tensile = read('tensileMpa', form.tensileMpa, 'Tensile strength', 'positive', true);
  const salt = form.replenishmentSalt.trim();
  if (insoluble && salt === '') errors.replenishmentSalt = ['Enter the salt that replaces the metal, e.g. CrO3.'];

  const cdAdm2 = cd === null ? null : storedIn(errors, 'currentDensity', cd, u.currentDensity);
  const bathGPerL = bathMetal === null ? null : storedIn(errors, 'bathMetal', bathMetal, u.concentration);
  const minimumUm = minimum === null ? null : storedIn(errors, 'minimumThickness', minimum, u.thickness);
  if (Object.keys(errors).length > 0 || !metal || !geometry) return { input: null, geometry, fieldErrors: errors };
  const process: CalculationInput['process'] = {
    element: metal.element,
    charge: metal.charge,
    currentDensityAdm2: cdAdm2!,
    efficiency: efficiency! / 100,
    loading: form.loading,
    ...(ratio === undefined ? {} : { distributionRatio: ratio! }),
    partsPerLoad: partsPerLoad!,
    tankVolts: volts!,
    rectifierMaxA: maxA!,
    rectifierEfficiency: rectEff! / 100,
    dragOutLPerM2: dragOutToStorage(dragOut!, u.dragOut),
    bathMetalGPerL: bathGPerL!,
    anodes: form.anodes,
    anodeLossPercent: anodeLoss ?? 0,
    ...(insoluble ? { replenishmentSalt: salt } : {}),
  };
  const input: CalculationInput = {
    version: CALCULATION_VERSION,
    geometry,
    substrate: form.substrate,
    hardnessHrc: hardness ?? null,
    tensileMpa: tensile ?? null,
    quantity: quantity!,
    minimumThicknessUm: minimumUm!,
    process,
    finishId: form.finishId || null,
    contact: form.contactMaterial ? { material: form.contactMaterial as NonNullable<CalculationInput['contact']>['material'], environment: form.environment } : null,
  };
  return { input, geometry, fieldErrors: errors };
}
