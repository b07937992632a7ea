// The line's schedule against the real database: open orders are planned on the tanks that run
// their finish, a supervisor's placement holds, and everyone else is refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { placeJob, unplaceJob } from '@/lib/schedule/mutations';
import { workingDays } from '@/lib/schedule/plan';
import { planLine, quoteTurnaroundDays, shopToday } from '@/lib/schedule/queries';
import { capacitySchema } from '@/lib/schedule/schemas';
import { refusalOf, sessionUserByEmail } from '../records/helpers';
import { dockCustomer, dockOrder, type DockCustomer } from '../dock/fixtures';

let supervisor: Awaited<ReturnType<typeof sessionUserByEmail>>;
let plater: Awaited<ReturnType<typeof sessionUserByEmail>>;
let buyer: Awaited<ReturnType<typeof sessionUserByEmail>>;
let cust: DockCustomer;
let zincTank: string;
let nickelTank: string;

beforeAll(async () => {
  supervisor = await sessionUserByEmail('supervisor@kestrel-plating.test');
  plater = await sessionUserByEmail('plater@kestrel-plating.test');
  buyer = await sessionUserByEmail('buyer@northgate-fastener.test');
  cust = await dockCustomer(db);
  zincTank = (await db.selectFrom('tanks').select('id').where('code', '=', 'Z-ZN1').executeTakeFirstOrThrow()).id;
  nickelTank = (await db.selectFrom('tanks').select('id').where('code', '=', 'N-NI1').executeTakeFirstOrThrow()).id;
});

afterAll(async () => {
  await db.deleteFrom('work_orders').where('customer_id', '=', cust.id).execute();
});

describe('planLine', () => {
  it('plans an open order on a tank that runs its finish, with its loads from the part area and the load size', async () => {
    const wo = await dockOrder(db, cust, { ordered: 2400 });
    const { input, plan } = await planLine();
    const job = input.jobs.find((j) => j.id === wo.id)!;
    // 2,400 parts of 0.5 dm²: the zinc barrel's 120 dm² holds 240 of them, fewer than the finish's
    // parts per load if that is smaller; either way at least 2400 / 240 = 10 loads.
    const finish = await db.selectFrom('finishes').select('parts_per_load').where('code', '=', 'ZN-B633-SC2').executeTakeFirstOrThrow();
    expect(job.loads).toBe(Math.ceil(2400 / Math.min(240, finish.parts_per_load)));
    const slots = plan.slots.filter((s) => s.jobId === wo.id);
    expect(slots.reduce((a, s) => a + s.loads, 0) + plan.jobs.get(wo.id)!.unplannedLoads).toBe(job.loads);
    expect(slots.every((s) => input.finishTanks.get(job.finishId)!.includes(s.tankId))).toBe(true);
  });

  it('leaves out orders that have run or shipped', async () => {
    const shipped = await dockOrder(db, cust, { state: 'shipped', received: 100 });
    const { input } = await planLine();
    expect(input.jobs.some((j) => j.id === shipped.id)).toBe(false);
  });
});

describe('placeJob', () => {
  it('keeps a supervisor\u2019s placement on the day and tank chosen, and gives it back on request', async () => {
    const wo = await dockOrder(db, cust, { ordered: 200 });
    const day = workingDays(shopToday(), 5)[3]!;
    await placeJob(supervisor, { workOrderId: wo.id, tankId: zincTank, day });
    let { plan } = await planLine();
    expect(plan.slots.filter((s) => s.jobId === wo.id)).toEqual([expect.objectContaining({ tankId: zincTank, day, placed: true })]);
    await unplaceJob(supervisor, wo.id);
    ({ plan } = await planLine());
    expect(plan.slots.filter((s) => s.jobId === wo.id).every((s) => !s.placed)).toBe(true);
  });

  it('refuses a tank of another finish, a day gone by, a closed order, and anyone but the owner or a supervisor', async () => {
    const wo = await dockOrder(db, cust, { ordered: 200 });
    const day = workingDays(shopToday(), 2)[1]!;
    expect(await refusalOf(placeJob(supervisor, { workOrderId: wo.id, tankId: nickelTank, day }))).toMatch(/does not run this job/);
    expect(await refusalOf(placeJob(supervisor, { workOrderId: wo.id, tankId: zincTank, day: '2020-01-06' }))).toMatch(/working day from today/);
    const shipped = await dockOrder(db, cust, { state: 'shipped', received: 100 });
    expect(await refusalOf(placeJob(supervisor, { workOrderId: shipped.id, tankId: zincTank, day }))).toMatch(/nothing left to plan/);
    expect(await refusalOf(placeJob(plater, { workOrderId: wo.id, tankId: zincTank, day }))).toMatch(/permission|not allowed|may not/i);
    expect(await refusalOf(placeJob(buyer, { workOrderId: wo.id, tankId: zincTank, day }))).toMatch(/permission|not allowed|may not/i);
    const rows = await db.selectFrom('schedule_placements').select('work_order_id').where('work_order_id', 'in', [wo.id, shipped.id]).execute();
    expect(rows).toEqual([]);
  });
});

describe('capacity input', () => {
  it('refuses figures that would plan nonsense', () => {
    const id = '00000000-0000-4000-8000-000000000000';
    expect(capacitySchema.safeParse({ tankId: id, cycleMinutes: 'abc', shiftsPerDay: 2, shiftHours: 8 }).success).toBe(false);
    expect(capacitySchema.safeParse({ tankId: id, cycleMinutes: 0, shiftsPerDay: 2, shiftHours: 8 }).success).toBe(false);
    expect(capacitySchema.safeParse({ tankId: id, cycleMinutes: 45, shiftsPerDay: 4, shiftHours: 8 }).success).toBe(false);
    expect(capacitySchema.safeParse({ tankId: id, cycleMinutes: 45, loadAreaDm2: '', shiftsPerDay: 2, shiftHours: 8 }).data?.loadAreaDm2).toBeNull();
  });
});

describe('quoteTurnaroundDays', () => {
  it('gives a zinc job at least one working day, and more when the line is full', async () => {
    const finish = await db.selectFrom('finishes').select(['id', 'parts_per_load']).where('code', '=', 'ZN-B633-SC2').executeTakeFirstOrThrow();
    const small = await quoteTurnaroundDays([{ finishId: finish.id, partAreaDm2: 0.5, quantity: 10, partsPerLoad: finish.parts_per_load }]);
    // A month of loads cannot ship sooner than a few dozen parts.
    const big = await quoteTurnaroundDays([{ finishId: finish.id, partAreaDm2: 0.5, quantity: 240 * 16 * 20, partsPerLoad: finish.parts_per_load }]);
    expect(small).toBeGreaterThanOrEqual(1);
    expect(big).toBeGreaterThan(small!);
  });
});
