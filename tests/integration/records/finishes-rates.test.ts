import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { saveFinish } from '@/lib/finishes/mutations';
import { finishSchema } from '@/lib/finishes/schemas';
import { saveRateSet } from '@/lib/rates/mutations';
import { databaseToday, findRateSets, getRateSetInForce } from '@/lib/rates/queries';
import { rateSetSchema } from '@/lib/rates/schemas';
import { inRolledBackTransaction, refusalOf, sessionUserByEmail, uniqueSuffix } from './helpers';

afterAll(() => db.destroy());


const FINISH_FORM = {
  finishId: '',
  name: 'Bright nickel 10 µm',
  specText: 'ASTM B456 SC2',
  route: 'Electroclean\nAcid activate | 10 % sulfuric\nBright nickel plate',
  metal: 'Ni2+',
  minThickness: '0.4',
  maxThickness: '',
  thicknessUnit: 'mil',
  method: 'rack',
  currentDensity: '40',
  currentDensityUnit: 'A/ft2',
  efficiencyPercent: '95',
  distributionRatio: '0.7',
  tankVolts: '6',
  partsPerLoad: '60',
  handlingMinutesPerLoad: '12',
  maskingPerPiece: '0.35',
  bakeRequired: 'on',
  bakeThresholdHrc: '31',
  bakeWindowHours: '4',
  bakeTemp: '400',
  temperatureUnit: 'degF',
  bakeHours: '8',
  lineId: '',
  isActive: 'on',
};

describe('finishes', () => {
  it('converts the user’s units to stored ones and saves the route', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const input = finishSchema.parse({ ...FINISH_FORM, code: `T-${uniqueSuffix()}`.slice(0, 24) });
      const { finishId } = await saveFinish(estimator, input, trx);
      const f = await trx.selectFrom('finishes').selectAll().where('id', '=', finishId).executeTakeFirstOrThrow();
      // Source: NIST SP 811 App. B.8 — 1 mil = 25.4 µm; 1 ft² = 9.290304 dm²; t/°C = (t/°F − 32)/1.8.
      expect(f.min_thickness_um).toBeCloseTo(10.16, 9);
      expect(f.current_density_adm2).toBeCloseTo(40 / 9.290304, 9);
      expect(f.bake_temp_c).toBeCloseTo(204.444444, 5);
      expect(f).toMatchObject({ efficiency: 0.95, masking_per_piece_cents: 35, element: 'Ni', ion_charge: 2, bake_required: true });
      expect(f.process_route).toEqual([{ step: 'Electroclean' }, { step: 'Acid activate', note: '10 % sulfuric' }, { step: 'Bright nickel plate' }]);
    });
  });

  it('refuses a plater and a taken code, and asks for the bake figures when a bake is required', async () => {
    await inRolledBackTransaction(async (trx) => {
      const [plater, owner] = await Promise.all([sessionUserByEmail('plater@kestrel-plating.test'), sessionUserByEmail('owner@kestrel-plating.test')]);
      expect(await refusalOf(saveFinish(plater, finishSchema.parse({ ...FINISH_FORM, code: 'NEW-ONE' }), trx))).toBe('FORBIDDEN: You are not allowed to do this.');
      expect(await refusalOf(saveFinish(owner, finishSchema.parse({ ...FINISH_FORM, code: 'AG-B700-5' }), trx))).toBe('CONFLICT: Check the highlighted field. {"code":["Another finish already uses the code AG-B700-5."]}');
      const r = finishSchema.safeParse({ ...FINISH_FORM, code: 'X1', bakeTemp: '', bakeHours: '', maskingPerPiece: '0.355', efficiencyPercent: '120' });
      expect(r.error?.issues.map((i) => i.path[0]).sort()).toEqual(['bakeHours', 'bakeTemp', 'efficiencyPercent', 'maskingPerPiece']);
      expect(await trx.selectFrom('finishes').select('id').where('code', '=', 'NEW-ONE').executeTakeFirst()).toBeUndefined();
    });
  });
});

const RATES = {
  rateSetId: '',
  labourPerHour: '45.50',
  tankHourRack: '36',
  tankHourBarrel: '29.00',
  additivesPerKah: '1.85',
  powerPerKwh: '0.15',
  bakePerLoad: '47',
  lotCharge: '$40',
  minimumCharge: '1,250.00',
  metal_Ni: '23.10',
  metal_Zn: '',
  rushMultiplierPct: '150',
  marginPct: '35',
  quoteValidDays: '30',
};

