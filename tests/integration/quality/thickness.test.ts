import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { changeWorkOrderState } from '@/lib/orders/states';
import { loadLot } from '@/lib/quality/lot';
import { thicknessState } from '@/lib/quality/lot-checks';
import { dispositionNonconformance, hasOpenNonconformance } from '@/lib/quality/nonconformances';
import { recordReadings, recordReadingsCsv, voidReading } from '@/lib/quality/thickness';
import { actorFor, createLot, errorOf, passingReadings, PLATER, SUPERVISOR } from './fixtures';

afterAll(() => db.destroy());

const toInspected = (workOrderId: string, actorId: string) =>
  db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId, to: 'inspected', actorId }));

describe('thickness readings and the inspected step', () => {
  it('refuses "inspected" while readings are missing, naming the sample size from Z1.4', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await createLot(db, { quantity: 40 });
    // Source: ANSI/ASQ Z1.4-2008 Table I, level II: lot 26–50 → code D; Table II-A: D → 8.
    expect(await errorOf(toInspected(lot.id, plater.id))).toBe(
      'CONFLICT: Thickness readings are missing: 0 of 8 sampled parts measured (lot of 40, code D).',
    );
    await recordReadings(plater, { workOrderId: lot.id, entry: 'manual', readings: passingReadings(5) });
    expect(await errorOf(toInspected(lot.id, plater.id))).toBe(
      'CONFLICT: Thickness readings are missing: 5 of 8 sampled parts measured (lot of 40, code D).',
    );
    await recordReadings(plater, { workOrderId: lot.id, entry: 'manual', readings: passingReadings(8).slice(5) });
    expect(await errorOf(toInspected(lot.id, plater.id))).toBe('none');
  });

  it('stores each verdict and the summary statistics match a hand computation', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await createLot(db, { quantity: 3 });
    await recordReadings(plater, {
      workOrderId: lot.id,
      entry: 'manual',
      readings: [9.2, 10.4, 11.0].map((t, i) => ({ partNo: i + 1, location: 'shank', method: 'B568' as const, thicknessUm: t })),
    });
    const t = thicknessState((await loadLot(db, lot.id))!);
    // Hand computation: mean = 30.6/3 = 10.2; deviations −1.0, 0.2, 0.8; Σd² = 1.68; s = √(1.68/2) = 0.916515.
    expect(t.summary!.mean).toBeCloseTo(10.2, 10);
    expect(t.summary!.stdDev!).toBeCloseTo(0.916515, 6);
    expect(t.summary).toMatchObject({ count: 3, min: 9.2, max: 11 });
    // Source: ANSI/ASQ Z1.4-2008 Table I: lot 2–8 → code A; Table II-A: A → 2 parts.
    expect(t.sample).toMatchObject({ sampleSize: 2, codeLetter: 'A' });
  });

  it('a failing reading opens a nonconformance and blocks inspection until it is dispositioned', async () => {
    const plater = await actorFor(db, PLATER);
    const supervisor = await actorFor(db, SUPERVISOR);
    const lot = await createLot(db, { quantity: 8 });
    const readings = passingReadings(2);
    readings[1] = { ...readings[1]!, thicknessUm: 6.5 };
    const r = await recordReadings(plater, { workOrderId: lot.id, entry: 'manual', readings });
    expect(r).toMatchObject({ count: 2, failCount: 1 });
    expect(r.nonconformanceId).toBeTruthy();
    expect(await hasOpenNonconformance(lot.id)).toBe(true);
    expect(await errorOf(toInspected(lot.id, plater.id))).toBe(
      'CONFLICT: 1 of 2 thickness readings fail the specification: 1 below the minimum 8 µm (lowest 6.5 µm). ' +
        'A nonconformance is open (“Thickness against ASTM B633 Fe/Zn 8 (SC2) Type III: 1 of 2 readings fail (1 below the minimum 8 µm).”): a disposition is needed first.',
    );
    // A plater may not disposition; use as is needs the customer's reference.
    expect(await errorOf(dispositionNonconformance(plater, { nonconformanceId: r.nonconformanceId!, disposition: 'use_as_is', customerApprovalRef: 'X' }))).toBe(
      'FORBIDDEN: Only a supervisor may disposition a nonconformance.',
    );
    expect(await errorOf(dispositionNonconformance(supervisor, { nonconformanceId: r.nonconformanceId!, disposition: 'use_as_is' }))).toBe(
      "BAD_INPUT: Use as is needs the customer's approval reference.",
    );
    await dispositionNonconformance(supervisor, { nonconformanceId: r.nonconformanceId!, disposition: 'use_as_is', customerApprovalRef: 'NGF deviation D-118' });
    expect(await hasOpenNonconformance(lot.id)).toBe(false);
    expect(await errorOf(toInspected(lot.id, plater.id))).toBe('none');
  });

  it('strip and replate voids the earlier readings, so the lot is measured again', async () => {
    const plater = await actorFor(db, PLATER);
    const supervisor = await actorFor(db, SUPERVISOR);
    const lot = await createLot(db, { quantity: 5 });
    const r = await recordReadings(plater, {
      workOrderId: lot.id,
      entry: 'manual',
      readings: [{ partNo: 1, location: 'flat', method: 'B499', thicknessUm: 3 }, { partNo: 2, location: 'flat', method: 'B499', thicknessUm: 9 }],
    });
    await dispositionNonconformance(supervisor, { nonconformanceId: r.nonconformanceId!, disposition: 'strip_and_replate', note: 'Replated in Z-ZN1' });
    const after = (await loadLot(db, lot.id))!;
    expect(after.readings).toHaveLength(0);
    expect(after.voidedReadingCount).toBe(2);
    expect(await errorOf(toInspected(lot.id, plater.id))).toMatch(/^CONFLICT: Thickness readings are missing: 0 of 2 sampled parts/);
  });

  it('a CSV with one bad row writes nothing and lists the row and column', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await createLot(db, { quantity: 10 });
    const bad = 'part,location,method,thickness_um\n1,head,B568,9.8\n2,head,B999,10.1\n3,,XRF,abc\n';
    const err = await recordReadingsCsv(plater, { workOrderId: lot.id, fileName: 'xrf.csv', bytes: new TextEncoder().encode(bad) }).catch((e) => e);
    expect(err.message).toBe('The file was not saved: 3 problems found. Nothing was written.');
    expect(err.problems).toEqual([
      { row: 3, column: 'method', message: '"B999" is not one of ASTM B568, B499, B244, B504, B487, B567.' },
      { row: 4, column: 'location', message: 'The location is empty.' },
      { row: 4, column: 'thickness_um', message: '"abc" is not a number.' },
    ]);
    expect((await loadLot(db, lot.id))!.readings).toHaveLength(0);

    const good = 'Part,Location,Thickness (mil)\n1,head,0.4\n2,head,0.41\n3,shank,0.39\n';
    const ok = await recordReadingsCsv(plater, { workOrderId: lot.id, fileName: 'magnetic.csv', bytes: new TextEncoder().encode(good), defaultMethod: 'B499' });
    expect(ok).toMatchObject({ count: 3, failCount: 0 });
    const readings = (await loadLot(db, lot.id))!.readings;
    // Source: NIST SP 811 App. B.8: 1 mil = 25.4 µm exactly.
    expect(readings.map((x) => x.thicknessUm)).toEqual([10.16, 10.414, 9.906]);
    expect(readings.every((x) => x.entry === 'csv' && x.method === 'B499')).toBe(true);
    const file = await db.selectFrom('thickness_readings').select('source_file_id').where('work_order_id', '=', lot.id).executeTakeFirstOrThrow();
    expect(file.source_file_id).toBeTruthy();
  });

  it('refuses readings for an order not yet plating, and lets only a supervisor void one', async () => {
    const plater = await actorFor(db, PLATER);
    const supervisor = await actorFor(db, SUPERVISOR);
    const early = await createLot(db, { state: 'received' });
    expect(await errorOf(recordReadings(plater, { workOrderId: early.id, entry: 'manual', readings: passingReadings(1) }))).toBe(
      'CONFLICT: Thickness readings are recorded between plating and inspection; this order is received.',
    );
    const lot = await createLot(db, {});
    await recordReadings(plater, { workOrderId: lot.id, entry: 'manual', readings: passingReadings(1) });
    const id = (await loadLot(db, lot.id))!.readings[0]!.id;
    expect(await errorOf(voidReading(plater, { readingId: id, reason: 'wrong part' }))).toBe('FORBIDDEN: Only a supervisor may void a thickness reading.');
    await voidReading(supervisor, { readingId: id, reason: 'measured the wrong part' });
    expect((await loadLot(db, lot.id))!.voidedReadingCount).toBe(1);
  });
});
