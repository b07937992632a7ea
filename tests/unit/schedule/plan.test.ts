// The line's planner: capacity arithmetic, the order it fills tanks in, placements, late and
// overloaded days. The figures are small enough to check by hand; each is worked in a comment.
import { describe, expect, it } from 'vitest';
import { loadsNeeded, loadsPerDay, planSchedule, turnaroundDays, workingDays, workingDaysBetween, type PlanJob, type PlanTank } from '@/lib/schedule/plan';

const job = (over: Partial<PlanJob> & { id: string }): PlanJob => ({ number: over.id, finishId: 'zn', due: null, loads: 1, isRush: false, ...over });
const tank = (id: string, loadsPerDay: number, finishIds = ['zn']): PlanTank => ({ id, code: id, loadsPerDay, finishIds });

describe('calendar', () => {
  it('counts Monday to Friday only', () => {
    // 2026-12-04 is a Friday (ISO 8601 calendar); the next working days are Mon 7, Tue 8.
    expect(workingDays('2026-12-04', 3)).toEqual(['2026-12-04', '2026-12-07', '2026-12-08']);
    expect(workingDays('2026-12-05', 1)).toEqual(['2026-12-07']);
    expect(workingDaysBetween('2026-12-04', '2026-12-08')).toBe(2);
    expect(workingDaysBetween('2026-12-04', '2026-12-04')).toBe(0);
  });
});

describe('capacity', () => {
  it('runs whole cycles in each shift', () => {
    // 8 h × 60 / 45 min = 10.67 → 10 loads a shift, two shifts 20.
    expect(loadsPerDay({ cycleMinutes: 45, shiftHours: 8, shiftsPerDay: 2 })).toBe(20);
    // 480 / 60 = 8 exactly (no loss to floating point).
    expect(loadsPerDay({ cycleMinutes: 60, shiftHours: 8, shiftsPerDay: 1 })).toBe(8);
    expect(loadsPerDay({ cycleMinutes: 60, shiftHours: 8, shiftsPerDay: 0 })).toBe(0);
  });

  it('fills a load to the finish\u2019s parts per load or the rack\u2019s area, whichever is less', () => {
    // 1,000 pieces at 40 a load → 25 loads.
    expect(loadsNeeded(1000, 0.5, 40, null)).toBe(25);
    // A 12 dm² rack holds floor(12 / 0.5) = 24 pieces of 0.5 dm² → ceil(1000 / 24) = 42 loads.
    expect(loadsNeeded(1000, 0.5, 40, 12)).toBe(42);
    // A part larger than the rack still goes one to a load.
    expect(loadsNeeded(3, 20, 40, 12)).toBe(3);
    expect(loadsNeeded(0, 1, 40, null)).toBe(0);
  });
});

