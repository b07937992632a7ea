// POST /api/v1/plating/estimate: the request (values with units), its conversion to the engine's
// storage units, and the response (figures with units, in storage units and in the requested
// system). Bad input becomes AppError('BAD_INPUT') naming each field as a JSON path. Pure.
import { z } from 'zod';
import {
  DISTRIBUTION_RATIO_DEFAULTS,
  PLATING_METALS,
  PlatingInputError,
  STORAGE_UNIT,
  toStorage,
  unitInfo,
  unitsOf,
  type JobProcess,
  type Quantity,
  type UnitId,
  type UnitOf,
  type UnitSystem,
} from '@/lib/plating';
import { AppError } from '@/lib/errors';
import { DEFAULT_DRAG_OUT_L_PER_M2, DEFAULT_RECTIFIER_EFFICIENCY } from '@/lib/quotes/process';
import { estimateJobChecked, fieldErrorsOf } from './calculation';
import { DRAG_OUT_UNITS, dragOutToStorage } from './display-units';
import { figureSet, SENSITIVE_KEYS, type FigureSet } from './figures';
import { DEFAULT_TANK_VOLTS } from './process-library';

// zod's own message would echo a non-finite input back ("received Infinity"); say it in words.
function kindOf(input: unknown): string {
  if (typeof input === 'number') return 'a number out of range';
  if (input === null) return 'null';
  if (Array.isArray(input)) return 'a list';
  return typeof input === 'string' ? 'text' : `a ${typeof input}`;
}
const number = () =>
  z.number({
    error: (iss) => {
      if (iss.input === undefined) return 'Required: a number.';
      if (typeof iss.input === 'number' && Number.isFinite(iss.input)) {
        return iss.code === 'invalid_type' ? `Expected a whole number, got ${iss.input}.` : `${iss.input} is outside the range of whole numbers this accepts.`;
      }
      return `Expected a finite number, got ${kindOf(iss.input)}.`;
    },
  });

function measured<Q extends Quantity>(quantity: Q) {
  const units = unitsOf(quantity) as [UnitOf<Q>, ...UnitOf<Q>[]];
  return z.strictObject(
    { value: number(), unit: z.enum(units) },
    {
      error: (iss) => {
        if (iss.code !== 'invalid_type') return undefined;
        const shape = `{ "value": a number, "unit": one of ${units.join(', ')} }`;
        return iss.input === undefined ? `Required: ${shape}.` : `Expected ${shape}, got ${kindOf(iss.input)}.`;
      },
    },
  );
}

const ELEMENTS = [...new Set(PLATING_METALS.map((m) => m.element))] as [string, ...string[]];

export const estimateRequestSchema = z.strictObject({
  area: measured('area'), // per part
  thickness: measured('thickness'), // the required minimum on significant surfaces
  currentDensity: measured('currentDensity'),
  element: z.enum(ELEMENTS),
  charge: number().int(),
  efficiency: number(), // cathode current efficiency, a fraction in (0, 1]
  quantity: number().int().default(1),
  loading: z.enum(['rack', 'barrel']).default('rack'),
  distributionRatio: number().optional(), // minimum ÷ average; default by loading
  partsPerLoad: number().int().optional(), // default: the whole lot in one load
  rectifierMaxA: number().optional(), // default: no rectifier limit
  tankVolts: number().default(DEFAULT_TANK_VOLTS),
  rectifierEfficiency: number().default(DEFAULT_RECTIFIER_EFFICIENCY),
  dragOut: z.strictObject({ value: number(), unit: z.enum(DRAG_OUT_UNITS) }).optional(),
  bathMetal: measured('concentration').optional(),
  anodes: z.enum(['soluble', 'insoluble']).default('soluble'),
  anodeLossPercent: number().default(0),
  replenishmentSalt: z.string().min(1).max(60).optional(),
  system: z.enum(['metric', 'us']).optional(), // display system; default the caller's preference
});

export type EstimateRequest = z.input<typeof estimateRequestSchema>;

// Engine field → the request's JSON path, so a 400 names what the caller sent.
const REQUEST_PATHS: Readonly<Record<string, string>> = {
  areaPerPartDm2: 'area.value',
  areaDm2: 'area.value',
  minimumThicknessUm: 'thickness.value',
  thicknessUm: 'thickness.value',
  depositMassG: 'thickness.value',
  currentDensityAdm2: 'currentDensity.value',
  dragOutLPerM2: 'dragOut.value',
  bathMetalGPerL: 'bathMetal.value',
  formula: 'replenishmentSalt',
  ampHours: 'quantity',
  ...Object.fromEntries(
    ['element', 'charge', 'efficiency', 'quantity', 'loading', 'distributionRatio', 'partsPerLoad', 'rectifierMaxA', 'tankVolts', 'rectifierEfficiency', 'anodes', 'anodeLossPercent'].map((k) => [k, k]),
  ),
};

