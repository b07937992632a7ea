// The line's plan: which tank runs how many loads of which work order on which working day.
// Pure and fast (a month of a busy shop, a few thousand loads, plans in milliseconds: see
// tests/bench/schedule.bench.ts). Dates are the shop's calendar days as 'YYYY-MM-DD'.
//
// The rule, as a supervisor would plan by hand: jobs placed by the supervisor stay where they
// were put, even past the tank's capacity (the day then shows as overloaded); the rest go rush
// first, then by promised date (earliest first, undated last), then by work-order number, each
// into the earliest free loads of any tank that runs its finish. A job may be split across tanks
// and days. A job whose last load falls after its promised date is late; one that does not fit in
// the horizon is unplanned, and both are shown before they happen.

export type PlanTank = { id: string; code: string; loadsPerDay: number; finishIds: readonly string[] };

export type PlanJob = {
  id: string;
  number: string;
  finishId: string;
  /** The promised date; null when the customer gave none. */
  due: string | null;
  loads: number;
  isRush: boolean;
  /** Where the supervisor put the job; all its loads run on that tank that day. */
  placed?: { tankId: string; day: string } | null;
};

export type PlanSlot = { jobId: string; tankId: string; day: string; loads: number; placed: boolean };

export type PlannedJob = {
  id: string;
  start: string | null;
  finish: string | null;
  /** Loads that did not fit in the horizon. */
  unplannedLoads: number;
  isLate: boolean;
  /** No tank runs its finish (or the placed tank does not). */
  noTank: boolean;
};

export type TankDay = { tankId: string; day: string; loads: number; capacity: number; isOverloaded: boolean };

export type Plan = { days: string[]; slots: PlanSlot[]; jobs: Map<string, PlannedJob>; tankDays: TankDay[] };

const DAY_MS = 86_400_000;

export function isoDay(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}

function dayMs(day: string): number {
  return Date.parse(`${day}T00:00:00Z`);
}

/** The shop's working days (Monday to Friday) from `from` on, `count` of them. */
export function workingDays(from: string, count: number): string[] {
  const out: string[] = [];
  for (let ms = dayMs(from); out.length < count; ms += DAY_MS) {
    const wd = new Date(ms).getUTCDay();
    if (wd !== 0 && wd !== 6) out.push(isoDay(ms));
  }
  return out;
}

/** Working days after `from` up to and including `to` (0 when `to` is `from` or earlier). */
export function workingDaysBetween(from: string, to: string): number {
  let n = 0;
  for (let ms = dayMs(from) + DAY_MS; ms <= dayMs(to); ms += DAY_MS) {
    const wd = new Date(ms).getUTCDay();
    if (wd !== 0 && wd !== 6) n++;
  }
  return n;
}

/** Loads one tank runs in a day: whole cycles in each manned shift. */
export function loadsPerDay(t: { cycleMinutes: number; shiftHours: number; shiftsPerDay: number }): number {
  if (!(t.cycleMinutes > 0) || !(t.shiftHours > 0) || !(t.shiftsPerDay > 0)) return 0;
  return Math.floor((t.shiftHours * 60) / t.cycleMinutes + 1e-9) * t.shiftsPerDay;
}

/**
 * Loads a job needs: its pieces over the pieces one load carries. A load carries the finish's
 * parts per load, or fewer where the tank's rack or barrel holds less work area than that.
 */
export function loadsNeeded(pieces: number, partAreaDm2: number, partsPerLoad: number, loadAreaDm2: number | null): number {
  if (!(pieces > 0)) return 0;
  const byArea = loadAreaDm2 && partAreaDm2 > 0 ? Math.max(1, Math.floor(loadAreaDm2 / partAreaDm2)) : Infinity;
  const perLoad = Math.max(1, Math.min(partsPerLoad > 0 ? partsPerLoad : Infinity, byArea));
  return Number.isFinite(perLoad) ? Math.ceil(pieces / perLoad) : 1;
}

function priority(a: PlanJob, b: PlanJob): number {
  if (a.isRush !== b.isRush) return a.isRush ? -1 : 1;
  if (a.due !== b.due) {
    if (a.due === null) return 1;
    if (b.due === null) return -1;
    return a.due < b.due ? -1 : 1;
  }
  return a.number < b.number ? -1 : a.number > b.number ? 1 : 0;
}

