// The families' bath methods, bath age, decant calculator, lot records and lot checks. Factors are
// computed from IUPAC atomic weights (lib/chemistry) and the reaction's stoichiometry, named beside each.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { getMethod } from '@/lib/bath/methods';
import { computeAnalysis, factorPerMl, type TitrationMethod } from '@/lib/bath/methods/titration';
import { aluminiumDecant } from '@/lib/families/anodizing/bath';
import { bathAge, nickelGrams } from '@/lib/families/electroless-nickel/bath-age';
import { NITRIC_G_PER_L_PER_VOL_PCT } from '@/lib/families/passivation/bath';
import { finishSchema } from '@/lib/finishes/schemas';
import { inspectionChecks, lotChecks, passivationLotCheck } from '@/lib/quality/lot-checks';
import type { LotProcessRecord } from '@/lib/quality/lot-types';
import { judgeProcessRecord, processRecordSchema } from '@/lib/quality/process/rules';
import { makeLot, reading } from '../quality/lot-factory';

const titration = (id: string) => getMethod(id) as TitrationMethod;

describe('family analysis methods (factors computed from IUPAC 2021 atomic weights)', () => {
  it.each([
    // Ni 58.6934 × 0.05 M ÷ 5 mL (EDTA 1 : 1)
    ['en-nickel-edta', 0.5869],
    // NaH2PO2·H2O 105.99 × 0.1 M ÷ 4 (four thiosulfates a hypophosphite) ÷ 1 mL effective sample
    ['hypophosphite-iodometric', 2.65],
    // H2SO4 98.072 × 1 M ÷ 2 ÷ 5 mL
    ['anodize-free-sulfuric-naoh', 9.807],
    // HNO3 63.012 × 1 M ÷ 5 mL
    ['nitric-acid-naoh', 12.602],
    // C6H8O7 192.12 × 1 M ÷ 3 (triprotic) ÷ 10 mL
    ['citric-acid-naoh', 6.404],
  ])('%s: %f g/L per mL', (id, factor) => {
    expect(factorPerMl(titration(id))).toBeCloseTo(factor, 3);
  });

  it('reads a back-titration as blank less burette, and refuses a burette above the blank or no blank', () => {
    const m = titration('hypophosphite-iodometric');
    const r = computeAnalysis(m, { buretteMl: 38.7, blankMl: 50 });
    expect(r.ok && r.value).toBeCloseTo(11.3 * 2.65, 2);
    expect(computeAnalysis(m, { buretteMl: 51, blankMl: 50 })).toMatchObject({ ok: false, field: 'buretteMl', message: expect.stringMatching(/above the blank/) });
    expect(computeAnalysis(m, { buretteMl: 20 })).toMatchObject({ ok: false, field: 'blankMl', message: expect.stringMatching(/Enter the blank/) });
  });

  it('converts A967 Nitric 2 (20–45 vol %) to the tank card’s g/L at 67 % acid of 1.40 kg/L (from memory)', () => {
    expect(20 * NITRIC_G_PER_L_PER_VOL_PCT).toBeCloseTo(187.6, 1);
    expect(45 * NITRIC_G_PER_L_PER_VOL_PCT).toBeCloseTo(422.1, 1);
  });
});

