import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { AppError } from '@/lib/errors';
import { computeCalculation } from '@/lib/estimating/calculation';
import type { CalculationInput } from '@/lib/estimating/calculation-schema';
import { saveCalculation } from '@/lib/estimating/mutations';
import { findProcessLibrary, findRecentCalculations, getCalculation } from '@/lib/estimating/queries';
import { inRolledBackTransaction, sessionUserByEmail, uniqueSuffix } from '../records/helpers';

afterAll(() => db.destroy());

const input: CalculationInput = {
  version: 1,
  geometry: { kind: 'shape', shape: { kind: 'block', lengthMm: 50, widthMm: 30, heightMm: 10 } },
  substrate: 'carbon-steel',
  hardnessHrc: 38,
  tensileMpa: null,
  quantity: 500,
  minimumThicknessUm: 8,
  process: {
    element: 'Zn', charge: 2, currentDensityAdm2: 0.8, efficiency: 0.72, loading: 'barrel', distributionRatio: 0.5, partsPerLoad: 1500,
    tankVolts: 9, rectifierMaxA: 2000, rectifierEfficiency: 0.85, dragOutLPerM2: 0.2, bathMetalGPerL: 10, anodes: 'soluble', anodeLossPercent: 2,
  },
  finishId: null,
  contact: { material: 'aluminium', environment: 'harsh' },
};

async function refusal(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error('expected a refusal');
}

describe('saveCalculation', () => {
  it('stores the figures it computes itself and ignores a result sent with the input', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const title = `Zinc on hardened blocks ${uniqueSuffix()}`;
      const tampered = { estimate: { nominal: { ampHoursLot: 1 } }, geometry: { areaDm2: 999 } };
      const saved = await saveCalculation(estimator, { title, input, result: tampered }, trx);

      const row = await trx.selectFrom('calculations').selectAll().where('id', '=', saved.id).executeTakeFirstOrThrow();
      const expected = JSON.parse(JSON.stringify(computeCalculation(input)));
      expect(row.result).toEqual(expected);
      expect(row.input).toEqual(input);
      // A 50 × 30 × 10 mm block: 2(1500 + 500 + 300) mm² = 4600 mm² = 0.46 dm² (geometry by hand).
      expect(row.area_dm2).toBeCloseTo(0.46, 12);
      expect(row.created_by).toBe(estimator.id);
      expect((row.result as { estimate: { nominal: { ampHoursLot: number } } }).estimate.nominal.ampHoursLot).not.toBe(1);
      // 38 HRC steel: ASTM B850 Table 1 band 36–39 HRC → 12 h (reference §7); zinc on aluminium outdoors exceeds 0.15 V.
      expect(row.result).toMatchObject({ bake: { required: true, minHours: 12 }, contact: { exceedsLimit: true }, galvanic: { protection: 'sacrificial' } });

      const audit = await trx.selectFrom('audit_log').select(['action', 'entity']).where('entity_id', '=', saved.id).execute();
      expect(audit).toEqual([{ action: 'calculation.save', entity: 'calculation' }]);
      expect((await getCalculation(saved.id, trx))?.input).toEqual(input);
      expect((await findRecentCalculations(50, trx)).find((c) => c.id === saved.id)).toMatchObject({ title, metalName: 'Zinc', quantity: 500 });
    });
  });

  it('recomputes a shape’s area from its dimensions, whatever area the browser claims', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const claimed = { ...input, geometry: { ...input.geometry, areaDm2: 50 } };
      const saved = await saveCalculation(estimator, { title: `Area claim ${uniqueSuffix()}`, input: claimed }, trx);
      const row = await trx.selectFrom('calculations').select(['area_dm2', 'input']).where('id', '=', saved.id).executeTakeFirstOrThrow();
      expect(row.area_dm2).toBeCloseTo(0.46, 12);
      expect(row.input).not.toHaveProperty('geometry.areaDm2');
    });
  });

  it('refuses bad input with the field named, and writes nothing', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const before = await trx.selectFrom('calculations').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
      const cases: [unknown, string, string, string][] = [
        [{ ...input, quantity: -5 }, 'T', 'quantity', 'Quantity must be greater than 0; got -5.'],
        [{ ...input, process: { ...input.process, efficiency: 72 } }, 'T', 'process.efficiency', 'Enter a fraction: 72 % is 0.72.'],
        [{ ...input, geometry: { kind: 'shape', shape: { kind: 'sphere', diameterMm: 'big' } } }, 'T', 'geometry.shape.diameterMm', 'expected number'],
        ['not a calculation', 'T', '_form', 'expected object'],
        [input, '   ', 'title', 'Enter a title of 1 to 200 characters.'],
      ];
      for (const [bad, title, field, words] of cases) {
        const e = await refusal(saveCalculation(estimator, { title, input: bad }, trx));
        expect(e.code).toBe('BAD_INPUT');
        expect(e.fieldErrors?.[field]?.join(' ')).toContain(words);
      }
      const after = await trx.selectFrom('calculations').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
      expect(after.n).toEqual(before.n);
    });
  });
});

describe('findProcessLibrary', () => {
  it('completes each seeded finish from the tank that runs it', async () => {
    const library = await findProcessLibrary();
    const nickel = library.find((l) => l.code === 'NI-B689-25');
    // Demo seed: Watts nickel tank N-NI1 with a 1500 A rectifier; finish at 4 A/dm², 95 %.
    expect(nickel).toMatchObject({ tankCode: 'N-NI1', minimumThicknessUm: 25, note: null });
    expect(nickel!.process).toMatchObject({ element: 'Ni', charge: 2, currentDensityAdm2: 4, efficiency: 0.95, rectifierMaxA: 1500, anodes: 'soluble' });
    const computed = computeCalculation({ ...input, finishId: nickel!.finishId, minimumThicknessUm: nickel!.minimumThicknessUm, process: { ...nickel!.process, anodes: 'soluble' } });
    expect(computed.estimate.metal.key).toBe('Ni2+');
  });
});
