// Part area from a simple shape: the form's fields for each shape, entered in mm or inches, and
// the engine's area functions (lib/plating/area.ts). Pure, so the form can show the area as the
// estimator types and the server can recompute it on save.
import { convert, measureShape, PlatingInputError, type Shape, type ShapeMeasure } from '@/lib/plating';

export type LengthUnit = 'mm' | 'in';
export const LENGTH_UNITS: readonly { value: LengthUnit; label: string }[] = [
  { value: 'mm', label: 'millimetres (mm)' },
  { value: 'in', label: 'inches (in)' },
];

export type ShapeKind = Shape['kind'];
type Dim = { key: string; label: string; isCount?: boolean; mayBeZero?: boolean };
type Flag = { key: string; label: string };

export const SHAPES: Record<ShapeKind, { label: string; formula: string; dims: readonly Dim[]; flags: readonly Flag[] }> = {
  block: {
    label: 'Block or flat bar',
    formula: 'A = 2(LW + LH + WH)',
    dims: [{ key: 'lengthMm', label: 'Length' }, { key: 'widthMm', label: 'Width' }, { key: 'heightMm', label: 'Height' }],
    flags: [],
  },
  'plate-with-holes': {
    label: 'Plate with through holes',
    formula: 'A = 2(LW − n·πd²/4) + 2T(L + W) + n·πdT',
    dims: [
      { key: 'lengthMm', label: 'Length' },
      { key: 'widthMm', label: 'Width' },
      { key: 'thicknessMm', label: 'Thickness' },
      { key: 'holeDiameterMm', label: 'Hole diameter' },
      { key: 'holeCount', label: 'Number of holes', isCount: true },
    ],
    flags: [],
  },
  cylinder: {
    label: 'Round bar or pin',
    formula: 'A = πDL (+ 2·πD²/4 for the ends)',
    dims: [{ key: 'diameterMm', label: 'Diameter' }, { key: 'lengthMm', label: 'Length' }],
    flags: [{ key: 'includeEnds', label: 'Include both ends' }],
  },
  tube: {
    label: 'Tube',
    formula: 'A = πD·L (+ πd·L bore) (+ 2·π(D² − d²)/4 ends)',
    dims: [{ key: 'outerDiameterMm', label: 'Outside diameter' }, { key: 'innerDiameterMm', label: 'Inside diameter' }, { key: 'lengthMm', label: 'Length' }],
    flags: [{ key: 'includeBore', label: 'Include the bore' }, { key: 'includeEnds', label: 'Include both ends' }],
  },
  sphere: { label: 'Ball', formula: 'A = πD²', dims: [{ key: 'diameterMm', label: 'Diameter' }], flags: [] },
  frustum: {
    label: 'Cone or truncated cone',
    formula: 'A = π(R + r)·√((R − r)² + H²) (+ base and top discs)',
    dims: [{ key: 'baseDiameterMm', label: 'Base diameter' }, { key: 'topDiameterMm', label: 'Top diameter (0 for a cone)', mayBeZero: true }, { key: 'heightMm', label: 'Height' }],
    flags: [{ key: 'includeBase', label: 'Include the base' }, { key: 'includeTop', label: 'Include the top' }],
  },
};

export function isShapeKind(v: string): v is ShapeKind {
  return Object.hasOwn(SHAPES, v);
}

/** A length typed in `unit`, in mm (1 in = 1000 mil; the factor lives in lib/plating/units.ts). */
export function lengthToMm(value: number, unit: LengthUnit): number {
  return unit === 'mm' ? value : convert(value * 1000, 'mil', 'mm');
}

export type ShapeEntry = { kind: ShapeKind; unit: LengthUnit; dims: Record<string, string>; flags: Record<string, boolean> };
export type ShapeOutcome =
  | { ok: true; shape: Shape; measure: ShapeMeasure }
  | { ok: false; fieldErrors: Record<string, string[]> };

/** Form field name of a shape dimension or flag. */
export const shapeField = (key: string) => `dim_${key}`;

function readDims(entry: ShapeEntry): { values: Record<string, number>; errors: Record<string, string[]> } {
  const values: Record<string, number> = {};
  const errors: Record<string, string[]> = {};
  for (const d of SHAPES[entry.kind].dims) {
    const text = (entry.dims[d.key] ?? '').trim();
    const n = Number(text);
    const unitWord = d.isCount ? '' : ` in ${entry.unit}`;
    if (text === '' || !Number.isFinite(n)) errors[shapeField(d.key)] = [`Enter the ${d.label.toLowerCase()}${unitWord}.`];
    else if (d.isCount && (!Number.isInteger(n) || n < 0)) errors[shapeField(d.key)] = ['Enter a whole number of holes (0 or more).'];
    else if (!d.isCount && (n < 0 || (n === 0 && !d.mayBeZero))) errors[shapeField(d.key)] = [`The ${d.label.toLowerCase()} must be more than 0.`];
    else values[d.key] = d.isCount ? n : lengthToMm(n, entry.unit);
  }
  return { values, errors };
}

/** Area and volume of the shape the estimator described; field errors for anything missing or impossible. */
export function measureShapeEntry(entry: ShapeEntry): ShapeOutcome {
  const { values, errors } = readDims(entry);
  if (Object.keys(errors).length) return { ok: false, fieldErrors: errors };
  const f = (k: string) => entry.flags[k] ?? false;
  const shape: Shape =
    entry.kind === 'plate-with-holes'
      ? { kind: entry.kind, lengthMm: values.lengthMm!, widthMm: values.widthMm!, thicknessMm: values.thicknessMm!, holes: values.holeCount! > 0 ? [{ diameterMm: values.holeDiameterMm!, count: values.holeCount! }] : [] }
      : entry.kind === 'cylinder'
        ? { kind: 'cylinder', diameterMm: values.diameterMm!, lengthMm: values.lengthMm!, includeEnds: f('includeEnds') }
        : entry.kind === 'tube'
          ? { kind: 'tube', outerDiameterMm: values.outerDiameterMm!, innerDiameterMm: values.innerDiameterMm!, lengthMm: values.lengthMm!, includeBore: f('includeBore'), includeEnds: f('includeEnds') }
          : entry.kind === 'frustum'
            ? { kind: 'frustum', baseDiameterMm: values.baseDiameterMm!, topDiameterMm: values.topDiameterMm!, heightMm: values.heightMm!, includeBase: f('includeBase'), includeTop: f('includeTop') }
            : entry.kind === 'sphere'
              ? { kind: 'sphere', diameterMm: values.diameterMm! }
              : { kind: 'block', lengthMm: values.lengthMm!, widthMm: values.widthMm!, heightMm: values.heightMm! };
  try {
    return { ok: true, shape, measure: measureShape(shape) };
  } catch (e) {
    if (!(e instanceof PlatingInputError)) throw e;
    const key = e.field.startsWith('holes') ? (e.field.endsWith('count') ? 'holeCount' : 'holeDiameterMm') : e.field;
    return { ok: false, fieldErrors: { [shapeField(key)]: [e.message] } };
  }
}
