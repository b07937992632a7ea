import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { FILE_KINDS } from '@/lib/files/sniff';
import { storeFile } from '@/lib/files/store';
import { savePart } from '@/lib/parts/mutations';
import { partSchema } from '@/lib/parts/schemas';
import { cubeMesh, makeBinaryStl } from '@/lib/plating';
import { customerIdByCode, inRolledBackTransaction, refusalOf, sessionUserByEmail, uniqueSuffix } from './helpers';

afterAll(() => db.destroy());

type Trx = Parameters<Parameters<typeof inRolledBackTransaction>[0]>[0];

async function formFor(trx: Trx, extra: Record<string, string>) {
  return partSchema.parse({
    customerId: await customerIdByCode('HVI', trx),
    partNumber: `TP-${uniqueSuffix()}`,
    revision: 'A',
    substrate: 'carbon-steel',
    weightUnit: 'g',
    ...extra,
  });
}


const counts = (trx: Trx) =>
  Promise.all(
    (['parts', 'calculations', 'audit_log'] as const).map((t) =>
      trx.selectFrom(t).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow().then((r) => r.n),
    ),
  );

describe('savePart', () => {
  it('stores an area typed in ft² as dm², and a weight in lb as grams', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const input = await formFor(trx, { areaMethod: 'direct', area: '1', areaUnit: 'ft2', weight: '1', weightUnit: 'lb', hardnessHrc: '40' });
      const { partId } = await savePart(estimator, input, trx);
      const part = await trx.selectFrom('parts').selectAll().where('id', '=', partId).executeTakeFirstOrThrow();
      // Source: NIST SP 811 App. B.8 — 1 ft² = 0.09290304 m² = 9.290304 dm²; 1 lb = 0.45359237 kg.
      expect(part.area_dm2).toBeCloseTo(9.290304, 9);
      expect(part.weight_g).toBeCloseTo(453.59237, 6);
      expect(part).toMatchObject({ hardness_hrc: 40, calculation_id: null, stl_file_id: null });
    });
  });

  it('measures a round bar given in inches and keeps the calculation', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const input = await formFor(trx, { areaMethod: 'shape', shapeKind: 'cylinder', lengthUnit: 'in', dim_diameterMm: '1', dim_lengthMm: '2', dim_includeEnds: 'on' });
      const { partId } = await savePart(estimator, input, trx);
      const part = await trx.selectFrom('parts').select(['area_dm2', 'weight_g', 'calculation_id']).where('id', '=', partId).executeTakeFirstOrThrow();
      // By hand: d = 25.4 mm, L = 50.8 mm; A = πdL + 2·πd²/4 = π·25.4·(50.8 + 12.7) mm² = 5067.07 mm² = 0.506707 dm².
      expect(part.area_dm2).toBeCloseTo((Math.PI * 25.4 * 63.5) / 10_000, 9);
      // Volume πd²L/4 = 25.74 cm³; weight with carbon steel 7.85 g/cm³ (engine's substrate table).
      expect(part.weight_g).toBeCloseTo(((Math.PI * 25.4 ** 2 * 50.8) / 4 / 1000) * 7.85, 6);
      const calc = await trx.selectFrom('calculations').select(['input', 'area_dm2']).where('id', '=', part.calculation_id!).executeTakeFirstOrThrow();
      expect(calc.input).toMatchObject({ method: 'shape', kind: 'cylinder', unit: 'in' });
    });
  });

  it('measures an uploaded STL on the server in the unit chosen', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const stl = await storeFile({ name: 'cube.stl', bytes: makeBinaryStl(cubeMesh(1)), allowed: FILE_KINDS.stl, uploadedBy: estimator.id }, trx);
      const { partId } = await savePart(estimator, await formFor(trx, { areaMethod: 'stl', stlFileId: stl.id, stlUnit: 'in' }), trx);
      const part = await trx.selectFrom('parts').select(['area_dm2', 'stl_file_id']).where('id', '=', partId).executeTakeFirstOrThrow();
      // A 1-inch cube: 6 in² = 6 × 0.064516 dm² (NIST SP 811: 1 in = 2.54 cm).
      expect(part.area_dm2).toBeCloseTo(6 * 0.064516, 9);
      expect(part.stl_file_id).toBe(stl.id);
    });
  });

  it('refuses a plater, a duplicate, someone else’s unattached model and a model that is not an STL, writing nothing', async () => {
    await inRolledBackTransaction(async (trx) => {
      const [plater, estimator, owner] = await Promise.all(['plater', 'estimator', 'owner'].map((r) => sessionUserByEmail(`${r}@kestrel-plating.test`)));
      const before = await counts(trx);
      const direct = { areaMethod: 'direct', area: '0.5', areaUnit: 'dm2' };
      expect(await refusalOf(savePart(plater!, await formFor(trx, direct), trx))).toBe('FORBIDDEN: You are not allowed to do this.');
      const dup = { ...(await formFor(trx, direct)), customerId: await customerIdByCode('NGF', trx), partNumber: 'NGF-HX-0816', revision: 'C' };
      expect(await refusalOf(savePart(estimator!, dup, trx))).toBe('CONFLICT: Check the highlighted field. {"partNumber":["This customer already has part NGF-HX-0816 revision C."]}');
      const ownersModel = await storeFile({ name: 'cube.stl', bytes: makeBinaryStl(cubeMesh(5)), allowed: FILE_KINDS.stl, uploadedBy: owner!.id }, trx);
      const afterUpload = await counts(trx);
      expect(await refusalOf(savePart(estimator!, await formFor(trx, { areaMethod: 'stl', stlFileId: ownersModel.id, stlUnit: 'mm' }), trx))).toMatch(/^BAD_INPUT: Check the highlighted field. \{"stlFile"/);
      const pdf = await storeFile({ name: 'd.pdf', bytes: new TextEncoder().encode('%PDF-1.4\n%%EOF\n'), allowed: FILE_KINDS.drawing, uploadedBy: estimator!.id }, trx);
      expect(await refusalOf(savePart(estimator!, await formFor(trx, { areaMethod: 'stl', stlFileId: pdf.id, stlUnit: 'mm' }), trx))).toMatch(/^BAD_INPUT: Check the highlighted field. \{"stlFile"/);
      expect(afterUpload).toEqual(before);
      expect(await counts(trx)).toEqual(before);
    });
  });

  it('gives field errors for an impossible shape', () => {
    const r = partSchema.safeParse({ customerId: '00000000-0000-4000-8000-000000000000', partNumber: 'X', substrate: 'brass', areaMethod: 'shape', shapeKind: 'tube', lengthUnit: 'mm', dim_outerDiameterMm: '10', dim_innerDiameterMm: '12', dim_lengthMm: '5' });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path[0])).toEqual(['dim_innerDiameterMm']);
  });
});
