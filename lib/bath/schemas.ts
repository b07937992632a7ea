// Input shapes for bath control: floor entries (JSON, also queued offline on the device) and the
// office forms (FormData text). Safe to import in the browser.
import { z } from 'zod';

export const ENTRY_KEY = z
  .string()
  .min(8, 'The entry key is too short.')
  .max(120, 'The entry key is too long.')
  .regex(/^[A-Za-z0-9_:.-]+$/, 'The entry key has characters it may not have.');

// Entries made offline may reach the server hours later; the time is when the work was done.
const MAX_AGE_MS = 31 * 24 * 3600 * 1000;
const CLOCK_SKEW_MS = 10 * 60 * 1000;
function timeSchema(maxAgeMs: number | null) {
  return z.iso.datetime({ offset: true, message: 'Give the time as an ISO date and time.' }).transform((s, ctx) => {
    const d = new Date(s);
    const now = Date.now();
    if (d.getTime() > now + CLOCK_SKEW_MS) ctx.addIssue({ code: 'custom', message: 'The time is in the future: check the device clock.' });
    if (maxAgeMs !== null && d.getTime() < now - maxAgeMs) ctx.addIssue({ code: 'custom', message: 'Entries older than 31 days go through the lab upload.' });
    return d;
  });
}
export const entryTime = timeSchema(MAX_AGE_MS);
/** A correction keeps the time of the sample it corrects, however old. */
const pastTime = timeSchema(null);

const finite = (label: string) => z.number({ message: `${label} must be a number.` });

export const analysisInputsSchema = z
  .object({
    buretteMl: finite('Burette reading').min(0).max(1000).optional(),
    blankMl: finite('Blank').min(0).max(1000).optional(),
    titrantConcentration: finite('Titrant concentration').positive().max(20).optional(),
    titrantFactor: finite('Titrant factor').min(0.5).max(1.5).optional(),
    reading: finite('Reading').optional(),
    values: z.record(z.string().regex(/^[a-zA-Z][a-zA-Z0-9_]{0,39}$/), finite('Input value')).optional(),
  })
  .strict();

export const analysisEntrySchema = z.object({
  kind: z.literal('analysis'),
  key: ENTRY_KEY,
  tankId: z.uuid('Choose a tank.'),
  analyteId: z.uuid('Choose what was analysed.'),
  inputs: analysisInputsSchema,
  /** The unit a direct reading was entered in when it differs from the method's (°F for °C). */
  entryUnit: z.string().max(20).optional(),
  takenAt: pastTime,
  note: z.string().trim().max(500).default(''),
  supersedesId: z.uuid().optional(),
}).superRefine((v, ctx) => {
  if (!v.supersedesId && v.takenAt.getTime() < Date.now() - MAX_AGE_MS) {
    ctx.addIssue({ code: 'custom', path: ['takenAt'], message: 'Entries older than 31 days go through the lab upload.' });
  }
});

export const ADDITION_ENTRY_UNITS = ['kg', 'L', 'lb', 'gal'] as const;

export const additionEntrySchema = z.object({
  kind: z.literal('addition'),
  key: ENTRY_KEY,
  tankId: z.uuid('Choose a tank.'),
  analyteId: z.uuid().nullish(),
  /** The analysis this addition answers: its id, or its entry key when both were queued offline. */
  analysisId: z.uuid().nullish(),
  analysisKey: ENTRY_KEY.nullish(),
  additionKind: z.enum(['correction', 'amp_hours', 'make_up', 'other']).default('correction'),
  material: z.string().trim().min(1, 'Name what was added.').max(120),
  amount: finite('Amount').positive('The amount must be more than zero.').max(99_999),
  unit: z.enum(ADDITION_ENTRY_UNITS, { message: 'Choose kg, L, lb or gal.' }),
  recommendedAmount: finite('Recommended amount').min(0).nullish(),
  recommendedUnit: z.enum(['kg', 'L']).nullish(),
  reason: z.string().trim().max(500).default(''),
  madeAt: entryTime,
  supersedesId: z.uuid().optional(),
});

export const meterEntrySchema = z.object({
  kind: z.literal('meter'),
  key: ENTRY_KEY,
  tankId: z.uuid('Choose a tank.'),
  ampHours: finite('Meter reading').min(0, 'The meter reading cannot be negative.').max(1e11),
  readAt: entryTime,
  note: z.string().trim().max(500).default(''),
});

export const floorEntrySchema = z.discriminatedUnion('kind', [analysisEntrySchema, additionEntrySchema, meterEntrySchema]);

export type AnalysisEntry = z.infer<typeof analysisEntrySchema>;
export type AdditionEntry = z.infer<typeof additionEntrySchema>;
export type MeterEntry = z.infer<typeof meterEntrySchema>;
export type FloorEntry = z.infer<typeof floorEntrySchema>;
/** What the device queues and sends (times as ISO text). */
export type FloorEntryPayload = z.input<typeof floorEntrySchema>;

// Office forms: FormData gives text; an empty box means "no value".
const optionalNumberText = (label: string) =>
  z
    .string()
    .trim()
    .optional()
    .transform((s, ctx) => {
      if (s === undefined || s === '') return null;
      const n = Number(s);
      if (!/^-?\d+(\.\d+)?$/.test(s) || !Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: `${label} must be a number, e.g. 12.5.` });
        return z.NEVER;
      }
      return n;
    });

export const limitsSchema = z.object({
  analyteId: z.uuid(),
  target: optionalNumberText('Target').refine((v) => v !== null, 'Give a target.'),
  lowerControl: optionalNumberText('Lower control limit'),
  upperControl: optionalNumberText('Upper control limit'),
  lowerSpec: optionalNumberText('Lower specification limit'),
  upperSpec: optionalNumberText('Upper specification limit'),
  frequencyHours: optionalNumberText('Analysis frequency').refine((v) => v !== null && v > 0 && v <= 8760, 'Give hours between analyses (more than 0).'),
  reason: z.string().trim().min(3, 'Say why the limits change (at least 3 characters).').max(500),
});
export type LimitsInput = z.infer<typeof limitsSchema>;

export const acknowledgeSchema = z.object({
  alertId: z.uuid(),
  correctiveAction: z.string().trim().min(3, 'Describe the corrective action taken (at least 3 characters).').max(2000),
});

export const hullCellSchema = z.object({
  tankId: z.uuid(),
  key: ENTRY_KEY,
  currentA: optionalNumberText('Current').refine((v) => v !== null && v > 0 && v <= 20, 'Give the cell current in amperes (more than 0, at most 20).'),
  minutes: optionalNumberText('Minutes').refine((v) => v !== null && v > 0 && v <= 60, 'Give the plating time in minutes (more than 0, at most 60).'),
  notes: z.string().trim().max(2000).default(''),
});