export function planSchedule(input: { days: readonly string[]; tanks: readonly PlanTank[]; jobs: readonly PlanJob[] }): Plan {
  const days = [...input.days];
  const dayIndex = new Map(days.map((d, i) => [d, i]));
  const tankIndex = new Map(input.tanks.map((t, i) => [t.id, i]));
  // used[tank][day]
  const used = input.tanks.map(() => new Array<number>(days.length).fill(0));
  // For each tank, the first day that may still have free loads (every earlier day is full).
  const firstFree = input.tanks.map(() => 0);
  const tanksByFinish = new Map<string, number[]>();
  input.tanks.forEach((t, i) => {
    for (const f of t.finishIds) {
      const list = tanksByFinish.get(f) ?? [];
      list.push(i);
      tanksByFinish.set(f, list);
    }
  });

  const slots: PlanSlot[] = [];
  const jobs = new Map<string, PlannedJob>();
  const lastDay = days[days.length - 1];
  const finishJob = (job: PlanJob, start: number, end: number, unplanned: number, noTank = false) => {
    const finish = end >= 0 ? days[end]! : null;
    jobs.set(job.id, {
      id: job.id,
      start: start >= 0 ? days[start]! : null,
      finish,
      unplannedLoads: unplanned,
      // A job that cannot finish in the horizon is late if its date falls inside it.
      isLate: job.due !== null && ((finish !== null && finish > job.due) || (unplanned > 0 && (lastDay === undefined || job.due <= lastDay))),
      noTank,
    });
  };

  const open: PlanJob[] = [];
  for (const job of input.jobs) {
    if (!(job.loads > 0)) continue;
    const p = job.placed;
    const ti = p ? tankIndex.get(p.tankId) : undefined;
    const di = p ? dayIndex.get(p.day) : undefined;
    if (p && ti !== undefined && di !== undefined && input.tanks[ti]!.finishIds.includes(job.finishId)) {
      used[ti]![di]! += job.loads;
      slots.push({ jobId: job.id, tankId: p.tankId, day: p.day, loads: job.loads, placed: true });
      finishJob(job, di, di, 0);
    } else {
      // A placement on a day gone by or a tank that no longer runs the finish is planned afresh.
      open.push(job);
    }
  }
  open.sort(priority);

  for (const job of open) {
    const candidates = tanksByFinish.get(job.finishId) ?? [];
    if (candidates.length === 0) {
      finishJob(job, -1, -1, job.loads, true);
      continue;
    }
    let left = job.loads;
    let start = -1;
    let end = -1;
    // Day by day, the loads of every tank that runs the finish, until the job is placed.
    let d = Math.min(...candidates.map((ti) => firstFree[ti]!));
    for (; d < days.length && left > 0; d++) {
      for (const ti of candidates) {
        if (left === 0) break;
        const cap = input.tanks[ti]!.loadsPerDay;
        const row = used[ti]!;
        const free = cap - row[d]!;
        if (free <= 0) continue;
        const take = Math.min(free, left);
        row[d]! += take;
        left -= take;
        slots.push({ jobId: job.id, tankId: input.tanks[ti]!.id, day: days[d]!, loads: take, placed: false });
        if (start < 0) start = d;
        end = d;
      }
    }
    for (const ti of candidates) {
      const cap = input.tanks[ti]!.loadsPerDay;
      while (firstFree[ti]! < days.length && used[ti]![firstFree[ti]!]! >= cap) firstFree[ti]!++;
    }
    finishJob(job, start, end, left);
  }

  const tankDays: TankDay[] = [];
  input.tanks.forEach((t, ti) => {
    used[ti]!.forEach((loads, di) => {
      if (loads > 0) tankDays.push({ tankId: t.id, day: days[di]!, loads, capacity: t.loadsPerDay, isOverloaded: loads > t.loadsPerDay });
    });
  });
  return { days, slots, jobs, tankDays };
}

/**
 * The working days a new job of `loads` loads of a finish would take to ship if it were accepted
 * now, behind everything already planned: its last load's day after today, plus one day to
 * finish, inspect and pack (common practice). Null when no tank runs the finish or it does not fit.
 */
export function turnaroundDays(input: { days: readonly string[]; tanks: readonly PlanTank[]; jobs: readonly PlanJob[] }, today: string, finishId: string, loads: number): number | null {
  const probe: PlanJob = { id: '\u0000probe', number: '\uffff', finishId, due: null, loads: Math.max(1, loads), isRush: false };
  const plan = planSchedule({ ...input, jobs: [...input.jobs, probe] });
  const p = plan.jobs.get(probe.id);
  if (!p || p.finish === null || p.unplannedLoads > 0) return null;
  return workingDaysBetween(today, p.finish) + 1;
}
