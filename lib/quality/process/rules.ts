// The process families' own lot records and how each is judged. Pure: the form, the server and
// the certificate read the same verdict. Acceptance limits come from the customer's specification
// and are entered with the result; nothing here invents a limit.
import { z } from 'zod';
import type { ProcessRecordKind } from '@/db/types';
import { VERIFICATION_TESTS } from '@/lib/families/passivation';

export const PROCESS_RECORD_LABELS: Record<ProcessRecordKind, string> = {
  seal_test: 'Seal quality test',
  phosphorus_content: 'Phosphorus content',
  passivation_lot: 'Passivation conditions for the lot',
  passivation_test: 'Passivation verification test',
  salt_spray: 'Salt-spray test (ASTM B117)',
};

/** Seal tests: the unit of each method's result; a lower result is the better seal in all three. */
export const SEAL_METHODS = {
  dye_spot: { label: 'Dye-spot test (ASTM B136, ISO 2143)', unit: 'rating' },
  acid_dissolution: { label: 'Acid dissolution mass loss (ASTM B680, ISO 3210)', unit: 'mg/dm²' },
  admittance: { label: 'Admittance (ISO 2931)', unit: 'µS' },
} as const;

export const PHOSPHORUS_METHODS = {
  xrf: 'X-ray fluorescence',
  icp: 'Wet chemistry / ICP on a stripped deposit',
  edx: 'Energy-dispersive X-ray (EDX)',
} as const;

const num = (what: string, opts: { min?: number; max?: number } = {}) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? v.trim().replace(',', '.') : v),
    z.coerce.number({ error: `Enter ${what}.` }).finite(`Enter ${what}.`).min(opts.min ?? 0, `Enter ${what} of at least ${opts.min ?? 0}.`).max(opts.max ?? 1e6, `Enter ${what} of at most ${opts.max ?? 1e6}.`),
  );
const passed = z.preprocess((v) => (v === 'pass' ? true : v === 'fail' ? false : v), z.boolean({ error: 'Say whether the parts passed.' }));

export const processRecordSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('seal_test'),
    workOrderId: z.uuid(),
    method: z.enum(Object.keys(SEAL_METHODS) as [keyof typeof SEAL_METHODS, ...(keyof typeof SEAL_METHODS)[]], { error: 'Choose the seal test.' }),
    result: num('the result'),
    limit: num('the specification’s limit'),
    notes: z.string().trim().max(1000).default(''),
  }),
  z.object({
    kind: z.literal('phosphorus_content'),
    workOrderId: z.uuid(),
    method: z.enum(Object.keys(PHOSPHORUS_METHODS) as [keyof typeof PHOSPHORUS_METHODS, ...(keyof typeof PHOSPHORUS_METHODS)[]], { error: 'Choose how it was measured.' }),
    phosphorusWtPct: num('the phosphorus content', { max: 15 }),
    minPct: num('the lowest phosphorus allowed', { max: 15 }),
    maxPct: num('the highest phosphorus allowed', { max: 15 }),
    notes: z.string().trim().max(1000).default(''),
  }).refine((v) => v.minPct <= v.maxPct, { path: ['maxPct'], message: 'The highest must be at least the lowest.' }),
  z.object({
    kind: z.literal('passivation_test'),
    workOrderId: z.uuid(),
    method: z.enum(VERIFICATION_TESTS.map((t) => t.id) as [string, ...string[]], { error: 'Choose the verification test.' }),
    passed,
    notes: z.string().trim().max(1000).default(''),
  }),
  z.object({
    kind: z.literal('salt_spray'),
    workOrderId: z.uuid(),
    method: z.literal('astm_b117').default('astm_b117'),
    hours: num('the hours in the cabinet', { min: 1, max: 10000 }),
    requiredHours: num('the hours the specification asks', { min: 1, max: 10000 }),
    passed,
    notes: z.string().trim().max(1000).default(''),
  }),
]);
export type ProcessRecordInput = z.infer<typeof processRecordSchema>;

