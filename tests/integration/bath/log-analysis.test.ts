import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { getChartData } from '@/lib/bath/chart';
import { submitFloorEntry } from '@/lib/bath/floor-entries';
import { logAnalysis } from '@/lib/bath/log-analysis';
import { recordAddition, recordMeterReading } from '@/lib/bath/record';
import { floorEntrySchema } from '@/lib/bath/schemas';
import { actor, codeOf, key, makeTank, removeTank, type TestTank } from './fixtures';

let tank: TestTank;
let plater: Awaited<ReturnType<typeof actor>>;

beforeAll(async () => {
  tank = await makeTank('watts-nickel', 2000);
  plater = await actor('plater');
});
afterAll(async () => {
  await removeTank(tank);
  await db.destroy();
});

const now = () => new Date();
const alertsOf = (kind: string) => db.selectFrom('bath_alerts').selectAll().where('tank_id', '=', tank.id).where('kind', '=', kind as never).execute();

describe('logging an analysis', () => {
  it('computes the value from the burette reading, judges it and stores the raw inputs', async () => {
    // Source: EDTA/murexide nickel, 1:1, 2 mL sample, 0.1 M EDTA: g/L = mL × 0.1 × M(Ni) ÷ 2 (IUPAC 2021: Ni 58.6934).
    const r = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.nickel!.id, inputs: { buretteMl: 26 }, takenAt: now(), source: 'floor' });
    expect(r.duplicate).toBe(false);
    expect(r.analysis.value).toBeCloseTo((26 * 0.1 * 58.6934) / 2, 3);
    expect(r.verdict).toBe('in_range');
    expect(r.analysis.inputs).toEqual({ buretteMl: 26 });
    expect(r.analysis.method_id).toBe('nickel-edta');
    expect(r.newAlertIds).toEqual([]);
  });

  it('raises one out-of-limits alert; a second out-of-range reading counts on the open alert', async () => {
    const first = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.nickel!.id, inputs: { buretteMl: 15 }, takenAt: now(), source: 'floor' });
    expect(first.verdict).toBe('out_of_range');
    expect(first.recommendation).toMatchObject({ kind: 'add', material: 'Nickel sulfate hexahydrate', unit: 'kg' });
    expect(first.newAlertIds).toHaveLength(1);
    const second = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.nickel!.id, inputs: { buretteMl: 14 }, takenAt: now(), source: 'floor' });
    expect(second.newAlertIds).toEqual([]);
    const alerts = await alertsOf('out_of_limits');
    expect(alerts).toHaveLength(1);
    expect(alerts[0]).toMatchObject({ state: 'open', occurrences: 2, analysis_id: second.analysis.id });
  });

  it('raises a run-rule alert when a Western Electric rule fires on the last 30 points, though within limits', async () => {
    // 29 steady readings 55.0 / 55.4 °C (σ̂ = MR̄/1.128 = 0.355), then 58 °C: beyond 3σ but inside 40–65 °C.
    // Source: Western Electric rule 1 (NIST/SEMATECH e-Handbook §6.3.2).
    const base = Date.now() - 40 * 3600_000;
    for (let i = 0; i < 29; i++) {
      await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.temperature!.id, inputs: { reading: i % 2 ? 55.4 : 55 }, takenAt: new Date(base + i * 3600_000), source: 'floor' });
    }
    expect(await alertsOf('run_rule')).toHaveLength(0);
    const r = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.temperature!.id, inputs: { reading: 58 }, takenAt: now(), source: 'floor' });
    expect(r.verdict).toBe('in_range');
    expect(r.rules).toContain('we1_beyond_3s');
    expect(r.analysis.rules).toContain('we1_beyond_3s');
    const alerts = await alertsOf('run_rule');
    expect(alerts).toHaveLength(1);
    expect(alerts[0]!.message).toMatch(/One point beyond 3σ/);
    expect(await alertsOf('out_of_limits').then((a) => a.filter((x) => x.analyte_id === tank.analytes.temperature!.id))).toHaveLength(0);
  });

  it('a resend with the same key stores once and answers with the original', async () => {
    const k = key('resend');
    const entry = floorEntrySchema.parse({ kind: 'analysis', key: k, tankId: tank.id, analyteId: tank.analytes.ph!.id, inputs: { reading: 4.85 }, takenAt: now().toISOString() });
    const [a, b] = await Promise.all([submitFloorEntry(plater, entry), submitFloorEntry(plater, entry)]);
    const again = await submitFloorEntry(plater, { ...entry, inputs: { reading: 9.9 } } as typeof entry);
    expect(new Set([a.id, b.id, again.id]).size).toBe(1);
    expect([a.duplicate, b.duplicate].sort()).toEqual([false, true]);
    expect(again).toMatchObject({ duplicate: true, analysis: { value: 4.85 } });
    const rows = await db.selectFrom('analyses').select('id').where('idempotency_key', '=', k).execute();
    expect(rows).toHaveLength(1);
  });

  it('additions and meter readings are stored once per key too', async () => {
    const k = key('add');
    const input = { key: k, tankId: tank.id, analyteId: tank.analytes.boricAcid!.id, kind: 'correction' as const, material: 'Boric acid', amount: 22, unit: 'lb' as const, madeAt: now() };
    const a = await recordAddition(plater, input);
    const b = await recordAddition(plater, { ...input, amount: 99 });
    expect(b).toMatchObject({ duplicate: true, addition: { id: a.addition.id } });
    // Source: NIST SP 811 App. B.8 — 1 lb = 0.45359237 kg.
    expect(a.addition).toMatchObject({ unit: 'kg' });
    expect(a.addition.amount).toBeCloseTo(22 * 0.45359237, 9);
    const mk = key('meter');
    await recordMeterReading(plater, { key: mk, tankId: tank.id, ampHours: 1000, readAt: now() });
    expect((await recordMeterReading(plater, { key: mk, tankId: tank.id, ampHours: 5, readAt: now() })).reading.amp_hours).toBe(1000);
  });

  it('a correction supersedes the old entry; both stay; the chart uses the correction; the old one cannot be corrected twice', async () => {
    const boric = tank.analytes.boricAcid!.id;
    const takenAt = new Date(Date.now() - 3600_000);
    const wrong = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: boric, inputs: { buretteMl: 3.6 }, takenAt, source: 'floor' });
    expect(wrong.verdict).toBe('out_of_range');
    const right = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: boric, inputs: { buretteMl: 36 }, takenAt, supersedesId: wrong.analysis.id, source: 'floor' });
    // Source: boric acid with mannitol, 1:1, 5 mL, 0.1 M NaOH (Metrohm AB 195): g/L = mL × 0.1 × M(H3BO3) ÷ 5,
    // M = 3 × 1.008 + 10.81 + 3 × 15.999 = 61.831 g/mol (IUPAC conventional atomic weights).
    expect(right.analysis.value).toBeCloseTo((36 * 0.1 * (3 * 1.008 + 10.81 + 3 * 15.999)) / 5, 4);
    expect(right.analysis.supersedes_id).toBe(wrong.analysis.id);
    const both = await db.selectFrom('analyses').select(['id', 'value']).where('analyte_id', '=', boric).execute();
    expect(both.map((r) => r.id).sort()).toEqual([wrong.analysis.id, right.analysis.id].sort());
    const chart = await getChartData(tank.id, boric, { from: new Date(Date.now() - 86_400_000), to: new Date(Date.now() + 60_000) }, 'metric');
    expect(chart.points.map((p) => p.value)).toEqual([right.analysis.value]);
    expect(await codeOf(logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: boric, inputs: { buretteMl: 37 }, takenAt, supersedesId: wrong.analysis.id, source: 'floor' }))).toMatch(/^CONFLICT: That analysis has already been corrected/);
  });

  it('refuses a wrong role, another tank analyte and an unusable reading, and stores nothing', async () => {
    const estimator = await actor('estimator');
    const before = await db.selectFrom('analyses').select('id').where('tank_id', '=', tank.id).execute();
    const entry = { key: key(), tankId: tank.id, analyteId: tank.analytes.nickel!.id, inputs: { buretteMl: 25 }, takenAt: now(), source: 'floor' as const };
    expect(await codeOf(logAnalysis(estimator, entry))).toBe('FORBIDDEN: You are not allowed to do this.');
    expect(await codeOf(logAnalysis(plater, { ...entry, tankId: '00000000-0000-4000-8000-000000000000' }))).toMatch(/^NOT_FOUND/);
    expect(await codeOf(logAnalysis(plater, { ...entry, inputs: { buretteMl: -2 } }))).toMatch(/^BAD_INPUT: Burette reading must be at least 0/);
    expect(await codeOf(recordMeterReading(estimator, { key: key(), tankId: tank.id, ampHours: 1, readAt: now() }))).toMatch(/^FORBIDDEN/);
    const after = await db.selectFrom('analyses').select('id').where('tank_id', '=', tank.id).execute();
    expect(after).toHaveLength(before.length);
  });
});