function addDays(day: string, n: number): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}

describe('rate sets', () => {
  it('parses dollars exactly and refuses a third decimal', () => {
    const ok = rateSetSchema.parse({ ...RATES, effectiveFrom: '2030-01-01' });
    expect(ok).toMatchObject({ labour_per_hour_cents: 4550, lot_charge_cents: 4000, minimum_charge_cents: 125_000, power_per_kwh_cents: 15, metal_per_kg_cents: { Ni: 2310 } });
    const bad = rateSetSchema.safeParse({ ...RATES, effectiveFrom: '2030-01-01', labourPerHour: '12.345' });
    expect(bad.error?.issues.map((i) => i.path[0])).toEqual(['labourPerHour']);
  });

  it('refuses a date that is not one with a message, never an exception', () => {
    // 'NaN' once reached a Date conversion that throws (found by the hostile-input run).
    for (const effectiveFrom of ['NaN', '2030-02-30', '2030-13-01', '', '١٢٣٤-٠١-٠١']) {
      const r = rateSetSchema.safeParse({ ...RATES, effectiveFrom });
      expect(r.success, effectiveFrom).toBe(false);
      expect(r.error?.issues.map((i) => i.path[0]), effectiveFrom).toContain('effectiveFrom');
    }
  });

  it('adds a future set, edits it while scheduled, and keeps the set in force read-only', async () => {
    await inRolledBackTransaction(async (trx) => {
      const owner = await sessionUserByEmail('owner@kestrel-plating.test');
      const today = await databaseToday(trx);
      const later = addDays(today, 400 + Math.floor(Math.random() * 300));
      const { rateSetId } = await saveRateSet(owner, rateSetSchema.parse({ ...RATES, effectiveFrom: later }), trx);
      await saveRateSet(owner, rateSetSchema.parse({ ...RATES, rateSetId, effectiveFrom: later, labourPerHour: '46' }), trx);
      const sets = await findRateSets(today, trx);
      expect(sets.find((s) => s.id === rateSetId)).toMatchObject({ status: 'scheduled', labour_per_hour_cents: 4600, effective_day: later });
      expect((await getRateSetInForce(later, trx))?.id).toBe(rateSetId);
      const inForce = sets.find((s) => s.status === 'in force')!;
      expect(inForce.effective_day <= today).toBe(true);
      expect(await refusalOf(saveRateSet(owner, rateSetSchema.parse({ ...RATES, rateSetId: inForce.id, effectiveFrom: addDays(today, 1) }), trx))).toBe(
        'CONFLICT: This rate set has taken effect and is kept as it was. Add a new set with a later date instead.',
      );
    });
  });

  it('refuses an estimator, a date in the past and a second set on the same date, writing nothing for each', async () => {
    await inRolledBackTransaction(async (trx) => {
      const [estimator, owner] = await Promise.all([sessionUserByEmail('estimator@kestrel-plating.test'), sessionUserByEmail('owner@kestrel-plating.test')]);
      const today = await databaseToday(trx);
      const before = (await findRateSets(today, trx)).length;
      expect(await refusalOf(saveRateSet(estimator, rateSetSchema.parse({ ...RATES, effectiveFrom: addDays(today, 30) }), trx))).toBe('FORBIDDEN: You are not allowed to do this.');
      expect(await refusalOf(saveRateSet(owner, rateSetSchema.parse({ ...RATES, effectiveFrom: addDays(today, -1) }), trx))).toMatch(/^BAD_INPUT: Check the highlighted field. \{"effectiveFrom":\["Rates cannot take effect in the past/);
      expect((await findRateSets(today, trx)).length).toBe(before);
      const later = addDays(today, 800);
      await saveRateSet(owner, rateSetSchema.parse({ ...RATES, effectiveFrom: later }), trx);
      expect(await refusalOf(saveRateSet(owner, rateSetSchema.parse({ ...RATES, effectiveFrom: later }), trx))).toBe(
        'CONFLICT: Check the highlighted field. {"effectiveFrom":["Another rate set already takes effect on that date. Edit that one instead."]}',
      );
      expect((await findRateSets(today, trx)).length).toBe(before + 1);
    });
  });
});
