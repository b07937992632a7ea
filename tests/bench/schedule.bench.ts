// Benchmark of the line's planner: a month of a busy shop (40 tanks over 25 finishes, 1,500 open
// work orders needing some 6,750 loads, a tenth of them placed by hand) planned over 22 working
// days, against the one second the issue allows. Run alone with `npm run bench -- schedule`.
import { planSchedule, workingDays, type PlanJob, type PlanTank } from '../../lib/schedule/plan';
import { quantile } from './stats';
import type { BenchRow } from './types';

const RUNS = 50;

function shop() {
  let seed = 20261204;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
  const days = workingDays('2027-01-04', 22);
  const finishes = Array.from({ length: 25 }, (_, i) => `f${i}`);
  const tanks: PlanTank[] = Array.from({ length: 40 }, (_, i) => ({
    id: `t${i}`, code: `T${i}`, loadsPerDay: 4 + Math.floor(rnd() * 12),
    finishIds: finishes.filter((_, f) => f % 20 === i % 20 || rnd() < 0.05),
  }));
  const jobs: PlanJob[] = Array.from({ length: 1500 }, (_, i) => {
    const finishId = finishes[Math.floor(rnd() * finishes.length)]!;
    const runs = tanks.filter((t) => t.finishIds.includes(finishId));
    const placedTank = runs[Math.floor(rnd() * runs.length)];
    return {
      id: `w${i}`, number: `W2027-${String(i).padStart(5, '0')}`, finishId, loads: 1 + Math.floor(rnd() * 8), isRush: rnd() < 0.05,
      due: rnd() < 0.9 ? days[Math.floor(rnd() * days.length)]! : null,
      placed: placedTank && rnd() < 0.1 ? { tankId: placedTank.id, day: days[Math.floor(rnd() * days.length)]! } : null,
    };
  });
  return { days, tanks, jobs, loads: jobs.reduce((a, j) => a + j.loads, 0) };
}

export async function run(): Promise<BenchRow[]> {
  const input = shop();
  for (let i = 0; i < 5; i++) planSchedule(input);
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    planSchedule(input);
    times.push(performance.now() - t0);
  }
  const p50 = quantile(times, 0.5);
  return [{
    area: 'schedule',
    what: `plan a month: ${input.jobs.length} jobs, ${input.loads} loads, 40 tanks, 22 days (p50 of ${RUNS}; p95 ${quantile(times, 0.95).toFixed(1)} ms)`,
    value: `${p50.toFixed(1)} ms`,
    baseline: 'one second 1000 ms',
    ratio: Number((p50 / 1000).toFixed(4)),
    target: '≤ 0.1× (well under a second)',
    met: p50 <= 100,
  }];
}