describe('electroless bath age', () => {
  it('counts nickel sulfate by its formula: 10 kg NiSO4·6H2O holds 2233 g nickel (58.693 ÷ 262.85, IUPAC)', () => {
    expect(nickelGrams({ amount: 10, unit: 'kg', supply: { kind: 'salt', saltId: 'nickel-sulfate-hexahydrate' } })).toBeCloseTo(2232.9, 0);
    // An additive or a wrong unit adds no nickel.
    expect(nickelGrams({ amount: 10, unit: 'L', supply: { kind: 'salt', saltId: 'nickel-sulfate-hexahydrate' } })).toBe(0);
    expect(nickelGrams({ amount: 10, unit: 'kg', supply: { kind: 'as_measured', name: 'hypophosphite' } })).toBe(0);
  });

  it('is metal turnovers against the end of life the shop set', () => {
    const additions = [{ amount: 10, unit: 'kg' as const, supply: { kind: 'salt' as const, saltId: 'nickel-sulfate-hexahydrate' } }];
    const young = bathAge({ additions, volumeL: 400, settings: { nickelMakeUpGPerL: 6, endOfLifeMto: 8 } });
    expect(young.metalTurnovers).toBeCloseTo(2232.9 / 2400, 3);
    expect(young.atEndOfLife).toBe(false);
    expect(young.text).toBe('0.93 of 8 metal turnovers');
    expect(bathAge({ additions, volumeL: 400, settings: { nickelMakeUpGPerL: 6, endOfLifeMto: 0.9 } }).atEndOfLife).toBe(true);
  });
});

describe('aluminium decant and refill (a mass balance)', () => {
  it('takes out V × (c − t) ÷ c and refills with fresh acid at target', () => {
    const r = aluminiumDecant({ volumeL: 2500, aluminiumGPerL: 18, targetAluminiumGPerL: 9, acidTargetGPerL: 180 });
    expect(r.decantL).toBe(1250);
    expect(r.sulfuricAcidKg).toBe(225);
    expect(aluminiumDecant({ volumeL: 2500, aluminiumGPerL: 8, targetAluminiumGPerL: 9, acidTargetGPerL: 180 }).decantL).toBe(0);
    expect(() => aluminiumDecant({ volumeL: 0, aluminiumGPerL: 8, targetAluminiumGPerL: 4, acidTargetGPerL: 180 })).toThrow(/volume/);
  });
});

const rec = (over: Partial<LotProcessRecord>): LotProcessRecord => ({
  id: 'pr-1', kind: 'seal_test', method: 'dye_spot', values: { result: 1, limit: 2, unit: 'rating' }, verdict: 'pass', reasons: [], notes: '',
  recordedAt: new Date('2026-06-11T10:00:00Z'), recordedByName: 'Ada', ...over,
});