function zodFields(error: z.ZodError): Record<string, string[]> {
  // A Map, because a request may name keys such as "valueOf" that a plain object already has.
  const out = new Map<string, string[]>();
  for (const issue of error.issues) {
    // An unknown key is named by the key itself, not by the object that holds it.
    const keys = issue.code === 'unrecognized_keys' ? issue.keys.map((k) => [...issue.path, k].join('.')) : [issue.path.join('.') || 'body'];
    for (const key of keys) out.set(key, [...(out.get(key) ?? []), issue.message]);
  }
  return Object.fromEntries(out);
}

function badInput(fields: Record<string, string[]>, message?: string): AppError {
  const names = Object.keys(fields).join(', ');
  return new AppError('BAD_INPUT', message ?? `Some values are missing or not valid: ${names}.`, fields);
}

// Valid inputs can still make an unrepresentable display value (1e308 A/dm² in A/ft²).
function requireFinite(set: FigureSet, where: string): FigureSet {
  for (const [key, m] of Object.entries(set)) {
    if (!Number.isFinite(m.value)) {
      throw badInput({ [where]: [`${key} would be out of range in these units; check the inputs' scale.`] });
    }
  }
  return set;
}

// A value so large that converting it overflows (1e308 ft² → dm²) is refused in the caller's words.
function stored(m: { value: number; unit: UnitId }, path: string): number {
  const v = toStorage(m.value, m.unit);
  if (!Number.isFinite(v)) throw badInput({ [`${path}.value`]: [`${m.value} ${m.unit} is too large to convert to ${STORAGE_UNIT[unitInfo(m.unit).quantity]}.`] });
  return v;
}

export type EstimateResponse = {
  system: UnitSystem;
  metal: { key: string; name: string; ion: string };
  assumptions: Record<string, number | string | boolean | null>;
  results: FigureSet;
  display: FigureSet;
  lowerEfficiency: { efficiency: number; results: FigureSet; display: FigureSet } | null;
  cautions: string[];
};

export function estimateFromRequest(body: unknown, preferred: UnitSystem): EstimateResponse {
  const parsed = estimateRequestSchema.safeParse(body);
  if (!parsed.success) throw badInput(zodFields(parsed.error));
  const r = parsed.data;
  const system = r.system ?? preferred;
  try {
    const area = stored(r.area, 'area');
    const process: JobProcess = {
      element: r.element,
      charge: r.charge,
      currentDensityAdm2: stored(r.currentDensity, 'currentDensity'),
      efficiency: r.efficiency,
      loading: r.loading,
      distributionRatio: r.distributionRatio,
      partsPerLoad: r.partsPerLoad ?? r.quantity,
      // No limit given: the largest number there is, so the load is set by capacity alone.
      rectifierMaxA: r.rectifierMaxA ?? Number.MAX_VALUE,
      tankVolts: r.tankVolts,
      rectifierEfficiency: r.rectifierEfficiency,
      dragOutLPerM2: r.dragOut ? dragOutToStorage(r.dragOut.value, r.dragOut.unit) : DEFAULT_DRAG_OUT_L_PER_M2[r.loading],
      bathMetalGPerL: r.bathMetal ? stored(r.bathMetal, 'bathMetal') : 0,
      anodes: r.anodes,
      anodeLossPercent: r.anodeLossPercent,
      replenishmentSalt: r.replenishmentSalt,
    };
    const minimumThicknessUm = stored(r.thickness, 'thickness');
    const e = estimateJobChecked({ areaPerPartDm2: area, quantity: r.quantity, minimumThicknessUm, process });
    const lower = e.lowerEfficiency;
    return {
      system,
      metal: e.metal,
      assumptions: {
        loading: r.loading,
        distributionRatio: e.distributionRatio,
        distributionRatioIsDefault: e.distributionRatioIsDefault,
        partsPerLoad: process.partsPerLoad,
        loadLimitedBy: e.loadLimitedBy,
        rectifierMaxA: r.rectifierMaxA ?? null,
        tankVolts: process.tankVolts,
        rectifierEfficiency: process.rectifierEfficiency,
        dragOutLPerM2: process.dragOutLPerM2,
        bathMetalGPerL: process.bathMetalGPerL,
        anodes: r.anodes,
      },
      results: requireFinite(figureSet(e, e.nominal, 'storage'), 'results'),
      display: requireFinite(figureSet(e, e.nominal, system), 'display'),
      lowerEfficiency: lower
        ? {
            efficiency: lower.efficiency,
            results: requireFinite(figureSet(e, lower, 'storage', SENSITIVE_KEYS), 'lowerEfficiency'),
            display: requireFinite(figureSet(e, lower, system, SENSITIVE_KEYS), 'lowerEfficiency'),
          }
        : null,
      cautions: e.cautions,
    };
  } catch (err) {
    if (err instanceof PlatingInputError) throw badInput(fieldErrorsOf(err, REQUEST_PATHS, 'body'), err.message);
    throw err;
  }
}
