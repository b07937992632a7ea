import { describe, expect, it } from 'vitest';
import { lotBakeRequirement } from '@/lib/quality/bake/rules';
import { bakeCheck, lotChecks, nonconformanceCheck, thicknessState } from '@/lib/quality/lot-checks';
import type { LotBake } from '@/lib/quality/lot-types';
import { makeLot, reading } from './lot-factory';

describe('thickness state', () => {
  it('summary statistics against a hand computation', () => {
    // Readings 8.4, 9.1, 10.0, 10.7, 11.3: Σ = 49.5, mean 9.9; deviations −1.5, −0.8, 0.1, 0.8, 1.4;
    // Σd² = 2.25 + 0.64 + 0.01 + 0.64 + 1.96 = 5.5; s = √(5.5/4) = 1.172604.
    const lot = makeLot({ order: { ...makeLot().order, quantityReceived: 20 }, readings: [8.4, 9.1, 10, 10.7, 11.3].map((t, i) => reading(i + 1, t)) });
    const t = thicknessState(lot);
    expect(t.summary!.mean).toBeCloseTo(9.9, 10);
    expect(t.summary!.stdDev!).toBeCloseTo(1.172604, 6);
    expect(t.summary).toMatchObject({ count: 5, min: 8.4, max: 11.3 });
    expect(t.count).toEqual({ key: 'thickness_count', ok: true, message: '5 of 5 sampled parts measured (lot of 20, code C).' });
    expect(t.pass.ok).toBe(true);
  });

  it('counts parts, not readings, against the sample size', () => {
    const lot = makeLot({ readings: [reading(1, 9), reading(1, 9.5), reading(2, 10)] });
    expect(thicknessState(lot).count.message).toBe('Thickness readings are missing: 2 of 8 sampled parts measured (lot of 40, code D).');
  });

  it('names how many fail, below and above, with the worst values', () => {
    const lot = makeLot({ readings: [reading(1, 7.2, { maximumUm: 15 }), reading(2, 7.9, { maximumUm: 15 }), reading(3, 16.5, { maximumUm: 15 })] });
    expect(thicknessState(lot).pass.message).toBe(
      '3 of 3 thickness readings fail the specification: 2 below the minimum 8 µm (lowest 7.2 µm); 1 above the maximum 15 µm (highest 16.5 µm).',
    );
  });

  it('a "use as is" disposition covers the readings before it, not after', () => {
    const nc = { id: 'n1', source: 'thickness' as const, description: 'thin', openedAt: new Date('2026-06-10T15:00:00Z'), openedByName: null, disposition: 'use_as_is' as const,
      customerApprovalRef: 'D-1', dispositionNote: null, dispositionedAt: new Date('2026-06-10T16:00:00Z'), dispositionedByName: 'P', closedAt: new Date('2026-06-10T16:00:00Z') };
    const before = reading(1, 7.5);
    const after = reading(2, 7.0, { recordedAt: new Date('2026-06-10T17:00:00Z') });
    expect(thicknessState(makeLot({ readings: [before], nonconformances: [nc] })).pass.ok).toBe(true);
    expect(thicknessState(makeLot({ readings: [before, after], nonconformances: [nc] })).pass.message).toMatch(/^1 of 2 thickness readings fail/);
  });

  it('a lot below the first row of the table is inspected whole', () => {
    const lot = makeLot({ order: { ...makeLot().order, quantityReceived: 1, quantityOrdered: 1 } });
    expect(thicknessState(lot).sample).toMatchObject({ sampleSize: 1, inspectAll: true });
    expect(thicknessState(lot).count.message).toBe('Thickness readings are missing: 0 of 1 sampled parts measured (every part of the lot of 1).');
  });
});

const bake = (over: Partial<LotBake>): LotBake => ({
  id: 'b1', platingEndedAt: new Date('2026-06-10T14:00:00Z'), oven: 'Oven 1', bakeStartedAt: new Date('2026-06-10T15:00:00Z'), tempMinC: 200, tempMaxC: 200,
  durationH: 12, hasChart: false, chartFileId: null, requiredMinHours: 12, requiredMinTempC: 190, requiredMaxTempC: 220, windowHours: 4,
  deadlineAt: new Date('2026-06-10T18:00:00Z'), verdict: 'pass', reasons: [], notes: '', recordedAt: new Date('2026-06-11T04:00:00Z'), recordedByName: 'R',
  dispositionReason: null, dispositionAt: null, dispositionByName: null, ...over,
});

