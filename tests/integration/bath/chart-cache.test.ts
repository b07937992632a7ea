// The control chart's stored JSON (in PostgreSQL, and kept by each process under the same stamp): served while nothing it was worked out from has changed, and
// worked out again after any new or corrected analysis, a change of limits, or a bulk load.
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { getChartData } from '@/lib/bath/chart';
import { chartAnswer, chartJson, forgetKeptCharts } from '@/lib/bath/chart-cache';
import { updateAnalyteLimits } from '@/lib/bath/limits';
import { logAnalysis } from '@/lib/bath/log-analysis';
import { statementLog } from '../../helpers/statement-log';
import { actor, key, makeTank, removeTank, type TestTank } from './fixtures';

const { db: watched, sent } = statementLog();

let tank: TestTank;
let plater: Awaited<ReturnType<typeof actor>>;
let supervisor: Awaited<ReturnType<typeof actor>>;
let nickel: string;

beforeAll(async () => {
  tank = await makeTank('watts-nickel', 2000);
  plater = await actor('plater');
  supervisor = await actor('supervisor');
  nickel = tank.analytes.nickel!.id;
});
afterAll(async () => {
  await removeTank(tank);
  await db.destroy();
});

const DAY = 86_400_000;
const range = { from: new Date(Date.now() - 30 * DAY), to: new Date(Date.now() + DAY) };
const fresh = async () => JSON.stringify(await getChartData(tank.id, nickel, range, 'metric', db, 'all'));
const stored = () => db.selectFrom('chart_cache').select(['view', 'version', 'body']).where('analyte_id', '=', nickel).execute();
const versionOf = async () => (await db.selectFrom('tank_analytes').select('analyses_version').where('id', '=', nickel).executeTakeFirstOrThrow()).analyses_version;
const log = (buretteMl: number, daysAgo: number, supersedesId?: string) =>
  logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: nickel, inputs: { buretteMl }, takenAt: new Date(Date.now() - daysAgo * DAY), source: 'floor', supersedesId });

describe('the stored control chart', () => {
  it('is worked out once, then served as stored until an analysis changes, and is then the chart of the new data', async () => {
    for (const [ml, ago] of [[26, 9], [27, 8], [25.5, 7], [26.5, 6]] as const) await log(ml, ago);
    const first = await chartJson(tank.id, nickel, range, 'metric', 'all');
    expect(first).toBe(await fresh());
    expect(JSON.parse(first).readings.total).toBe(4);
    const [row] = await stored();
    expect(row!.body).toBe(first);

    // Kept by this process: read again, it costs the stamp's one statement and nothing else.
    sent.length = 0;
    expect(await chartJson(tank.id, nickel, range, 'metric', 'all', watched)).toBe(first);
    expect(sent).toHaveLength(1);
    expect(sent[0]).toMatch(/from "tank_analytes" as "a"/);

    // Served as stored to a process that has not kept it: a body planted under the same stamp comes
    // back, proof that nothing was worked out.
    await db.updateTable('chart_cache').set({ body: '{"planted":true}' }).where('analyte_id', '=', nickel).execute();
    forgetKeptCharts();
    expect(await chartJson(tank.id, nickel, range, 'metric', 'all')).toBe('{"planted":true}');

    // The validator names the stamp: the same while nothing changed, another after any change.
    const etag = (await chartAnswer(tank.id, nickel, range, 'metric', 'all')).etag;
    expect(etag).toMatch(/^W\/"c[A-Za-z0-9_-]{27}"$/);
    expect((await chartAnswer(tank.id, nickel, range, 'metric', 'all')).etag).toBe(etag);

    // A new analysis, even one dated back inside the range, makes the next reader work it out again.
    await log(30, 20);
    expect((await chartAnswer(tank.id, nickel, range, 'metric', 'all')).etag).not.toBe(etag);
    const after = await chartJson(tank.id, nickel, range, 'metric', 'all');
    expect(after).toBe(await fresh());
    expect(JSON.parse(after).readings.total).toBe(5);
    // Only the current chart of the analyte is kept.
    expect((await stored()).map((r) => r.body)).toEqual([after]);
  });

  it('a correction, a change of limits and another unit system each give the chart of what is now true', async () => {
    const wrong = await log(40, 3);
    const before = await chartJson(tank.id, nickel, range, 'metric', 'all');
    expect(JSON.parse(before).points.map((p: { value: number }) => p.value)).toContain(wrong.analysis.value);
    const right = await log(26, 3, wrong.analysis.id);
    const corrected = JSON.parse(await chartJson(tank.id, nickel, range, 'metric', 'all'));
    expect(corrected.points.map((p: { value: number }) => p.value)).not.toContain(wrong.analysis.value);
    expect(corrected.points.map((p: { value: number }) => p.value)).toContain(right.analysis.value);

    const a = await db.selectFrom('tank_analytes').selectAll().where('id', '=', nickel).executeTakeFirstOrThrow();
    await updateAnalyteLimits(supervisor, {
      analyteId: nickel, target: a.target, lowerControl: a.lower_control, upperControl: a.upper_control,
      lowerSpec: (a.lower_spec ?? 0) - 1, upperSpec: a.upper_spec, frequencyHours: a.frequency_hours, reason: 'wider after a process review',
    });
    const widened = JSON.parse(await chartJson(tank.id, nickel, range, 'metric', 'all'));
    expect(widened.limits.lsl).toBe((a.lower_spec ?? 0) - 1);

    const us = await chartJson(tank.id, nickel, range, 'us', 'all');
    expect(us).toBe(JSON.stringify(await getChartData(tank.id, nickel, range, 'us', db, 'all')));
    expect(JSON.parse(us).unit).not.toBe(widened.unit);
  });

  it('counts a change of many rows at once as one change (a bulk load), and a refused entry as none', async () => {
    const v0 = Number(await versionOf());
    await sql`
      insert into analyses (tank_id, analyte_id, method_id, value, unit, verdict, severity, source, taken_at, logged_by, idempotency_key)
      select ${tank.id}, ${nickel}, 'nickel-edta', 75 + i * 0.01, 'g/L', 'in_range', 0, 'lab', now() - i * interval '1 hour', 'demo-plater-plater', 'bulk-' || ${key()} || '-' || i
      from generate_series(1, 50) as i`.execute(db);
    expect(Number(await versionOf())).toBe(v0 + 1);
    await expect(log(-5, 1)).rejects.toThrow();
    expect(Number(await versionOf())).toBe(v0 + 1);
    expect(JSON.parse(await chartJson(tank.id, nickel, range, 'metric', 'all')).readings.total).toBe(JSON.parse(await fresh()).readings.total);
  });
});