export const voidProcessRecordSchema = z.object({
  workOrderId: z.uuid(),
  recordId: z.uuid({ error: 'Choose the record.' }),
  reason: z.string({ error: 'Say why the record is void.' }).trim().min(3, 'Say why the record is void (at least 3 characters).').max(500, 'Use at most 500 characters.'),
});

export type JudgedRecord = { method: string; values: Record<string, number | string>; verdict: 'pass' | 'fail'; reasons: string[] };

const n = (v: number) => String(Math.round(v * 1000) / 1000);

export function judgeProcessRecord(input: ProcessRecordInput): JudgedRecord {
  switch (input.kind) {
    case 'seal_test': {
      const m = SEAL_METHODS[input.method];
      const ok = input.result <= input.limit;
      return {
        method: input.method,
        values: { result: input.result, limit: input.limit, unit: m.unit },
        verdict: ok ? 'pass' : 'fail',
        reasons: ok ? [] : [`${m.label}: ${n(input.result)} ${m.unit} is above the limit of ${n(input.limit)} ${m.unit}.`],
      };
    }
    case 'phosphorus_content': {
      const ok = input.phosphorusWtPct >= input.minPct && input.phosphorusWtPct <= input.maxPct;
      return {
        method: input.method,
        values: { phosphorusWtPct: input.phosphorusWtPct, minPct: input.minPct, maxPct: input.maxPct },
        verdict: ok ? 'pass' : 'fail',
        reasons: ok ? [] : [`${n(input.phosphorusWtPct)} % phosphorus is outside ${n(input.minPct)}–${n(input.maxPct)} %.`],
      };
    }
    case 'passivation_test': {
      const test = VERIFICATION_TESTS.find((t) => t.id === input.method)!;
      return {
        method: input.method,
        values: { result: input.passed ? 'pass' : 'fail' },
        verdict: input.passed ? 'pass' : 'fail',
        reasons: input.passed ? [] : [`The ${test.label.toLowerCase()} test showed free iron (rust or copper deposits): the lot fails.`],
      };
    }
    case 'salt_spray': {
      const reasons = [
        ...(input.hours < input.requiredHours ? [`${n(input.hours)} h in the cabinet is less than the ${n(input.requiredHours)} h the specification asks.`] : []),
        ...(input.passed ? [] : [`White corrosion appeared within ${n(input.hours)} h.`]),
      ];
      return { method: input.method, values: { hours: input.hours, requiredHours: input.requiredHours }, verdict: reasons.length ? 'fail' : 'pass', reasons };
    }
  }
}

/** A record's result in a line, for the lot page and the certificate. */
export function describeRecord(r: { kind: ProcessRecordKind; method: string; values: Record<string, number | string>; verdict: 'pass' | 'fail' }): string {
  const v = r.values;
  switch (r.kind) {
    case 'seal_test': {
      const m = SEAL_METHODS[r.method as keyof typeof SEAL_METHODS];
      return `${m?.label ?? r.method}: ${v.result} ${v.unit} (limit ${v.limit} ${v.unit})`;
    }
    case 'phosphorus_content':
      return `${PHOSPHORUS_METHODS[r.method as keyof typeof PHOSPHORUS_METHODS] ?? r.method}: ${v.phosphorusWtPct} % P (allowed ${v.minPct}–${v.maxPct} %)`;
    case 'passivation_test':
      return `${VERIFICATION_TESTS.find((t) => t.id === r.method)?.label ?? r.method} test: ${r.verdict === 'pass' ? 'no free iron found' : 'free iron found'}`;
    case 'salt_spray':
      return `ASTM B117 neutral salt spray: ${v.hours} h (${v.requiredHours} h required), ${r.verdict === 'pass' ? 'no white corrosion' : 'failed'}`;
    case 'passivation_lot':
      return 'Conditions recorded with each run';
  }
}