describe('bake and nonconformance checks', () => {
  const bakeLot = (bakes: LotBake[]) => makeLot({ order: { ...makeLot().order, bakeRequired: true }, bakes });
  it('missing, failing, dispositioned, and the latest record counts', () => {
    expect(bakeCheck(bakeLot([])).message).toBe('The embrittlement-relief bake has not been recorded.');
    const late = bake({ verdict: 'fail', reasons: [{ code: 'late_start', message: 'Bake started 20 min after the 4 h window closed.' }] });
    expect(bakeCheck(bakeLot([late]))).toMatchObject({ ok: false, message: expect.stringContaining("A supervisor's disposition is needed") });
    expect(bakeCheck(bakeLot([{ ...late, dispositionAt: new Date(), dispositionReason: 'concession C-9' }])).ok).toBe(true);
    expect(bakeCheck(bakeLot([late, bake({ id: 'b2', recordedAt: new Date('2026-06-12T00:00:00Z') })])).ok).toBe(true);
    expect(bakeCheck(makeLot()).message).toBe('No relief bake is required for this lot.');
  });

  it('an open nonconformance and a scrapped lot both refuse', () => {
    const open = { id: 'n', source: 'other' as const, description: 'Stain', openedAt: new Date(), openedByName: null, disposition: null, customerApprovalRef: null,
      dispositionNote: null, dispositionedAt: null, dispositionedByName: null, closedAt: null };
    expect(nonconformanceCheck(makeLot({ nonconformances: [open] })).message).toBe('A nonconformance is open (“Stain”): a disposition is needed first.');
    expect(nonconformanceCheck(makeLot({ nonconformances: [{ ...open, disposition: 'scrap', closedAt: new Date(), dispositionedAt: new Date() }] })).message).toBe(
      'The lot was scrapped by a nonconformance disposition.',
    );
    expect(lotChecks(makeLot({ runs: [] }))[0]).toEqual({ key: 'runs', ok: false, message: 'No plating runs are recorded for this order.' });
  });
});

describe('lotBakeRequirement', () => {
  const finish = { bakeRequired: true, bakeThresholdHrc: 31, bakeWindowHours: 4, bakeTempC: 200, bakeHours: 12 };
  it('the finish (customer specification) sets the hours; the B850 table is shown beside it', () => {
    // Source: ASTM B850 Table 1 (reference §7): 39 HRC sits on the 36–39/39–43 boundary → the longer 14 h band.
    const r = lotBakeRequirement({ orderBakeRequired: true, part: { tensileMpa: null, hardnessHrc: 39 }, finish });
    expect(r).toMatchObject({ required: true, minHours: 12, tableHours: 14, minTempC: 190, maxTempC: 220, windowHours: 4 });
    expect(r.notes).toContain('Bake time 12 h from the finish specification (the ASTM B850 table gives 14 h for this strength).');
  });

  it('a set point outside 190–220 °C is held within ±14 °C (QQ-N-290 example, reference §7)', () => {
    const r = lotBakeRequirement({ orderBakeRequired: true, part: { tensileMpa: 1450, hardnessHrc: null }, finish: { ...finish, bakeTempC: 150, bakeHours: null } });
    expect(r).toMatchObject({ minTempC: 136, maxTempC: 164, minHours: 16 });
  });

  it('follows the work order, and says so when the part now calls for a bake the order lacks', () => {
    const r = lotBakeRequirement({ orderBakeRequired: false, part: { tensileMpa: 1220, hardnessHrc: 39 }, finish: { ...finish, bakeRequired: false } });
    expect(r.required).toBe(false);
    expect(r.notes.at(-1)).toMatch(/does not call for a bake: check the order with a supervisor\.$/);
  });
});
