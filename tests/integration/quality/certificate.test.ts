import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { recordBake } from '@/lib/quality/bake/records';
import { certificatePdfFor, getCustomerCertificate, issueCertificate, findCustomerCertificates } from '@/lib/quality/certificate';
import { dispositionNonconformance, openNonconformance } from '@/lib/quality/nonconformances';
import { recordReadings } from '@/lib/quality/thickness';
import { actorFor, BUYER, createLot, errorOf, ESTIMATOR, inspect, OTHER_CUSTOMER, passingReadings, PLATER, SUPERVISOR } from './fixtures';

afterAll(() => db.destroy());

const LATER = new Date('2027-01-01T00:00:00Z');

/** A lot of 20 (Z1.4 code C → 5 parts) with five passing readings. */
async function readyLot(opts: { bake?: boolean } = {}) {
  const plater = await actorFor(db, PLATER);
  const lot = await createLot(db, { quantity: 20, bake: opts.bake, platingEnd: new Date('2026-06-10T14:00:00Z') });
  await recordReadings(plater, { workOrderId: lot.id, entry: 'manual', readings: passingReadings(5) });
  return lot;
}

describe('issuing a certificate of conformance: every refusal has its own message', () => {
  it('refuses anyone but a supervisor or the owner', async () => {
    const lot = await readyLot();
    for (const email of [PLATER, ESTIMATOR, BUYER]) {
      expect(await errorOf(issueCertificate(await actorFor(db, email), lot.id))).toBe('FORBIDDEN: Only a supervisor may issue a certificate of conformance.');
    }
  });

  it('refuses while thickness readings are missing', async () => {
    const lot = await createLot(db, { quantity: 20 });
    expect(await errorOf(issueCertificate(await actorFor(db, SUPERVISOR), lot.id))).toBe(
      'CONFLICT: The certificate cannot be issued yet. Thickness readings are missing: 0 of 5 sampled parts measured (lot of 20, code C).',
    );
  });

  it('refuses a failing reading and the open nonconformance it opened', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await createLot(db, { quantity: 20 });
    const readings = passingReadings(5);
    readings[2] = { ...readings[2]!, thicknessUm: 7.9 };
    await recordReadings(plater, { workOrderId: lot.id, entry: 'manual', readings });
    const msg = await errorOf(issueCertificate(await actorFor(db, SUPERVISOR), lot.id));
    expect(msg).toContain('1 of 5 thickness readings fail the specification: 1 below the minimum 8 µm (lowest 7.9 µm).');
    expect(msg).toContain('A nonconformance is open');
  });

  it('refuses an open nonconformance on an otherwise complete lot', async () => {
    const lot = await readyLot();
    await openNonconformance(await actorFor(db, PLATER), { workOrderId: lot.id, source: 'other', description: 'Stain on 3 parts after passivate' });
    expect(await errorOf(issueCertificate(await actorFor(db, SUPERVISOR), lot.id))).toBe(
      'CONFLICT: The certificate cannot be issued yet. A nonconformance is open (“Stain on 3 parts after passivate”): a disposition is needed first.',
    );
  });

  it('refuses a missing bake, then a late bake, until a supervisor dispositions it', async () => {
    const supervisor = await actorFor(db, SUPERVISOR);
    const lot = await readyLot({ bake: true });
    expect(await errorOf(issueCertificate(supervisor, lot.id))).toBe('CONFLICT: The certificate cannot be issued yet. The embrittlement-relief bake has not been recorded.');
    await recordBake(
      await actorFor(db, PLATER),
      { workOrderId: lot.id, platingEnded: '2026-06-10T10:00', bakeStarted: '2026-06-10T15:00', timeZone: 'America/New_York', oven: 'Oven 1', tempMinC: 200, tempMaxC: 200, durationH: 12 },
      LATER,
    );
    expect(await errorOf(issueCertificate(supervisor, lot.id))).toBe(
      "CONFLICT: The certificate cannot be issued yet. The bake record fails: Bake started 60 min after the 4 h window closed. A supervisor's disposition is needed before the order can be marked baked.",
    );
  });
});

