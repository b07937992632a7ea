import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { db } from '@/db';
import { PLATING_METALS, unitsOf } from '@/lib/plating';
import { REPLENISHMENT_SALTS } from '@/lib/estimating/process-library';
import { postEstimate, signInAs, signOutAll } from './route-session';

vi.mock('next/headers', async () => (await import('./cookie-jar')).nextHeadersStandIn());

beforeAll(() => signInAs('estimator@kestrel-plating.test'));
afterAll(async () => {
  await signOutAll();
  await db.destroy();
});

// JSON cannot carry NaN or Infinity, but a client can still send the text: NaN stays a bare token
// (invalid JSON) and ±Infinity goes as ±1e999, which JSON.parse reads as ±Infinity.
function rawJson(value: unknown): string {
  const marks: string[] = [];
  const text = JSON.stringify(value, (_k, v: unknown) => {
    if (typeof v === 'number' && !Number.isFinite(v)) {
      marks.push(Number.isNaN(v) ? 'NaN' : v > 0 ? '1e999' : '-1e999');
      return `@@${marks.length - 1}@@`;
    }
    return v;
  });
  return (text ?? 'null').replace(/"@@(\d+)@@"/g, (_m, i: string) => marks[Number(i)]!);
}

const weirdNumber = fc.oneof(
  fc.double(), // includes NaN, ±Infinity, −0, subnormals
  fc.constantFrom(1e308, -1e308, 5e-324, 0, -0, 1, 2 ** 53, -(2 ** 53), 1e-300),
  fc.integer(),
);
const weird = fc.oneof(
  weirdNumber,
  fc.string({ unit: 'grapheme', maxLength: 12 }),
  fc.constantFrom(null, true, [], {}, 'Ni', '∞', '１２', '0x10', ' 5 '),
);
const unitOf = (quantity: 'area' | 'thickness' | 'currentDensity' | 'concentration') => fc.constantFrom(...unitsOf(quantity));
const metal = fc.constantFrom(...PLATING_METALS.map((m) => ({ element: m.element, charge: m.charge })));

// A sensible request in any units: most of these should be priced (200).
const validRequest = fc.record(
  {
    area: fc.record({ value: fc.double({ min: 1e-3, max: 1e3, noNaN: true }), unit: unitOf('area') }),
    thickness: fc.record({ value: fc.double({ min: 1e-2, max: 100, noNaN: true }), unit: unitOf('thickness') }),
    currentDensity: fc.record({ value: fc.double({ min: 0.05, max: 50, noNaN: true }), unit: unitOf('currentDensity') }),
    metal,
    efficiency: fc.double({ min: 0.05, max: 1, noNaN: true }),
    quantity: fc.integer({ min: 1, max: 1_000_000 }),
    loading: fc.constantFrom('rack', 'barrel'),
    distributionRatio: fc.double({ min: 0.1, max: 1, noNaN: true }),
    partsPerLoad: fc.integer({ min: 1, max: 10_000 }),
    tankVolts: fc.double({ min: 0.5, max: 24, noNaN: true }),
    bathMetal: fc.record({ value: fc.double({ min: 0, max: 50, noNaN: true }), unit: unitOf('concentration') }),
    anodes: fc.constantFrom('soluble', 'insoluble'),
    system: fc.constantFrom('metric', 'us'),
  },
  { requiredKeys: ['area', 'thickness', 'currentDensity', 'metal', 'efficiency'] },
).map(({ metal: m, ...rest }) => {
  const salt = REPLENISHMENT_SALTS[m.element];
  return { ...rest, element: m.element, charge: m.charge, ...(salt ? { replenishmentSalt: salt } : {}) } as Record<string, unknown>;
});

const FIELDS = ['area', 'area.value', 'area.unit', 'thickness.value', 'thickness.unit', 'currentDensity.value', 'element', 'charge', 'efficiency', 'quantity', 'loading', 'distributionRatio', 'partsPerLoad', 'rectifierMaxA', 'tankVolts', 'rectifierEfficiency', 'bathMetal.value', 'anodes', 'anodeLossPercent', 'replenishmentSalt', 'system', 'extra'];

// The sensible request with up to three values pushed to an extreme or replaced by nonsense.
const request = fc.tuple(validRequest, fc.array(fc.tuple(fc.constantFrom(...FIELDS), weird), { maxLength: 3 })).map(([body, changes]) => {
  const out: Record<string, unknown> = structuredClone(body);
  for (const [path, value] of changes) {
    const [head, tail] = path.split('.') as [string, string | undefined];
    if (tail === undefined) out[head] = value;
    else out[head] = { ...((out[head] as object | undefined) ?? {}), [tail]: value };
  }
  return out;
});

// Every number in a 200 response must be finite, and every figure must carry a unit.
function checkFigures(set: Record<string, { value: unknown; unit: unknown }>): void {
  for (const m of Object.values(set)) {
    expect(typeof m.value === 'number' && Number.isFinite(m.value)).toBe(true);
    expect(typeof m.unit).toBe('string');
  }
}

function checkAnswer(r: { status: number; json: any; text: string }): void {
  expect([200, 400]).toContain(r.status);
  expect(r.text).not.toMatch(/NaN|Infinity/);
  if (r.status === 400) {
    expect(r.json.error.code).toBe('BAD_INPUT');
    const fields = r.json.error.fields as Record<string, string[]> | undefined;
    // Bad JSON has no field to name; everything else names at least one with a reason.
    if (r.json.error.message !== 'The request body is not valid JSON.') {
      expect(Object.keys(fields ?? {}).length).toBeGreaterThan(0);
      for (const reasons of Object.values(fields!)) expect(reasons.every((s) => typeof s === 'string' && s.length > 0)).toBe(true);
    }
    return;
  }
  checkFigures(r.json.results);
  checkFigures(r.json.display);
  if (r.json.lowerEfficiency) {
    checkFigures(r.json.lowerEfficiency.results);
    checkFigures(r.json.lowerEfficiency.display);
  }
}

describe('POST /api/v1/plating/estimate under random input', () => {
  it('answers 200 with finite figures or 400 naming a field, never 500', async () => {
    const tally = { runs: 0, ok: 0, refused: 0 };
    await fc.assert(
      fc.asyncProperty(request, async (body) => {
        const r = await postEstimate(rawJson(body));
        tally.runs++;
        tally[r.status === 200 ? 'ok' : 'refused']++;
        checkAnswer(r);
      }),
      { numRuns: 800 },
    );
    console.log(`[estimate route] structured bodies: ${tally.runs} cases run, ${tally.ok} answered 200, ${tally.refused} refused with 400`);
    expect(tally.runs).toBe(800);
    // The generator must reach the engine often enough to test the 200 path, not just zod.
    expect(tally.ok).toBeGreaterThan(tally.runs / 10);
  });

  it('answers any JSON value at all with 200 or 400', async () => {
    let runs = 0;
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), async (body) => {
        runs++;
        checkAnswer(await postEstimate(rawJson(body)));
      }),
      { numRuns: 300 },
    );
    console.log(`[estimate route] arbitrary JSON bodies: ${runs} cases run`);
    expect(runs).toBe(300);
  });
});
