import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { AppError } from '@/lib/errors';
import { importCustomers } from '@/lib/imports/customers';
import { importParts } from '@/lib/imports/parts';
import { inRolledBackTransaction, sessionUserByEmail, uniqueSuffix } from './helpers';

afterAll(() => db.destroy());

type Trx = Parameters<Parameters<typeof inRolledBackTransaction>[0]>[0];
const count = (trx: Trx, t: 'customers' | 'parts') => trx.selectFrom(t).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow().then((r) => r.n);
const HEADER = 'code,name,billing_address,shipping_address,billing_email,phone,payment_terms_days,tax_rate_percent';

describe('customer import', () => {
  it('writes every row when all pass', async () => {
    await inRolledBackTransaction(async (trx) => {
      const owner = await sessionUserByEmail('owner@kestrel-plating.test');
      const s = uniqueSuffix().slice(-6);
      const csv = `${HEADER}\nA${s},Alder Tool,,,ap@alder.test,,30,7.25\nB${s},"Birch, Inc.",,,,,45,0\n`;
      const before = await count(trx, 'customers');
      expect(await importCustomers(owner, csv, trx)).toEqual({ ok: true, written: 2 });
      expect(await count(trx, 'customers')).toBe(before + 2);
      const birch = await trx.selectFrom('customers').selectAll().where('code', '=', `B${s}`).executeTakeFirstOrThrow();
      expect(birch).toMatchObject({ name: 'Birch, Inc.', payment_terms_days: 45, tax_rate_bp: 0 });
    });
  });

  it('writes nothing when one row is bad, and lists each problem by row and column', async () => {
    await inRolledBackTransaction(async (trx) => {
      const owner = await sessionUserByEmail('owner@kestrel-plating.test');
      const s = uniqueSuffix().slice(-6);
      const csv = `${HEADER}\nA${s},Alder Tool,,,,,30,7.25\nNGF,Duplicate of a seeded code,,,,,30,0\nA${s},Same code twice,,,,,30,0\nC${s},,,,,,400,7.255\n`;
      const before = await count(trx, 'customers');
      const outcome = await importCustomers(owner, csv, trx);
      expect(outcome.ok).toBe(false);
      expect(outcome.ok ? [] : outcome.problems).toEqual([
        { row: 3, column: 'code', message: 'A customer with code NGF already exists.' },
        { row: 4, column: 'code', message: `Code A${s} is also on row 2.` },
        { row: 5, column: 'name', message: 'Enter the company name.' },
        { row: 5, column: 'payment_terms_days', message: 'The payment terms in days must be at most 365.' },
        { row: 5, column: 'tax_rate_percent', message: 'Enter the tax rate as a percentage with at most two decimals, e.g. 7.25.' },
      ]);
      expect(await count(trx, 'customers')).toBe(before);
    });
  });

  it('refuses a supervisor (may read customers, not change them)', async () => {
    const supervisor = await sessionUserByEmail('supervisor@kestrel-plating.test');
    await expect(importCustomers(supervisor, `${HEADER}\nZZ,Z,,,,,30,0\n`)).rejects.toThrow(AppError);
  });
});

describe('part import', () => {
  const PART_HEADER = 'customer_code,part_number,revision,description,substrate,tensile_mpa,hardness_hrc,area,area_unit,weight,weight_unit';

  it('converts areas and weights and writes all rows', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const s = uniqueSuffix();
      const csv = `${PART_HEADER}\nNGF,W-${s},A,Washer,carbon-steel,,,10,in2,0.5,lb\nhvi,W-${s},,Same number another customer,brass,,,1.5,dm2,,\n`;
      expect(await importParts(estimator, csv, trx)).toEqual({ ok: true, written: 2 });
      const rows = await trx.selectFrom('parts').select(['area_dm2', 'weight_g', 'substrate']).where('part_number', '=', `W-${s}`).orderBy('area_dm2').execute();
      // Source: NIST SP 811 App. B.8 — 1 in² = 6.4516 cm² = 0.064516 dm²; 1 lb = 453.59237 g.
      expect(rows[0]).toMatchObject({ substrate: 'carbon-steel' });
      expect(rows[0]!.area_dm2).toBeCloseTo(0.64516, 9);
      expect(rows[0]!.weight_g).toBeCloseTo(226.796185, 6);
      expect(rows[1]).toMatchObject({ area_dm2: 1.5, weight_g: null, substrate: 'brass' });
    });
  });

  it('refuses an unknown customer, an existing part, a bad substrate and unit, writing nothing', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const before = await count(trx, 'parts');
      const csv = `${PART_HEADER}\nNOPE,P-1,,,carbon-steel,,,1,dm2,,\nNGF,NGF-HX-0816,C,,carbon-steel,,,1,dm2,,\nNGF,P-2,,,wood,,,1,acre,,\n`;
      const outcome = await importParts(estimator, csv, trx);
      expect(outcome.ok ? [] : outcome.problems.map((p) => [p.row, p.column])).toEqual([
        [2, 'customer_code'],
        [3, 'part_number'],
        [4, 'area_unit'],
        [4, 'substrate'],
      ]);
      expect(await count(trx, 'parts')).toBe(before);
    });
  });
});