describe('an issued certificate', () => {
  it('carries the lot’s records, is frozen, and is visible to its own customer only', async () => {
    const supervisor = await actorFor(db, SUPERVISOR);
    const lot = await readyLot({ bake: true });
    await recordBake(
      await actorFor(db, PLATER),
      { workOrderId: lot.id, platingEnded: '2026-06-10T10:00', bakeStarted: '2026-06-10T11:30', timeZone: 'America/New_York', oven: 'Oven 1', tempMinC: 198, tempMaxC: 203, durationH: 12.5 },
      LATER,
    );
    // Every record passes, but the order is still at "plated": the certificate waits for inspection.
    expect(await errorOf(issueCertificate(supervisor, lot.id))).toBe(
      'CONFLICT: The certificate cannot be issued yet. The order is plated, not yet inspected: a certificate is issued once the lot passes inspection.',
    );
    await inspect(db, lot.id);
    const cert = await issueCertificate(supervisor, lot.id, new Date('2026-06-12T15:00:00Z'));
    expect(cert.number).toMatch(/^CC2026-\d{5}$/);
    const c = cert.content;
    expect(c).toMatchObject({
      customer: { name: 'Northgate Fastener Co.', code: 'NGF' },
      order: { number: lot.number, quantity: 20 },
      part: { number: 'NGF-SS-1240', revision: 'A' },
      finish: { code: 'ZN-B633-SC2-HS', specText: 'ASTM B633 Fe/Zn 8 (SC2) Type III, bake per ASTM B850', minThicknessUm: 8 },
      thickness: { lotSize: 20, sampleSize: 5, codeLetter: 'C', partsMeasured: 5, count: 5, minUm: 9, maxUm: 12 },
      bake: { required: true, oven: 'Oven 1', verdict: 'pass', requiredMinHours: 12, requiredTempC: [190, 220], durationH: 12.5 },
      signedBy: { name: 'Priya Natarajan', role: 'Supervisor' },
      signedAt: '2026-06-12T15:00:00.000Z',
      shop: { name: 'Kestrel Lane Plating' },
    });
    // Readings 9, 10, 11, 12, 9 µm: mean 51/5 = 10.2 (hand computed).
    expect(c.thickness.meanUm).toBeCloseTo(10.2, 10);
    expect(c.bath.available).toBe(true);
    expect(c.runs[0]).toMatchObject({ tankCode: 'Z-ZN1' });

    const pdf = await db.selectFrom('files').select(['bytes', 'content_type', 'name']).where('id', '=', cert.pdfFileId).executeTakeFirstOrThrow();
    expect(pdf.content_type).toBe('application/pdf');
    expect(pdf.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.name).toBe(`${cert.number}.pdf`);

    expect(await errorOf(issueCertificate(supervisor, lot.id))).toBe(
      `CONFLICT: Certificate ${cert.number} was already issued for this order; an issued certificate cannot be changed.`,
    );
    expect(await errorOf(db.updateTable('certificates').set({ signed_by_name: 'Someone else' }).where('id', '=', cert.id).execute())).toMatch(
      /certificates are frozen once issued/,
    );
    expect(await errorOf(db.deleteFrom('certificates').where('id', '=', cert.id).execute())).toMatch(/certificates are frozen once issued/);

    const buyer = await actorFor(db, BUYER);
    const other = await actorFor(db, OTHER_CUSTOMER);
    const asBuyer = { ...buyer, email: buyer.email } as Parameters<typeof getCustomerCertificate>[0];
    const asOther = { ...other } as Parameters<typeof getCustomerCertificate>[0];
    expect((await getCustomerCertificate(asBuyer, cert.id))?.number).toBe(cert.number);
    expect((await findCustomerCertificates(asBuyer)).map((x) => x.id)).toContain(cert.id);
    expect(await getCustomerCertificate(asOther, cert.id)).toBeNull();
    expect((await findCustomerCertificates(asOther)).map((x) => x.id)).not.toContain(cert.id);
    expect(await certificatePdfFor(asOther, cert.id)).toBeNull();
    expect((await certificatePdfFor(asBuyer, cert.id))?.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('a "use as is" disposition lets the certificate go out, listing the nonconformance', async () => {
    const plater = await actorFor(db, PLATER);
    const supervisor = await actorFor(db, SUPERVISOR);
    const lot = await createLot(db, { quantity: 20 });
    const readings = passingReadings(5);
    readings[0] = { ...readings[0]!, thicknessUm: 7.5 };
    const r = await recordReadings(plater, { workOrderId: lot.id, entry: 'manual', readings });
    await dispositionNonconformance(supervisor, { nonconformanceId: r.nonconformanceId!, disposition: 'use_as_is', customerApprovalRef: 'NGF deviation D-204' });
    await inspect(db, lot.id);
    const cert = await issueCertificate(supervisor, lot.id);
    expect(cert.content.thickness.failingAcceptedByDisposition).toBe(1);
    expect(cert.content.nonconformances).toEqual([
      expect.objectContaining({ disposition: "Use as is (customer's approval)", customerApprovalRef: 'NGF deviation D-204' }),
    ]);
  });
});