describe('family lot records', () => {
  it('judges a seal test, phosphorus and salt spray against the limits the specification gives', () => {
    expect(judgeProcessRecord({ kind: 'seal_test', workOrderId: 'x', method: 'acid_dissolution', result: 42, limit: 30, notes: '' })).toMatchObject({
      verdict: 'fail',
      reasons: ['Acid dissolution mass loss (ASTM B680, ISO 3210): 42 mg/dm² is above the limit of 30 mg/dm².'],
    });
    expect(judgeProcessRecord({ kind: 'phosphorus_content', workOrderId: 'x', method: 'xrf', phosphorusWtPct: 9.4, minPct: 5, maxPct: 9, notes: '' }).verdict).toBe('fail');
    expect(judgeProcessRecord({ kind: 'salt_spray', workOrderId: 'x', method: 'astm_b117', hours: 96, requiredHours: 120, passed: true, notes: '' }).reasons).toEqual([
      '96 h in the cabinet is less than the 120 h the specification asks.',
    ]);
  });

  it('refuses a bad record with a field message (property)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.double(), fc.constant('')), fc.constantFrom('seal_test', 'phosphorus_content', 'salt_spray'), (value, kind) => {
        const r = processRecordSchema.safeParse({ kind, workOrderId: '00000000-0000-4000-8000-000000000001', method: 'x', result: value, limit: value, phosphorusWtPct: value, minPct: value, maxPct: value, hours: value, requiredHours: value, passed: value });
        if (!r.success) for (const issue of r.error.issues) expect(issue.message.length).toBeGreaterThan(3);
      }),
    );
  });

  it('asks each family for its own records before inspection', () => {
    const keys = (lot: ReturnType<typeof makeLot>) => inspectionChecks(lot).map((c) => c.key);
    expect(keys(makeLot())).toEqual(['thickness_count', 'thickness_pass', 'nonconformance']);
    const anodized = makeLot({ finish: { ...makeLot().finish, family: 'anodizing', familyParams: { coatingType: 'II', growthFraction: 0.33, seal: 'hot_water', sealMinutes: 30 } } });
    expect(keys(anodized)).toEqual(['thickness_count', 'thickness_pass', 'seal_test', 'nonconformance']);
    const missing = inspectionChecks(anodized).find((c) => c.key === 'seal_test')!;
    expect(missing).toMatchObject({ ok: false, message: 'The seal quality test has not been recorded.' });
    const sealed = { ...anodized, processRecords: [rec({})] };
    expect(inspectionChecks(sealed).find((c) => c.key === 'seal_test')).toMatchObject({ ok: true, message: 'Seal quality test passes: Dye-spot test (ASTM B136, ISO 2143): 1 rating (limit 2 rating).' });
    const failed = { ...anodized, processRecords: [rec({}), rec({ id: 'pr-2', verdict: 'fail', reasons: ['too dark'], recordedAt: new Date('2026-06-11T11:00:00Z') })] };
    expect(inspectionChecks(failed).find((c) => c.key === 'seal_test')!.ok).toBe(false);
    // A zinc finish asking for salt-spray hours needs that record too.
    const zinc = makeLot({ finish: { ...makeLot().finish, family: 'electroplating', familyParams: { saltSprayHours: 120 } } });
    expect(keys(zinc)).toContain('salt_spray');
  });

  it('judges a passivated lot run by run against its window (ASTM A967 §5.2.2)', () => {
    const finish = { ...makeLot().finish, family: 'passivation' as const, familyParams: { windowId: 'a967-nitric-2', minutes: 30, temperatureC: 27, concentration: 25, verificationTest: 'water_immersion' } };
    const run = (temperatureC: number) => ({ ...makeLot().runs[0]!, ampHours: null, conditions: { temperatureC, concentration: 25 }, startedAt: new Date('2026-06-10T13:00:00Z'), endedAt: new Date('2026-06-10T13:30:00Z') });
    const inside = makeLot({ finish, runs: [run(27)] });
    expect(passivationLotCheck(inside, 'a967-nitric-2')).toMatchObject({ ok: true });
    expect(lotChecks(inside).map((c) => c.key)).toEqual(['runs', 'passivation_lot', 'passivation_test', 'bake', 'nonconformance']);
    const outside = makeLot({ finish, runs: [run(27), run(35)] });
    expect(passivationLotCheck(outside, 'a967-nitric-2')).toMatchObject({ ok: false, message: "1 run was outside the treatment's window: a nonconformance needs the customer's disposition." });
    const accepted = makeLot({
      finish, runs: [run(35)],
      nonconformances: [{ id: 'n', source: 'other', description: 'x', openedAt: new Date(), openedByName: null, disposition: 'use_as_is', customerApprovalRef: 'OK-1', dispositionNote: null, dispositionedAt: new Date(), dispositionedByName: null, closedAt: new Date() }],
    });
    expect(passivationLotCheck(accepted, 'a967-nitric-2').ok).toBe(true);
    // No thickness is asked of a passivated lot.
    expect(inspectionChecks(inside).some((c) => c.key.startsWith('thickness'))).toBe(false);
    void reading;
  });
});

