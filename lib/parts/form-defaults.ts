// The part form's starting values: a new part, or a saved one shown in the user's units with the
// area method it was measured by. Pure.
import { LENGTH_UNIT } from '@/lib/estimating/display-units';
import { plainNumber } from '@/lib/records/fields';
import { displayUnit, fromStorage, type SubstrateId, type UnitSystem } from '@/lib/plating';
import { isShapeKind, type LengthUnit, type ShapeKind } from './shapes';

type Saved = {
  id: string;
  customer_id: string;
  part_number: string;
  revision: string;
  description: string;
  substrate: string;
  tensile_mpa: number | null;
  hardness_hrc: number | null;
  corrosivity_category: string | null;
  design_life_years: number | null;
  size_tolerance_um: number | null;
  area_dm2: number;
  weight_g: number | null;
  drawing_file_id: string | null;
  drawing_name: string | null;
  stl_file_id: string | null;
  stl_name: string | null;
  calculation_input: unknown;
};

const text = (n: number | null) => (n === null ? '' : String(n));
const shown = (n: number) => plainNumber(n);

export function partFormDefaults(part: Saved | null, system: UnitSystem, customerId = '') {
  const areaUnit = displayUnit('area', system);
  const massUnit = displayUnit('mass', system);
  const lengthUnit: LengthUnit = LENGTH_UNIT[system];
  const calc = (part?.calculation_input ?? null) as { method?: string; kind?: string; unit?: string; dims?: Record<string, string>; flags?: Record<string, boolean> } | null;
  const shapeKind: ShapeKind = calc?.method === 'shape' && calc.kind && isShapeKind(calc.kind) ? calc.kind : 'block';
  const calcUnit: LengthUnit = calc?.unit === 'in' || calc?.unit === 'mm' ? calc.unit : lengthUnit;
  const method = calc?.method === 'shape' ? 'shape' : calc?.method === 'stl' && part?.stl_file_id ? 'stl' : 'direct';
  return {
    partId: part?.id ?? '',
    customerId: part?.customer_id ?? customerId,
    partNumber: part?.part_number ?? '',
    revision: part?.revision ?? '',
    description: part?.description ?? '',
    substrate: (part?.substrate ?? 'carbon-steel') as SubstrateId,
    tensileMpa: text(part?.tensile_mpa ?? null),
    hardnessHrc: text(part?.hardness_hrc ?? null),
    corrosivityCategory: part?.corrosivity_category ?? '',
    designLifeYears: text(part?.design_life_years ?? null),
    sizeTolerance: part?.size_tolerance_um ? shown(fromStorage(part.size_tolerance_um, system === 'us' ? 'mil' : 'um')) : '',
    sizeToleranceUnit: system === 'us' ? 'mil' : 'um',
    weight: part?.weight_g ? shown(fromStorage(part.weight_g, massUnit)) : '',
    weightUnit: massUnit,
    drawing: { fileId: part?.drawing_file_id ?? '', fileName: part?.drawing_name ?? '' },
    areaMethod: method,
    direct: { area: part ? shown(fromStorage(part.area_dm2, areaUnit)) : '', unit: areaUnit },
    shape: { kind: shapeKind, unit: calcUnit, dims: calc?.method === 'shape' ? (calc.dims ?? {}) : {}, flags: calc?.method === 'shape' ? (calc.flags ?? {}) : {} },
    stl: { fileId: part?.stl_file_id ?? '', fileName: part?.stl_name ?? '', unit: calc?.method === 'stl' ? calcUnit : lengthUnit },
  } as const;
}
