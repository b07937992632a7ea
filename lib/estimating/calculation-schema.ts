// The stored form of a workbench calculation's input (calculations.input): every value in the
// engine's storage units (mm for dimensions, dm², µm, A/dm², g/L, L/m²). zod checks the shape and
// types only; ranges are the engine's to judge, so its messages name the field. Pure.
import { z } from 'zod';
import { CONTACT_LIMITS_V, GALVANIC_MATERIALS, SUBSTRATES, type GalvanicMaterial, type ServiceEnvironment, type SubstrateId } from '@/lib/plating';

export const CALCULATION_VERSION = 1;

const num = z.number();
const flag = z.boolean().optional();

const shapeSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('block'), lengthMm: num, widthMm: num, heightMm: num }),
  z.object({
    kind: z.literal('plate-with-holes'),
    lengthMm: num,
    widthMm: num,
    thicknessMm: num,
    holes: z.array(z.object({ diameterMm: num, count: num })).max(50).readonly(),
  }),
  z.object({ kind: z.literal('cylinder'), diameterMm: num, lengthMm: num, includeEnds: flag }),
  z.object({ kind: z.literal('tube'), outerDiameterMm: num, innerDiameterMm: num, lengthMm: num, includeBore: flag, includeEnds: flag }),
  z.object({ kind: z.literal('sphere'), diameterMm: num }),
  z.object({ kind: z.literal('frustum'), baseDiameterMm: num, topDiameterMm: num, heightMm: num, includeBase: flag, includeTop: flag }),
]);

// An STL is measured in the browser (the file never leaves it); its figures are inputs here.
export const stlGeometrySchema = z.object({
  kind: z.literal('stl'),
  fileName: z.string().max(255),
  unit: z.enum(['mm', 'in']),
  triangleCount: z.number().int().nonnegative(),
  areaDm2: num,
  volumeCm3: num,
  boundingBoxMm: z.tuple([num, num, num]),
});

export const geometrySchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('area'), areaDm2: num }),
  z.object({ kind: z.literal('shape'), shape: shapeSchema }),
  stlGeometrySchema,
]);

export const processSchema = z.object({
  element: z.string().max(4),
  charge: z.number().int(),
  currentDensityAdm2: num,
  efficiency: num,
  loading: z.enum(['rack', 'barrel']),
  distributionRatio: num.optional(),
  partsPerLoad: num,
  tankVolts: num,
  rectifierMaxA: num,
  rectifierEfficiency: num,
  dragOutLPerM2: num,
  bathMetalGPerL: num,
  anodes: z.enum(['soluble', 'insoluble']),
  anodeLossPercent: num.optional(),
  replenishmentSalt: z.string().max(60).optional(),
});

const SUBSTRATE_IDS = Object.keys(SUBSTRATES) as [SubstrateId, ...SubstrateId[]];
export const GALVANIC_IDS = Object.keys(GALVANIC_MATERIALS) as [GalvanicMaterial, ...GalvanicMaterial[]];
export const ENVIRONMENTS = Object.keys(CONTACT_LIMITS_V) as [ServiceEnvironment, ...ServiceEnvironment[]];

export const calculationInputSchema = z.object({
  version: z.literal(CALCULATION_VERSION),
  geometry: geometrySchema,
  substrate: z.enum(SUBSTRATE_IDS),
  hardnessHrc: num.nullable(),
  tensileMpa: num.nullable(),
  quantity: num,
  minimumThicknessUm: num,
  process: processSchema,
  finishId: z.uuid().nullable(),
  // A second part the finished part will touch in service, for the contact check.
  contact: z.object({ material: z.enum(GALVANIC_IDS), environment: z.enum(ENVIRONMENTS) }).nullable(),
});

export type CalculationInput = z.infer<typeof calculationInputSchema>;
export type Geometry = z.infer<typeof geometrySchema>;
export type StlGeometry = z.infer<typeof stlGeometrySchema>;
