// The other process families through the app's own functions on the real test database: a quote
// line priced by its family, runs logged with current or with time and bath conditions, the
// family's lot records gating inspection and the certificate, and an electroless bath's age.
import { randomInt, randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { findBathAges } from '@/lib/bath/bath-age';
import { recordAddition } from '@/lib/bath/record';
import { updateTankSettings } from '@/lib/bath/tank-settings';
import { savePassivationWindow } from '@/lib/families/passivation/windows-store';
import { findCostedOrders, getJobCost } from '@/lib/orders/job-cost';
import { logPlatingRun, type RunInput } from '@/lib/orders/runs';
import { changeWorkOrderState } from '@/lib/orders/states';
import { issueCertificate } from '@/lib/quality/certificate';
import { recordProcessRecord } from '@/lib/quality/process/records';
import { recordReadings } from '@/lib/quality/thickness';
import { priceRequest } from '@/lib/quotes/pricing-context';
import { rateSetInForce } from '@/lib/quotes/pricing-context';
import { sessionUser } from '../billing/fixtures';
import { actorFor, errorOf, PLATER, SUPERVISOR } from '../quality/fixtures';

afterAll(() => db.destroy());

async function ids(partNumber: string, finishCode: string) {
  const part = await db.selectFrom('parts').select(['id', 'customer_id', 'area_dm2']).where('part_number', '=', partNumber).executeTakeFirstOrThrow();
  const finish = await db.selectFrom('finishes').select('id').where('code', '=', finishCode).executeTakeFirstOrThrow();
  return { part, finish };
}

/** A received work order of our own (W2099-…) on a demo part and finish. */
async function order(partNumber: string, finishCode: string, quantity: number): Promise<string> {
  const { part, finish } = await ids(partNumber, finishCode);
  const row = await db
    .insertInto('work_orders')
    .values({
      number: `W2099-${randomInt(1_000_000, 9_999_999)}`, customer_id: part.customer_id, part_id: part.id, finish_id: finish.id, po_number: `PO-F${randomInt(1000, 9999)}`,
      quantity_ordered: quantity, quantity_received: quantity, state: 'received', unit_price_cents: 100, pricing_basis: 'piece', total_cents: quantity * 100,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

const tankId = async (code: string) => (await db.selectFrom('tanks').select('id').where('code', '=', code).executeTakeFirstOrThrow()).id;

function run(workOrderId: string, tank: string, over: Partial<RunInput>): RunInput {
  return {
    workOrderId, tankId: tank, mode: 'time', currentA: undefined, meterStartAh: undefined, meterStopAh: undefined, minutesPerLoad: 30, loads: 1, partsPerLoad: 10,
    idempotencyKey: randomUUID(), confirmBelowMinimum: false, ...over,
  };
}

describe('pricing a quote line by its family', () => {
  it.each([
    ['HV-BODY-120', 'EN-B733-25', 'electroless_nickel', 'mto'],
    ['HV-ACT-6061', 'AN-8625-II', 'anodizing', 'ampHours'],
    ['HV-PST-7075', 'AN-8625-III', 'anodizing', 'diameter'],
    ['NGF-SS-0612', 'PS-A967-N2', 'passivation', 'occupancy'],
  ])('%s on %s is priced by %s and shows its figures', async (partNumber, finishCode, family, figure) => {
    const { part, finish } = await ids(partNumber, finishCode);
    const rateSet = await rateSetInForce(db);
    const priced = await priceRequest(db, { customerId: part.customer_id, partId: part.id, finishId: finish.id, quantity: 50, basis: 'piece', isRush: false, rateSetId: rateSet.id });
    expect(priced.price.family).toBe(family);
    expect(priced.price.figures!.some((f) => f.key === figure)).toBe(true);
    expect(priced.price.totalCents).toBeGreaterThan(0);
    expect(Number.isSafeInteger(priced.price.totalCents)).toBe(true);
  });

  it('picks the tank of the hard anodize for Type III, not the Type II tank or the seal', async () => {
    const { part, finish } = await ids('HV-PST-7075', 'AN-8625-III');
    const rateSet = await rateSetInForce(db);
    const priced = await priceRequest(db, { customerId: part.customer_id, partId: part.id, finishId: finish.id, quantity: 40, basis: 'piece', isRush: false, rateSetId: rateSet.id });
    expect(priced.tankCode).toBe('A-HC1');
    // The tank's measured constant (3.35, the demo shop's) replaces the 720 rule.
    expect(priced.price.figures!.find((f) => f.key === 'constant')).toMatchObject({ value: 3.35, label: "Constant (the tank's measured constant)" });
  });
});

describe('runs by family', () => {
  it('an electroless run records time and temperature, no amp-hours, and predicts thickness from the rate', async () => {
    const plater = await sessionUser(PLATER);
    const wo = await order('HV-BODY-120', 'EN-B733-25', 10);
    // 15 µm/h for 110 min = 27.5 µm average; × 0.95 = 26.1 µm on the thinnest surface (≥ 25).
    const r = await logPlatingRun(plater, run(wo, await tankId('E-EN1'), { minutesPerLoad: 110, temperature: 190, temperatureUnit: 'degF' }));
    expect(r.prediction!.averageThicknessUm).toBeCloseTo(27.5, 9);
    expect(r.prediction!.isBelowMinimum).toBe(false);
    const row = await db.selectFrom('plating_runs').select(['amp_hours', 'conditions']).where('id', '=', r.id).executeTakeFirstOrThrow();
    expect(row.amp_hours).toBeNull();
    // 190 °F = 87.78 °C (NIST SP 811: t/°C = (t/°F − 32)/1.8)
    expect(row.conditions.temperatureC).toBeCloseTo(87.778, 3);
  });

  it('refuses current for a family that runs without it, and a tank of another family', async () => {
    const plater = await sessionUser(PLATER);
    const wo = await order('HV-BODY-120', 'EN-B733-25', 10);
    expect(await errorOf(logPlatingRun(plater, run(wo, await tankId('E-EN1'), { mode: 'amps', currentA: 10 })))).toBe('BAD_INPUT: Electroless nickel runs without current: enter the time and the bath conditions.');
    expect(await errorOf(logPlatingRun(plater, run(wo, await tankId('N-NI1'), {})))).toBe('BAD_INPUT: Choose an active tank that runs this finish.');
    expect(await db.selectFrom('plating_runs').select('id').where('work_order_id', '=', wo).execute()).toEqual([]);
  });

  it('an anodizing run predicts the coating from its charge by the 720 rule', async () => {
    const plater = await sessionUser(PLATER);
    const wo = await order('HV-ACT-6061', 'AN-8625-II', 10);
    // 10 × 1.45 dm² at 1.5 A/dm² = 21.75 A for 30 min = 10.875 A·h → 652.5 A·min over 14.5 dm² ÷ 3.0512 = 14.75 µm.
    const r = await logPlatingRun(plater, run(wo, await tankId('A-AN1'), { mode: 'amps', currentA: 21.75, minutesPerLoad: 30 }));
    expect(r.prediction!.averageThicknessUm).toBeCloseTo(14.748, 2);
  });

  it('a passivation run outside its window is recorded as it was and opens a nonconformance (ASTM A967 Nitric 2)', async () => {
    const plater = await sessionUser(PLATER);
    const wo = await order('NGF-SS-0612', 'PS-A967-N2', 200);
    const r = await logPlatingRun(plater, run(wo, await tankId('P-NT1'), { minutesPerLoad: 20, temperature: 25, concentration: 30, partsPerLoad: 200 }));
    expect(r.prediction!.outsideWindow).toEqual(['20 min is shorter than the 30 min ASTM A967 Nitric 2 needs at 21–32 °C.']);
    const nc = await db.selectFrom('nonconformances').select(['id', 'description']).where('id', '=', r.nonconformanceId!).executeTakeFirstOrThrow();
    expect(nc.description).toBe('Run on P-NT1 outside the process window: 20 min is shorter than the 30 min ASTM A967 Nitric 2 needs at 21–32 °C.');
    // Missing the concentration is a field error, and nothing is stored.
    expect(await errorOf(logPlatingRun(plater, run(wo, await tankId('P-NT1'), { temperature: 25, concentration: undefined })))).toBe('BAD_INPUT: Enter the acid concentration of the latest analysis.');
  });
});

describe("the shop's passivation windows", () => {
  it('an edited window is what runs are judged by, and a bad edit is refused with nothing saved', async () => {
    const supervisor = await sessionUser(SUPERVISOR);
    const plater = await sessionUser(PLATER);
    const before = await db.selectFrom('settings').select('value').where('key', '=', 'passivation_windows').executeTakeFirst();
    expect(await errorOf(savePassivationWindow(supervisor, { id: 'a967-nitric-2', concentration: { min: 30, max: 20 }, bands: [{ minC: 21, maxC: 32, minMinutes: 30 }], source: 'x' }))).toBe('BAD_INPUT: Check the highlighted figures; nothing was saved.');
    expect((await db.selectFrom('settings').select('value').where('key', '=', 'passivation_windows').executeTakeFirst())?.value).toEqual(before?.value);
    expect(await errorOf(savePassivationWindow(plater, { id: 'a967-nitric-2' }))).toBe('FORBIDDEN: You are not allowed to do this.');
    // The customer's own specification asks 45 min in the lowest band.
    await savePassivationWindow(supervisor, { id: 'a967-nitric-2', concentration: { min: 20, max: 45 }, bands: [{ minC: 21, maxC: 32, minMinutes: 45 }, { minC: 38, maxC: 52, minMinutes: 20 }, { minC: 49, maxC: 60, minMinutes: 10 }], source: 'Customer specification PS-12 rev C' });
    try {
      const wo = await order('NGF-SS-0612', 'PS-A967-N2', 100);
      const r = await logPlatingRun(plater, run(wo, await tankId('P-NT1'), { minutesPerLoad: 30, temperature: 25, concentration: 25, partsPerLoad: 100 }));
      expect(r.prediction!.outsideWindow).toEqual(['30 min is shorter than the 45 min ASTM A967 Nitric 2 needs at 21–32 °C.']);
      expect(r.nonconformanceId).not.toBeNull();
    } finally {
      // Back to the standard's figures for the other tests.
      await db.deleteFrom('settings').where('key', '=', 'passivation_windows').execute();
    }
  });
});

describe('job costing by family', () => {
  it('costs an electroless run by the nickel its deposit took and its share of the bath life', async () => {
    const plater = await sessionUser(PLATER);
    const wo = await order('HV-BODY-120', 'EN-B733-25', 10);
    await logPlatingRun(plater, run(wo, await tankId('E-EN1'), { minutesPerLoad: 110, temperature: 88 }));
    const cost = (await getJobCost(wo))!;
    const rows = Object.fromEntries(cost.rows.map((r) => [r.key, r.actualCents]));
    // 10 × 4.6 dm² × 27.5 µm (15 µm/h × 110 min) = 12.65 cm³ × 7.955 g/cm³ (8 % P, table from memory) × 0.92 Ni = 92.6 g × $22/kg.
    const nickelG = 46 * 27.5 * 0.01 * (8.5 - (0.6 * 5) / 5.5) * 0.92;
    expect(rows.metal).toBe(Math.round((nickelG / 1000) * 2200));
    // ÷ (400 L × 6 g/L) = 0.0386 MTO × ($1 840 + $960) ÷ 8 MTO (the demo tank's costs).
    expect(rows.bathLife).toBe(Math.round((nickelG / 2400) * (280000 / 8)));
    expect(rows.power).toBe(0);
  });

  it('costs every plated order of the demo without a refusal, whatever its family', async () => {
    const rows = await findCostedOrders({ from: '2020-01-01', to: '2099-12-31' });
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.every((r) => Number.isSafeInteger(r.comparison.actualCostCents))).toBe(true);
  });
});

describe('the family records a certificate waits for', () => {
  it('an anodized lot: refused without its seal test, issued with it, and the certificate names the process', async () => {
    const plater = await sessionUser(PLATER);
    const supervisor = await actorFor(db, SUPERVISOR);
    const wo = await order('HV-ACT-6061', 'AN-8625-II', 10);
    await logPlatingRun(plater, run(wo, await tankId('A-AN1'), { mode: 'amps', currentA: 21.75, minutesPerLoad: 30 }));
    await db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId: wo, to: 'plated', actorId: supervisor.id, note: '' }));
    await recordReadings(supervisor, { workOrderId: wo, entry: 'manual', readings: Array.from({ length: 10 }, (_, i) => ({ partNo: i + 1, location: 'face', method: 'B244' as const, thicknessUm: 12 + (i % 3) })) }, db);
    // Inspection itself asks for the seal test.
    expect(await errorOf(db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId: wo, to: 'inspected', actorId: supervisor.id, note: '' })))).toMatch(/The seal quality test has not been recorded\./);
    expect(await errorOf(issueCertificate(supervisor, wo))).toMatch(/The seal quality test has not been recorded\./);
    // A seal test is not an electroless record, and a failing one still blocks.
    await recordProcessRecord(supervisor, { kind: 'seal_test', workOrderId: wo, method: 'acid_dissolution', result: 45, limit: 30, notes: '' });
    expect(await errorOf(issueCertificate(supervisor, wo))).toMatch(/The latest seal quality test fails: .*45 mg\/dm² is above the limit of 30 mg\/dm²\./);
    await recordProcessRecord(supervisor, { kind: 'seal_test', workOrderId: wo, method: 'dye_spot', result: 1, limit: 2, notes: '' });
    await db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId: wo, to: 'inspected', actorId: supervisor.id, note: '' }));
    const cert = await issueCertificate(supervisor, wo);
    expect(cert.content.process).toMatchObject({ family: 'Anodizing', reportsThickness: true });
    expect(cert.content.process!.statement).toBe('Anodized in sulfuric acid (Type II), sealed in hot deionised water; coating thickness measured by eddy current (ASTM B244), to MIL-A-8625 Type II Class 1, sealed.');
    expect(cert.content.process!.records.map((r) => r.verdict)).toEqual(['fail', 'pass']);
  });

  it('refuses a record of another family', async () => {
    const supervisor = await actorFor(db, SUPERVISOR);
    const wo = await order('HV-BODY-120', 'EN-B733-25', 10);
    await db.updateTable('work_orders').set({ state: 'in_process' }).where('id', '=', wo).execute();
    expect(await errorOf(recordProcessRecord(supervisor, { kind: 'seal_test', workOrderId: wo, method: 'dye_spot', result: 1, limit: 2, notes: '' }))).toBe('BAD_INPUT: A seal quality test is not a record of electroless nickel.');
    expect(await db.selectFrom('process_records').select('id').where('work_order_id', '=', wo).execute()).toEqual([]);
  });
});