describe('planSchedule', () => {
  const days = workingDays('2026-12-07', 5); // Mon 7 … Fri 11

  it('fills tanks day by day in promised-date order, rush first, splitting a job where it must', () => {
    const plan = planSchedule({
      days,
      tanks: [tank('A', 4), tank('B', 2)],
      jobs: [job({ id: 'late-due', due: '2026-12-20', loads: 5 }), job({ id: 'early', due: '2026-12-08', loads: 4 }), job({ id: 'rush', isRush: true, loads: 1 })],
    });
    // Day 1 has 6 loads: rush takes 1 on A, early takes A's other 3 and 1 on B, late-due takes B's last.
    expect(plan.slots.filter((s) => s.day === '2026-12-07').map((s) => [s.jobId, s.tankId, s.loads])).toEqual([
      ['rush', 'A', 1], ['early', 'A', 3], ['early', 'B', 1], ['late-due', 'B', 1],
    ]);
    // late-due has 4 left: all on A on day 2.
    expect(plan.jobs.get('late-due')).toMatchObject({ start: '2026-12-07', finish: '2026-12-08', isLate: false, unplannedLoads: 0 });
    expect(plan.jobs.get('early')).toMatchObject({ start: '2026-12-07', finish: '2026-12-07', isLate: false });
  });

  it('shows a job that will miss its date, and one that does not fit, before it happens', () => {
    const plan = planSchedule({ days, tanks: [tank('A', 2)], jobs: [job({ id: 'big', due: '2026-12-08', loads: 6 }), job({ id: 'huge', due: '2027-01-30', loads: 20 })] });
    // 6 loads at 2 a day end on Wed 9, a day after the 8th.
    expect(plan.jobs.get('big')).toMatchObject({ finish: '2026-12-09', isLate: true });
    // 4 loads a day are left over two days: huge gets 4 of 20, 16 unplanned; its date lies past the horizon, so not yet late.
    expect(plan.jobs.get('huge')).toMatchObject({ unplannedLoads: 16, isLate: false });
  });

  it('keeps the supervisor\u2019s placement even past capacity, and marks the day overloaded', () => {
    const plan = planSchedule({
      days,
      tanks: [tank('A', 3), tank('B', 3)],
      jobs: [job({ id: 'placed', loads: 5, placed: { tankId: 'B', day: '2026-12-09' } }), job({ id: 'free', loads: 3, due: '2026-12-07' })],
    });
    expect(plan.slots.filter((s) => s.jobId === 'placed')).toEqual([{ jobId: 'placed', tankId: 'B', day: '2026-12-09', loads: 5, placed: true }]);
    expect(plan.tankDays.find((d) => d.tankId === 'B' && d.day === '2026-12-09')).toMatchObject({ loads: 5, capacity: 3, isOverloaded: true });
    expect(plan.jobs.get('free')).toMatchObject({ finish: '2026-12-07' });
  });

  it('plans afresh a placement on a tank that does not run the finish or a day outside the plan', () => {
    const plan = planSchedule({
      days,
      tanks: [tank('A', 3), tank('N', 3, ['ni'])],
      jobs: [job({ id: 'wrong-tank', loads: 1, placed: { tankId: 'N', day: '2026-12-09' } }), job({ id: 'past', loads: 1, placed: { tankId: 'A', day: '2026-12-01' } })],
    });
    expect(plan.slots.every((s) => s.tankId === 'A' && s.day === '2026-12-07' && !s.placed)).toBe(true);
  });

  it('says when no tank runs the finish', () => {
    const plan = planSchedule({ days, tanks: [tank('A', 3)], jobs: [job({ id: 'gold', finishId: 'au', loads: 2, due: '2026-12-08' })] });
    expect(plan.jobs.get('gold')).toMatchObject({ noTank: true, unplannedLoads: 2, isLate: true, start: null });
  });

  it('never puts more loads on a tank-day than it holds unless the supervisor did', () => {
    // Random shop: the planner's own slots never exceed a tank's capacity, and every load is either planned or counted unplanned.
    let seed = 7;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    for (let round = 0; round < 50; round++) {
      const tanks = [tank('A', 1 + Math.floor(rnd() * 10), ['zn', 'ni']), tank('B', Math.floor(rnd() * 6), ['ni']), tank('C', 1 + Math.floor(rnd() * 4), ['zn'])];
      const jobs = Array.from({ length: 30 }, (_, i) => job({ id: `j${i}`, finishId: rnd() < 0.5 ? 'zn' : 'ni', loads: 1 + Math.floor(rnd() * 12), due: rnd() < 0.8 ? days[Math.floor(rnd() * 5)]! : null, isRush: rnd() < 0.1 }));
      const plan = planSchedule({ days, tanks, jobs });
      for (const td of plan.tankDays) expect(td.loads).toBeLessThanOrEqual(td.capacity);
      for (const j of jobs) {
        const planned = plan.slots.filter((s) => s.jobId === j.id).reduce((a, s) => a + s.loads, 0);
        expect(planned + plan.jobs.get(j.id)!.unplannedLoads).toBe(j.loads);
      }
    }
  });
});

describe('turnaroundDays', () => {
  it('queues the new job behind the planned ones', () => {
    const days = workingDays('2026-12-07', 10);
    const tanks = [tank('A', 4)];
    // Empty line: 4 loads run today → 0 days after today + 1 to finish and pack.
    expect(turnaroundDays({ days, tanks, jobs: [] }, '2026-12-07', 'zn', 4)).toBe(1);
    // 10 loads already planned fill Mon, Tue and half of Wed; 4 more end Thu 10: 3 working days + 1.
    expect(turnaroundDays({ days, tanks, jobs: [job({ id: 'x', loads: 10, due: '2026-12-09' })] }, '2026-12-07', 'zn', 4)).toBe(4);
    expect(turnaroundDays({ days, tanks, jobs: [] }, '2026-12-07', 'au', 4)).toBeNull();
  });
});