describe('the finish form by family', () => {
  const common = {
    finishId: '', code: 'AN-TEST', name: 'Anodize test', specText: '', route: 'Clean\nAnodize', thicknessUnit: 'um', method: 'rack', currentDensityUnit: 'A/dm2',
    distributionRatio: '0.9', tankVolts: '15', partsPerLoad: '10', handlingMinutesPerLoad: '10', maskingPerPiece: '', bakeWindowHours: '4', bakeTemp: '',
    temperatureUnit: 'degC', bakeHours: '', bakeThresholdHrc: '', lineId: '', isActive: 'on', maxThickness: '',
  };

  it("stores an anodizing finish's own figures and needs no cathode efficiency", () => {
    const r = finishSchema.safeParse({ ...common, family: 'anodizing', minThickness: '25', currentDensity: '1.5', fp_coatingType: 'III', fp_growthFraction: '0.5', fp_seal: 'none', fp_sealMinutes: '0' });
    expect(r.success).toBe(true);
    expect(r.data).toMatchObject({ family: 'anodizing', element: 'Al', efficiency: null, current_density_adm2: 1.5 });
    expect(JSON.parse(r.data!.family_params as string)).toEqual({ coatingType: 'III', growthFraction: 0.5, seal: 'none', sealMinutes: 0 });
  });

  it('converts an electroless rate typed in mil/h (US units, NIST SP 811: 1 mil = 25.4 µm)', () => {
    const r = finishSchema.safeParse({ ...common, family: 'electroless_nickel', thicknessUnit: 'mil', minThickness: '1', fp_depositionRateUmPerH: '0.6', fp_phosphorusWtPct: '8' });
    expect(r.success).toBe(true);
    expect(JSON.parse(r.data!.family_params as string).depositionRateUmPerH).toBeCloseTo(15.24, 9);
    expect(r.data!.min_thickness_um).toBeCloseTo(25.4, 9);
  });

  it('gives every bad family field a message on its own field, and never throws (property)', () => {
    fc.assert(
      fc.property(fc.constantFrom('anodizing', 'electroless_nickel', 'passivation'), fc.oneof(fc.string(), fc.constant('NaN'), fc.constant('-3'), fc.constant('1e9')), (family, junk) => {
        const r = finishSchema.safeParse({ ...common, family, minThickness: '10', currentDensity: '1', fp_coatingType: junk, fp_growthFraction: junk, fp_seal: junk, fp_sealMinutes: junk, fp_depositionRateUmPerH: junk, fp_phosphorusWtPct: junk, fp_windowId: junk, fp_minutes: junk, fp_temperatureC: junk, fp_concentration: junk, fp_verificationTest: junk });
        if (!r.success) {
          const paths = r.error.issues.map((i) => String(i.path[0]));
          expect(paths.every((p) => p.startsWith('fp_'))).toBe(true);
        }
      }),
    );
  });
});

describe("the shop's passivation windows", () => {
  it('replaces a default by a valid edit, keeps the rest, and ignores a stored window that makes no sense', async () => {
    const { windowsInForce, windowsOf } = await import('@/lib/families/passivation/windows');
    const { checkPassivation } = await import('@/lib/plating');
    const edited = windowsInForce([
      { id: 'a967-nitric-2', concentration: { min: 20, max: 30 }, bands: [{ minC: 21, maxC: 32, minMinutes: 45 }], source: 'Customer spec PS-12 rev C' },
      { id: 'a967-citric-1', concentration: { min: 10, max: 4 }, bands: [{ minC: 60, maxC: 71, minMinutes: 4 }], source: 'upside down' },
    ]);
    const n2 = edited.find((w) => w.id === 'a967-nitric-2')!;
    expect(n2).toMatchObject({ standard: 'ASTM A967', treatment: 'Nitric 2', concentration: { min: 20, max: 30, unit: 'vol %' }, source: 'Customer spec PS-12 rev C' });
    expect(edited.find((w) => w.id === 'a967-citric-1')!.concentration).toEqual({ min: 4, max: 10, unit: 'wt %' }); // the bad edit is not used
    // 30 min at 25 °C passes the standard's default and fails the shop's stricter 45 min.
    const lot = { windowId: 'a967-nitric-2', temperatureC: 25, minutes: 30, concentration: 25 };
    expect(checkPassivation(lot).ok).toBe(true);
    expect(checkPassivation(lot, windowsOf({ passivationWindows: edited })).ok).toBe(false);
    expect(windowsOf(undefined).length).toBe(4);
  });
});
