import { PlatingInputError } from './errors';
import { requireNonNegative, requireNonNegativeInteger, requirePositive } from './validate';

// Surface area and volume of simple part shapes. Inputs in mm; area out in dm² (the storage unit
// of area), volume in cm³ (to weigh the part with a substrate density).

export type ShapeMeasure = { areaDm2: number; volumeCm3: number };

const MM2_PER_DM2 = 10_000;
const MM3_PER_CM3 = 1_000;

function measure(areaMm2: number, volumeMm3: number): ShapeMeasure {
  return { areaDm2: areaMm2 / MM2_PER_DM2, volumeCm3: volumeMm3 / MM3_PER_CM3 };
}

const circleArea = (diameter: number) => (Math.PI * diameter * diameter) / 4;
const dim = (field: string, label: string, v: number) => requirePositive(field, `${label} (mm)`, v);

export type BlockInput = { lengthMm: number; widthMm: number; heightMm: number };

export function blockArea(input: BlockInput): ShapeMeasure {
  const l = dim('lengthMm', 'Length', input.lengthMm);
  const w = dim('widthMm', 'Width', input.widthMm);
  const h = dim('heightMm', 'Height', input.heightMm);
  return measure(2 * (l * w + l * h + w * h), l * w * h);
}

export type HoleSet = { diameterMm: number; count: number };
export type PlateWithHolesInput = {
  lengthMm: number;
  widthMm: number;
  thicknessMm: number;
  holes: readonly HoleSet[];
};

// Through holes: each opening is taken off both faces and its bore wall (π·d·t) is added.
export function plateWithHolesArea(input: PlateWithHolesInput): ShapeMeasure {
  const l = dim('lengthMm', 'Plate length', input.lengthMm);
  const w = dim('widthMm', 'Plate width', input.widthMm);
  const t = dim('thicknessMm', 'Plate thickness', input.thicknessMm);
  let openings = 0;
  let boreWalls = 0;
  (input.holes ?? []).forEach((hole, i) => {
    const d = dim(`holes.${i}.diameterMm`, 'Hole diameter', hole.diameterMm);
    const n = requireNonNegativeInteger(`holes.${i}.count`, 'Number of holes', hole.count);
    if (d >= Math.min(l, w)) {
      throw new PlatingInputError(
        `holes.${i}.diameterMm`,
        `A ${d} mm hole does not fit in a ${l} × ${w} mm plate.`,
      );
    }
    openings += n * circleArea(d);
    boreWalls += n * Math.PI * d * t;
  });
  if (openings >= l * w) {
    throw new PlatingInputError(
      'holes',
      `The holes (${openings.toFixed(1)} mm² of openings) cover more than the plate face (${l * w} mm²).`,
    );
  }
  const faces = 2 * (l * w - openings);
  const edges = 2 * t * (l + w);
  return measure(faces + edges + boreWalls, (l * w - openings) * t);
}

export type CylinderInput = { diameterMm: number; lengthMm: number; includeEnds?: boolean };

export function cylinderArea(input: CylinderInput): ShapeMeasure {
  const d = dim('diameterMm', 'Diameter', input.diameterMm);
  const len = dim('lengthMm', 'Length', input.lengthMm);
  const ends = (input.includeEnds ?? true) ? 2 * circleArea(d) : 0;
  return measure(Math.PI * d * len + ends, circleArea(d) * len);
}

export type TubeInput = {
  outerDiameterMm: number;
  innerDiameterMm: number;
  lengthMm: number;
  includeBore?: boolean; // inside surface; often starved of current, so quoted separately
  includeEnds?: boolean; // the two annular ends
};

export function tubeArea(input: TubeInput): ShapeMeasure {
  const od = dim('outerDiameterMm', 'Outside diameter', input.outerDiameterMm);
  const id = dim('innerDiameterMm', 'Inside diameter', input.innerDiameterMm);
  const len = dim('lengthMm', 'Length', input.lengthMm);
  if (id >= od) {
    throw new PlatingInputError(
      'innerDiameterMm',
      `The inside diameter (${id} mm) must be smaller than the outside diameter (${od} mm).`,
    );
  }
  const annulus = circleArea(od) - circleArea(id);
  const outside = Math.PI * od * len;
  const bore = (input.includeBore ?? true) ? Math.PI * id * len : 0;
  const ends = (input.includeEnds ?? true) ? 2 * annulus : 0;
  return measure(outside + bore + ends, annulus * len);
}

export type SphereInput = { diameterMm: number };

export function sphereArea(input: SphereInput): ShapeMeasure {
  const d = dim('diameterMm', 'Diameter', input.diameterMm);
  return measure(Math.PI * d * d, (Math.PI * d ** 3) / 6);
}

export type FrustumInput = {
  baseDiameterMm: number;
  topDiameterMm: number; // 0 for a full cone
  heightMm: number;
  includeBase?: boolean;
  includeTop?: boolean;
};

export function frustumArea(input: FrustumInput): ShapeMeasure {
  const D = dim('baseDiameterMm', 'Base diameter', input.baseDiameterMm);
  const d = requireNonNegative('topDiameterMm', 'Top diameter (mm)', input.topDiameterMm);
  const h = dim('heightMm', 'Height', input.heightMm);
  const R = D / 2;
  const r = d / 2;
  const slant = Math.hypot(R - r, h);
  const lateral = Math.PI * (R + r) * slant;
  const base = (input.includeBase ?? true) ? circleArea(D) : 0;
  const top = (input.includeTop ?? true) ? circleArea(d) : 0;
  return measure(lateral + base + top, (Math.PI * h * (R * R + R * r + r * r)) / 3);
}

export type Shape =
  | ({ kind: 'block' } & BlockInput)
  | ({ kind: 'plate-with-holes' } & PlateWithHolesInput)
  | ({ kind: 'cylinder' } & CylinderInput)
  | ({ kind: 'tube' } & TubeInput)
  | ({ kind: 'sphere' } & SphereInput)
  | ({ kind: 'frustum' } & FrustumInput);

export function measureShape(shape: Shape): ShapeMeasure {
  switch (shape.kind) {
    case 'block':
      return blockArea(shape);
    case 'plate-with-holes':
      return plateWithHolesArea(shape);
    case 'cylinder':
      return cylinderArea(shape);
    case 'tube':
      return tubeArea(shape);
    case 'sphere':
      return sphereArea(shape);
    case 'frustum':
      return frustumArea(shape);
    default: {
      const kind = (shape as { kind?: unknown }).kind;
      throw new PlatingInputError('kind', `Unknown shape "${String(kind)}".`);
    }
  }
}

// Weight of a part from its volume and the substrate density.
export function partMassG(volumeCm3: number, densityGPerCm3: number): number {
  const v = requirePositive('volumeCm3', 'Volume (cm³)', volumeCm3);
  const rho = requirePositive('densityGPerCm3', 'Density (g/cm³)', densityGPerCm3);
  return v * rho;
}
