// Demo work for the shop's other lines, made through the same business functions the app uses: an
// electroless nickel lot measured, its phosphorus checked and certified; a Type II anodized lot
// measured and seal-tested and certified; a hard-anodize quote waiting for the buyer; a
// passivated lot waiting for its verification test (so its certificate is refused). Idempotent:
// an audit-log marker says the set is loaded.
import type { Kysely } from 'kysely';
import type { Database } from '@/db/types';
import { acceptQuote, markQuoteSent } from '@/lib/quotes/lifecycle';
import { changeWorkOrderState } from '@/lib/orders/states';
import type { Actor as QualityActor } from '@/lib/quality/access';
import { issueCertificate } from '@/lib/quality/certificate';
import { lotSample } from '@/lib/quality/lot-checks';
import { loadLot } from '@/lib/quality/lot';
import { recordProcessRecord } from '@/lib/quality/process/records';
import { recordReadings } from '@/lib/quality/thickness';
import { actor as qualityActor, readingsFor } from './quality';
import { actor, backdate, draftQuote, runOrder } from './quotes';

const MARKER = 'seed.families';
const DAY = 86_400_000;
const HOUR = 3_600_000;

async function inspectAndCertify(db: Kysely<Database>, workOrderId: string, supervisor: QualityActor, when: Date) {
  await db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId, to: 'inspected', actorId: supervisor.id, note: 'Quality records complete' }));
  await issueCertificate(supervisor, workOrderId, when, db);
}

export async function seedFamilies(db: Kysely<Database>): Promise<void> {
  if (await db.selectFrom('audit_log').select('id').where('action', '=', MARKER).executeTakeFirst()) return;
  const estimator = await actor(db, 'estimator@kestrel-plating.test');
  const people = { plater: await actor(db, 'plater@kestrel-plating.test'), supervisor: await actor(db, 'supervisor@kestrel-plating.test') };
  const halvorsen = await actor(db, 'quality@halvorsen-valve.test');
  const northgate = await actor(db, 'buyer@northgate-fastener.test');
  const [plater, supervisor] = [await qualityActor(db, 'plater'), await qualityActor(db, 'supervisor')];
  if (!plater || !supervisor) return;
  const now = Date.now();
  const ago = (days: number) => new Date(now - days * DAY);
  const made: string[] = [];

  // Electroless nickel on valve bodies: run, measured by XRF, phosphorus checked, certified.
  const en = await draftQuote(db, estimator, 'HVI', [{ part: 'HV-BODY-120', finish: 'EN-B733-25', quantity: 24, basis: 'piece' }]);
  made.push(en.id);
  await markQuoteSent(estimator, { quoteId: en.id, contactUserId: halvorsen.id }, db, ago(15));
  const enOrder = (await acceptQuote(halvorsen, { quoteId: en.id, poNumber: 'HVI-2340', neededBy: null }, db, ago(13))).workOrders[0]!.id;
  await runOrder(db, enOrder, people, { timeFactor: 1.04, endedAt: ago(10), toPlated: true });
  {
    const lot = (await loadLot(db, enOrder))!;
    const n = lotSample(lot).sampleSize;
    await recordReadings(plater, { workOrderId: enOrder, entry: 'manual', readings: readingsFor(n, 27.5, 1.5, 41).map((t, k) => ({ partNo: k + 1, location: k % 2 ? 'bore' : 'flange face', method: 'B568', thicknessUm: t })) }, db);
    await recordProcessRecord(supervisor, { kind: 'phosphorus_content', workOrderId: enOrder, method: 'xrf', phosphorusWtPct: 8.3, minPct: 5, maxPct: 9, notes: 'Witness coupon from the same load.' }, db);
    await inspectAndCertify(db, enOrder, supervisor, new Date(ago(9).getTime() + 3 * HOUR));
  }

  // Type II anodize on actuator housings: thickness by eddy current, dye-spot seal test, certified.
  const an = await draftQuote(db, estimator, 'HVI', [{ part: 'HV-ACT-6061', finish: 'AN-8625-II', quantity: 300, basis: 'piece' }]);
  made.push(an.id);
  await markQuoteSent(estimator, { quoteId: an.id, contactUserId: halvorsen.id }, db, ago(9));
  const anOrder = (await acceptQuote(halvorsen, { quoteId: an.id, poNumber: 'HVI-2352', neededBy: null }, db, ago(8))).workOrders[0]!.id;
  await runOrder(db, anOrder, people, { timeFactor: 1.08, endedAt: ago(6), toPlated: true });
  {
    const lot = (await loadLot(db, anOrder))!;
    const n = lotSample(lot).sampleSize;
    await recordReadings(plater, { workOrderId: anOrder, entry: 'manual', readings: readingsFor(n, 14, 2.5, 53).map((t, k) => ({ partNo: k + 1, location: 'side face', method: 'B244', thicknessUm: t })) }, db);
    await recordProcessRecord(supervisor, { kind: 'seal_test', workOrderId: anOrder, method: 'dye_spot', result: 1, limit: 2, notes: '' }, db);
    await inspectAndCertify(db, anOrder, supervisor, new Date(ago(5).getTime() + 2 * HOUR));
  }

  // Hard anodize on guide pistons: quoted and sent, waiting for the buyer.
  const hc = await draftQuote(db, estimator, 'HVI', [{ part: 'HV-PST-7075', finish: 'AN-8625-III', quantity: 40, basis: 'piece' }]);
  made.push(hc.id);
  await markQuoteSent(estimator, { quoteId: hc.id, contactUserId: halvorsen.id }, db, ago(1));

  // Passivated stainless screws: run inside the Nitric 2 window, waiting for the verification test.
  const ps = await draftQuote(db, estimator, 'NGF', [{ part: 'NGF-SS-0612', finish: 'PS-A967-N2', quantity: 5000, basis: 'hundred' }]);
  made.push(ps.id);
  await markQuoteSent(estimator, { quoteId: ps.id, contactUserId: northgate.id }, db, ago(5));
  const psOrder = (await acceptQuote(northgate, { quoteId: ps.id, poNumber: 'NGF-PO-55402', neededBy: null }, db, ago(4))).workOrders[0]!.id;
  await runOrder(db, psOrder, people, { timeFactor: 1, endedAt: ago(2), toPlated: true });

  await backdate(db, made);
  await db.insertInto('audit_log').values({ actor_id: supervisor.id, action: MARKER, entity: 'seed', entity_id: null }).execute();
}