describe('an electroless bath’s age', () => {
  it('counts nickel additions since make-up and raises one end-of-life alert', async () => {
    const plater = await sessionUser(PLATER);
    const supervisor = await sessionUser(SUPERVISOR);
    const tank = await tankId('E-EN1');
    const before = (await findBathAges([tank])).get(tank)!;
    expect(before.metalTurnovers).toBeGreaterThan(0); // the demo's replenishment history
    // End of life just above today's age: one more addition crosses it.
    await updateTankSettings(supervisor, {
      tankId: tank, madeUpOn: null, units: { thickness: 'um', temperature: 'degC' },
      form: { ts_nickelMakeUpGPerL: '6', ts_endOfLifeMto: String(Math.ceil((before.metalTurnovers + 0.1) * 100) / 100), ts_makeUpCostCents: '1840', ts_disposalCostCents: '960' },
    });
    const settings = (await db.selectFrom('tanks').select('family_settings').where('id', '=', tank).executeTakeFirstOrThrow()).family_settings;
    expect(settings).toMatchObject({ nickelMakeUpGPerL: 6, makeUpCostCents: 184000, disposalCostCents: 96000 });
    const nickel = await db.selectFrom('tank_analytes').select('id').where('tank_id', '=', tank).where('key', '=', 'nickel').executeTakeFirstOrThrow();
    // 400 L × 6 g/L × 0.2 MTO = 480 g Ni = 2.15 kg NiSO4·6H2O (22.33 % Ni).
    await recordAddition(plater, { tankId: tank, analyteId: nickel.id, kind: 'correction', material: 'Nickel sulfate hexahydrate', amount: 2.15, unit: 'kg', madeAt: new Date(), key: `t-${randomUUID()}` });
    const after = (await findBathAges([tank])).get(tank)!;
    expect(after.metalTurnovers - before.metalTurnovers).toBeCloseTo((2150 * 0.22330) / 2400, 3);
    expect(after.atEndOfLife).toBe(true);
    const alerts = await db.selectFrom('bath_alerts').select(['kind', 'message']).where('tank_id', '=', tank).where('kind', '=', 'end_of_life').where('state', '<>', 'acknowledged').execute();
    expect(alerts).toHaveLength(1);
    expect(alerts[0]!.message).toMatch(/^E-EN1 Electroless nickel: \d+\.\d\d of [\d.]+ metal turnovers, the end of life set for this bath\./);
    // A second addition counts on the same alert, not a new one.
    await recordAddition(plater, { tankId: tank, analyteId: nickel.id, kind: 'correction', material: 'Nickel sulfate hexahydrate', amount: 1, unit: 'kg', madeAt: new Date(), key: `t-${randomUUID()}` });
    expect(await db.selectFrom('bath_alerts').select('id').where('tank_id', '=', tank).where('kind', '=', 'end_of_life').where('state', '<>', 'acknowledged').execute()).toHaveLength(1);
    // Settings go through the family's schema: a negative end of life is refused, nothing changes.
    expect(await errorOf(updateTankSettings(supervisor, { tankId: tank, madeUpOn: null, units: { thickness: 'um', temperature: 'degC' }, form: { ts_nickelMakeUpGPerL: '6', ts_endOfLifeMto: '-2' } }))).toBe('BAD_INPUT: Check the highlighted settings.');
    await updateTankSettings(supervisor, { tankId: tank, madeUpOn: null, units: { thickness: 'um', temperature: 'degC' }, form: { ts_nickelMakeUpGPerL: '6', ts_endOfLifeMto: '8', ts_makeUpCostCents: '1840', ts_disposalCostCents: '960' } });
  });
});
