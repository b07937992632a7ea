import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { importLabCsv } from '@/lib/bath/lab-import';
import { findLimitChanges, updateAnalyteLimits } from '@/lib/bath/limits';
import { logAnalysis } from '@/lib/bath/log-analysis';
import { actor, codeOf, key, makeTank, removeTank, type TestTank } from './fixtures';

let tank: TestTank;
let supervisor: Awaited<ReturnType<typeof actor>>;
let plater: Awaited<ReturnType<typeof actor>>;

beforeAll(async () => {
  tank = await makeTank('alkaline-zinc', 3000);
  [supervisor, plater] = await Promise.all([actor('supervisor'), actor('plater')]);
});
afterAll(async () => {
  await removeTank(tank);
  await db.destroy();
});

const zincLimits = { target: 7.5, lowerControl: 6, upperControl: 9, lowerSpec: null, upperSpec: null, frequencyHours: 24 };

describe('limit changes', () => {
  it('keep who, when, why, before and after; a change without effect keeps nothing', async () => {
    const analyteId = tank.analytes.zinc!.id;
    const r = await updateAnalyteLimits(supervisor, { analyteId, ...zincLimits, lowerSpec: 5, upperSpec: 10.5, reason: "Supplier's new data sheet" });
    expect(r.changed).toBe(true);
    expect((await updateAnalyteLimits(supervisor, { analyteId, ...zincLimits, lowerSpec: 5, upperSpec: 10.5, reason: 'Same again' })).changed).toBe(false);
    const history = await findLimitChanges([analyteId]);
    expect(history).toHaveLength(1);
    expect(history[0]).toMatchObject({ reason: "Supplier's new data sheet", changed_by_name: 'Priya Natarajan' });
    expect(history[0]!.before).toMatchObject({ lower_spec: null, upper_spec: null, target: 7.5 });
    expect(history[0]!.after).toMatchObject({ lower_spec: 5, upper_spec: 10.5 });
    const row = await db.selectFrom('tank_analytes').select(['lower_spec', 'upper_spec']).where('id', '=', analyteId).executeTakeFirstOrThrow();
    expect(row).toEqual({ lower_spec: 5, upper_spec: 10.5 });
  });

  it('new limits judge the next analysis', async () => {
    const analyteId = tank.analytes.zinc!.id;
    // Zinc by EDTA, 2 mL, 0.1 M: g/L = mL × 0.1 × 65.38 ÷ 2 (IUPAC Zn 65.38): 2.6 mL = 8.50 g/L.
    const before = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId, inputs: { buretteMl: 2.6 }, takenAt: new Date(), source: 'floor' });
    expect(before.verdict).toBe('in_range');
    await updateAnalyteLimits(supervisor, { analyteId, ...zincLimits, upperControl: 8.4, lowerSpec: 5, upperSpec: 10.5, reason: 'Tighter band for the new brightener' });
    const after = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId, inputs: { buretteMl: 2.6 }, takenAt: new Date(), source: 'floor' });
    expect(after.verdict).toBe('out_of_range');
  });

  it('refuses crossed limits, a missing reason and a plater, changing nothing', async () => {
    const analyteId = tank.analytes.sodiumHydroxide!.id;
    const base = { analyteId, target: 90, lowerControl: 75, upperControl: 105, lowerSpec: null, upperSpec: null, frequencyHours: 24, reason: 'Check' };
    expect(await codeOf(updateAnalyteLimits(supervisor, { ...base, lowerControl: 110 }))).toMatch(/^BAD_INPUT/);
    expect(await codeOf(updateAnalyteLimits(supervisor, { ...base, lowerSpec: 80 }))).toMatch(/^BAD_INPUT: The lower specification limit must not be inside/);
    expect(await codeOf(updateAnalyteLimits(supervisor, { ...base, target: 80, reason: ' ' }))).toMatch(/^BAD_INPUT: Say why/);
    expect(await codeOf(updateAnalyteLimits(plater, { ...base, target: 80 }))).toMatch(/^FORBIDDEN/);
    expect(await findLimitChanges([analyteId])).toHaveLength(0);
  });
});

describe('outside lab CSV', () => {
  const header = 'tank_code,analyte_key,value,unit,taken_at';
  const day = (d: number) => new Date(Date.now() - d * 86_400_000).toISOString().slice(0, 16).replace('T', ' ');

  it('with one bad row writes nothing and lists the row and column', async () => {
    const csv = [header, `${tank.code},zinc,7.4,g/L,${day(3)}`, `${tank.code},sodiumHydroxide,ninety,g/L,${day(3)}`, `${tank.code},zinc,7.6,g/L,${day(2)}`].join('\n');
    const before = await db.selectFrom('analyses').select('id').where('tank_id', '=', tank.id).execute();
    const r = await importLabCsv(supervisor, csv);
    expect(r).toEqual({ ok: false, errors: [{ row: 3, column: 'value', message: '"ninety" is not a number (use a point for decimals).' }] });
    expect(await db.selectFrom('analyses').select('id').where('tank_id', '=', tank.id).execute()).toHaveLength(before.length);
  });

  it('all good: every row is stored as a lab result, judged, alerted; the same file again stores nothing new', async () => {
    // 1.35 oz/gal = 10.11 g/L (Source: NIST Handbook 44 App. C, 1 oz/gal = 7.48915 g/L): above the 8.4 g/L limit set above.
    const csv = [header, `${tank.code},sodiumHydroxide,91,g/L,${day(2)}`, `${tank.code},zinc,1.35,oz/gal,${day(1)}`].join('\n');
    const r = await importLabCsv(supervisor, csv);
    expect(r).toMatchObject({ ok: true, imported: 2, alreadyImported: 0 });
    const rows = await db.selectFrom('analyses').select(['value', 'source', 'method_id', 'verdict', 'unit']).where('tank_id', '=', tank.id).where('source', '=', 'lab').orderBy('taken_at').execute();
    expect(rows).toHaveLength(2);
    expect(rows[1]).toMatchObject({ source: 'lab', method_id: 'outside-lab', verdict: 'out_of_range', unit: 'g/L' });
    expect(rows[1]!.value).toBeCloseTo(1.35 * 7.48915, 3);
    const again = await importLabCsv(supervisor, csv);
    expect(again).toMatchObject({ ok: true, imported: 0, alreadyImported: 2 });
    expect(await codeOf(importLabCsv(await actor('estimator'), csv))).toMatch(/^FORBIDDEN/);
  });
});
