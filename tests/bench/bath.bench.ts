// Benchmark of bath control: logging one analysis (validate, compute, insert,
// judge the run rules on the last 30 points, raise or count an alert, one transaction) against one
// bare INSERT of an analysis row through pg in the same run; and the chart data for five years of
// daily analyses (one indexed query plus the SPC) against the bare SELECT of the same rows.
// Run alone with `npm run bench -- bath`. Everything it creates is removed at the end.
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { db, pool } from '@/db';
import { getChartData } from '@/lib/bath/chart';
import { logAnalysis } from '@/lib/bath/log-analysis';
import { actor, makeTank, removeTank } from '../integration/bath/fixtures';
import { elapsed, quantile } from './stats';
import type { BenchRow } from './types';

const LOG_RUNS = 200;
const CHART_RUNS = 15;
const DAYS = 5 * 365 + 1;
// Targets: logging one analysis within five bare INSERTs at p50 (the project's performance
// issue); five years of chart data well under a quarter second (our own).
const LOG_TARGET_RATIO = 5;
const CHART_TARGET_MS = 250;

const ms = (x: number) => `${x.toFixed(2)} ms`;

async function timed(runs: number, work: (i: number) => Promise<unknown>): Promise<number[]> {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) out.push(await elapsed(() => work(i)));
  return out;
}

export async function run(): Promise<BenchRow[]> {
  const tank = await makeTank('watts-nickel', 2000);
  try {
    const plater = await actor('plater');
    const nickel = tank.analytes.nickel!.id;
    const ph = tank.analytes.ph!.id;
    const start = Date.now() - (LOG_RUNS + 60) * 60_000;
    const log = (i: number, analyteId: string, inputs: { buretteMl: number } | { reading: number }) =>
      logAnalysis(plater, { key: `bench-${randomUUID()}`, tankId: tank.id, analyteId, inputs, takenAt: new Date(start + i * 60_000), source: 'office' });
    // History for the rules to judge, and a warm connection pool and JIT.
    for (let i = 0; i < 40; i++) {
      await log(i, nickel, { buretteMl: 25 + (i % 3) });
      await log(i, ph, { reading: 4.85 + (i % 3) * 0.05 });
    }

    const insertSql = `insert into analyses (tank_id, analyte_id, method_id, inputs, value, unit, verdict, severity, source, taken_at, logged_by, idempotency_key)
      values ($1, $2, 'nickel-edta', '{"buretteMl": 15}', 44.02, 'g/L', 'out_of_range', 3, 'office', $3, $4, $5)`;
    // Interleaved, so that a change in the machine's load falls on all three alike. The usual entry
    // is in range (one INSERT); the other is out of range every time (the open alert is counted on
    // each, in a transaction with the analysis).
    const bare: number[] = [];
    const usual: number[] = [];
    const logged: number[] = [];
    for (let i = 0; i < LOG_RUNS; i++) {
      bare.push(await elapsed(() => pool.query(insertSql, [tank.id, nickel, new Date(start + (40 + i) * 60_000 + 1), plater.id, `bench-bare-${randomUUID()}`])));
      usual.push(await elapsed(() => log(40 + i, ph, { reading: 4.85 + (i % 3) * 0.05 })));
      logged.push(await elapsed(() => log(40 + i, nickel, { buretteMl: 15 })));
    }
    await db.deleteFrom('analyses').where('idempotency_key', 'like', 'bench-bare-%').where('tank_id', '=', tank.id).execute();

    const temperature = tank.analytes.temperature!.id;
    const day0 = Date.now() - DAYS * 86_400_000;
    const rows = Array.from({ length: DAYS }, (_, d) => ({
      tank_id: tank.id, analyte_id: temperature, method_id: 'thermometer', inputs: '{}', value: 55 + Math.sin(d / 9) * 2 + ((d * 7919) % 13) / 13,
      unit: '°C', verdict: 'in_range' as const, severity: 0, source: 'office' as const, taken_at: new Date(day0 + d * 86_400_000), logged_by: plater.id,
      idempotency_key: `bench-day-${randomUUID()}`,
    }));
    for (let i = 0; i < rows.length; i += 500) await db.insertInto('analyses').values(rows.slice(i, i + 500)).execute();
    const range = { from: new Date(day0 - 86_400_000), to: new Date() };
    await getChartData(tank.id, temperature, range, 'metric');
    const chart = await timed(CHART_RUNS, () => getChartData(tank.id, temperature, range, 'metric'));
    const select = await timed(CHART_RUNS, () => pool.query('select taken_at, value from analyses where analyte_id = $1 and taken_at >= $2 and taken_at < $3 order by taken_at', [temperature, range.from, range.to]));
    const points = (await getChartData(tank.id, temperature, range, 'metric')).points.length;

    const b50 = quantile(bare, 0.5);
    const b95 = quantile(bare, 0.95);
    const c50 = quantile(chart, 0.5);
    const row = (what: string, xs: number[], q: number, b: number, bq: string): BenchRow => ({
      area: 'bath', what, value: ms(quantile(xs, q)), baseline: `bare INSERT ${bq} ${ms(b)}`, ratio: quantile(xs, q) / b, target: `≤ ${LOG_TARGET_RATIO}×`, met: quantile(xs, q) / b <= LOG_TARGET_RATIO,
    });
    return [
      row(`log one analysis in range, p50 (${LOG_RUNS} runs)`, usual, 0.5, b50, 'p50'),
      row('log one analysis in range, p95', usual, 0.95, b95, 'p95'),
      row(`log one out of range + its alert, p50 (${LOG_RUNS} runs)`, logged, 0.5, b50, 'p50'),
      row('log one out of range + its alert, p95', logged, 0.95, b95, 'p95'),
      { area: 'bath', what: `chart data, ${points} daily points (5 years), p50`, value: ms(c50), baseline: `bare SELECT p50 ${ms(quantile(select, 0.5))}`, ratio: c50 / quantile(select, 0.5), target: `≤ ${CHART_TARGET_MS} ms`, met: c50 <= CHART_TARGET_MS },
    ];
  } finally {
    await removeTank(tank);
  }
}
