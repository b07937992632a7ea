// Receiving, scrap and hold, shipping and returns against the real database and the SMTP fake.
import { randomInt } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { recordCountMove } from '@/lib/dock/moves';
import { customerNoticeAddresses, sendDiscrepancyNotice, sendShipmentNotice } from '@/lib/dock/notices';
import { receiveReworkReturn, recordReceipt } from '@/lib/dock/receiving';
import { receiptSchema } from '@/lib/dock/schemas';
import { createShipment } from '@/lib/dock/shipping';
import { readFileFor } from '@/lib/files/access';
import { readFile, storeFile } from '@/lib/files/store';
import { advanceWorkOrder } from '@/lib/orders/mutations';
import { messagesTo } from '../../helpers/mailbox';
import { refusalOf, sessionUserByEmail } from '../records/helpers';
import { dockCustomer, dockOrder, type DockCustomer } from './fixtures';

// A 1×1 PNG (PNG spec §5.2 signature, IHDR, IDAT, IEND).
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

let plater: Awaited<ReturnType<typeof sessionUserByEmail>>;
let estimator: Awaited<ReturnType<typeof sessionUserByEmail>>;
let cust: DockCustomer;
let other: DockCustomer;
let ownUser: Awaited<ReturnType<typeof sessionUserByEmail>>;
let strangerUser: Awaited<ReturnType<typeof sessionUserByEmail>>;

const receipt = (workOrderId: string, over: Record<string, unknown> = {}) =>
  receiptSchema.parse({ workOrderId, quantity: 100, containers: 2, weightKg: '12.4', customerPartNumber: 'BR-77', customerLot: 'L-4411', ...over });

async function customerUser(c: DockCustomer) {
  const id = `dock-user-${c.code.toLowerCase()}`;
  await db.insertInto('users').values({ id, email: `buyer-${c.code.toLowerCase()}@customer.test`, name: 'Buyer', role: 'customer', customer_id: c.id, password_hash: null }).execute();
  return sessionUserByEmail(`buyer-${c.code.toLowerCase()}@customer.test`);
}

beforeAll(async () => {
  plater = await sessionUserByEmail('plater@kestrel-plating.test');
  estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
  cust = await dockCustomer(db);
  other = await dockCustomer(db);
  ownUser = await customerUser(cust);
  strangerUser = await customerUser(other);
});
afterAll(() => db.destroy());

describe('receiving', () => {
  it('a short delivery is received with its lot, photo and discrepancy, and the customer is e-mailed', async () => {
    const wo = await dockOrder(db, cust, { ordered: 120 });
    const photo = await storeFile({ name: 'crate.png', bytes: PNG, declaredType: 'image/png', allowed: ['png', 'jpeg', 'gif', 'webp'], uploadedBy: plater.id });
    const saved = await recordReceipt(plater, receipt(wo.id, { discrepancy: 'short', discrepancyNote: '20 brackets missing from crate 2.', photoIds: photo.id }));
    expect(saved.number).toMatch(/^R\d{4}-\d{5}$/);
    const order = await db.selectFrom('work_orders').select(['state', 'quantity_received']).where('id', '=', wo.id).executeTakeFirstOrThrow();
    expect(order).toEqual({ state: 'received', quantity_received: 100 });

    const sent = await sendDiscrepancyNotice(saved.id);
    expect(sent).toMatchObject({ ok: true, to: cust.email });
    const mail = (await messagesTo(cust.email)).find((m) => m.subject.includes(`PO PO-${cust.code}`));
    expect(mail?.subject).toBe(`Receiving discrepancy on PO PO-${cust.code}: short`);
    expect(mail?.text).toContain('20 brackets missing from crate 2.');
    expect(mail?.text).toContain('Counted: 100 parts in 2 container(s), 12.4 kg (27.3 lb); ordered 120.');
    const row = await db.selectFrom('receipts').select(['discrepancy_emailed_at', 'customer_lot']).where('id', '=', saved.id).executeTakeFirstOrThrow();
    expect(row.customer_lot).toBe('L-4411');
    expect(row.discrepancy_emailed_at).toBeInstanceOf(Date);

    // The photo is the customer's to see, and no one else's.
    expect((await readFileFor(ownUser, photo.id))?.name).toBe('crate.png');
    expect(await readFileFor(strangerUser, photo.id)).toBeNull();

    // A second delivery adds to the count; the order stays received.
    await recordReceipt(plater, receipt(wo.id, { quantity: 20, containers: 1 }));
    expect((await db.selectFrom('work_orders').select('quantity_received').where('id', '=', wo.id).executeTakeFirstOrThrow()).quantity_received).toBe(120);
  });

  it('refuses what it cannot keep and writes nothing', async () => {
    const wo = await dockOrder(db, cust);
    const issues = (v: Record<string, unknown>) => receiptSchema.safeParse({ workOrderId: wo.id, ...v }).error?.issues.map((i) => `${i.path.join('.')}: ${i.message}`).sort();
    expect(issues({ quantity: '1.5', containers: '0' })).toEqual(['containers: Enter at least 1.', 'quantity: Enter a whole number of parts received.']);
    expect(issues({ quantity: '5', containers: '1', discrepancy: 'damaged', discrepancyNote: ' ' })).toEqual(['discrepancyNote: Say what is wrong: the customer receives this text.']);
    const text = await storeFile({ name: 'note.txt', bytes: new TextEncoder().encode('not a photo'), allowed: ['text'], uploadedBy: plater.id });
    const theirs = await storeFile({ name: 'theirs.png', bytes: PNG, allowed: ['png'], uploadedBy: estimator.id });
    expect(await refusalOf(recordReceipt(plater, receipt(wo.id, { photoIds: text.id })))).toMatch(/^BAD_INPUT: Only photos/);
    expect(await refusalOf(recordReceipt(plater, receipt(wo.id, { photoIds: theirs.id })))).toMatch(/^BAD_INPUT: A photo was not found among your uploads/);
    expect(await refusalOf(recordReceipt(estimator, receipt(wo.id)))).toBe('FORBIDDEN: You are not allowed to do this.');
    const after = await db.selectFrom('work_orders').select(['state', 'quantity_received']).where('id', '=', wo.id).executeTakeFirstOrThrow();
    expect(after).toEqual({ state: 'accepted', quantity_received: 0 });
    expect((await db.selectFrom('receipts').select('id').where('work_order_id', '=', wo.id).execute()).length).toBe(0);
  });

  it('sends nothing when the customer has no address, and says so', async () => {
    const bare = await dockCustomer(db);
    await db.deleteFrom('customer_contacts').where('customer_id', '=', bare.id).execute();
    await db.updateTable('customers').set({ billing_email: null }).where('id', '=', bare.id).execute();
    expect(await customerNoticeAddresses(bare.id)).toEqual([]);
    const wo = await dockOrder(db, bare);
    const saved = await recordReceipt(plater, receipt(wo.id, { discrepancy: 'damaged', discrepancyNote: 'Two parts bent.' }));
    expect((await sendDiscrepancyNotice(saved.id)).message).toMatch(/has no contact e-mail address on record/);
  });
});

describe('shipping', () => {
  it('ships in two parts with their slips; the last part accounted for closes the order', async () => {
    const wo = await dockOrder(db, cust, { state: 'inspected', ordered: 100, received: 100 });
    await recordCountMove(plater, { workOrderId: wo.id, kind: 'scrap', quantity: 4, reason: 'Bent in the barrel' });
    await recordCountMove(plater, { workOrderId: wo.id, kind: 'hold', quantity: 6, reason: 'Awaiting the customer on blisters' });
    const ship = (quantity: number) => ({ workOrderId: wo.id, quantity, containers: 1, weightKg: 5, carrier: 'Harbourline Freight', trackingNumber: `HF${randomInt(1e6, 9e6)}` });

    const first = await createShipment(plater, ship(50));
    expect(first).toMatchObject({ closed: false });
    expect(first.number).toMatch(/^S\d{4}-\d{5}$/);
    const slip = await readFile(first.slipFileId);
    expect(slip?.bytes.subarray(0, 5).toString()).toBe('%PDF-');
    expect(slip?.content_type).toBe('application/pdf');
    expect(await refusalOf(createShipment(plater, ship(41)))).toMatch(/^BAD_INPUT: Cannot ship 41 parts: 40 are in the shop to ship \(received 100, shipped 50, scrapped 4, held 6\)\./);
    expect(await refusalOf(advanceWorkOrder(plater, { workOrderId: wo.id, to: 'shipped', note: '' }))).toMatch(/^CONFLICT: The order cannot be closed as shipped while 40 of its 100 received parts are unaccounted for/);

    const second = await createShipment(plater, ship(40));
    expect(second.closed).toBe(true);
    const order = await db.selectFrom('work_orders').selectAll().where('id', '=', wo.id).executeTakeFirstOrThrow();
    expect([order.state, order.quantity_received, order.quantity_shipped, order.quantity_scrapped, order.quantity_held]).toEqual(['shipped', 100, 90, 4, 6]);
    expect(await refusalOf(createShipment(plater, ship(1)))).toMatch(/has shipped all its parts/);

    const notice = await sendShipmentNotice(second.id);
    expect(notice.ok).toBe(true);
    const mail = (await messagesTo(cust.email)).find((m) => m.subject.includes(second.number));
    expect(mail?.subject).toBe(`Shipped: 40 parts on PO PO-${cust.code} (${second.number})`);
    expect(mail?.text).toContain(`Attached: packing slip ${second.number}.`);
    // The customer reads their slips; another customer does not.
    expect((await readFileFor(ownUser, first.slipFileId))?.name).toBe(`packing-slip-${first.number}.pdf`);
    expect(await readFileFor(strangerUser, first.slipFileId)).toBeNull();
  });

  it('refuses to ship before inspection, and the database refuses counts that do not add up', async () => {
    const wo = await dockOrder(db, cust, { state: 'plated', received: 10 });
    expect(await refusalOf(createShipment(plater, { workOrderId: wo.id, quantity: 10, containers: 1, weightKg: undefined, carrier: 'Customer pickup', trackingNumber: '' }))).toMatch(/ships after inspection/);
    await expect(db.updateTable('work_orders').set({ quantity_shipped: 8, quantity_held: 3 }).where('id', '=', wo.id).execute()).rejects.toThrow(/work_orders_counts_balance/);
  });
});

describe('returns for rework', () => {
  it('come in on a new no-charge order linked to the shipped lot, never more than shipped', async () => {
    const wo = await dockOrder(db, cust, { state: 'inspected', received: 30 });
    await createShipment(plater, { workOrderId: wo.id, quantity: 30, containers: 1, weightKg: undefined, carrier: 'Customer pickup', trackingNumber: '' });
    const nc = await db.insertInto('nonconformances').values({ work_order_id: wo.id, source: 'other', description: 'Customer found white rust on arrival', opened_by: plater.id }).returning('id').executeTakeFirstOrThrow();
    const back = await receiveReworkReturn(plater, { originalWorkOrderId: wo.id, nonconformanceId: nc.id, poNumber: 'RMA-1', quantity: 12, containers: 1, weightKg: undefined, customerLot: '', conditionNote: '', reason: 'White rust' });
    const rework = await db.selectFrom('work_orders').selectAll().where('id', '=', back.workOrderId).executeTakeFirstOrThrow();
    expect([rework.rework_of_id, rework.rework_nonconformance_id, rework.total_cents, rework.state, rework.quantity_received]).toEqual([wo.id, nc.id, 0, 'received', 12]);
    expect((await db.selectFrom('receipts').select('is_return').where('id', '=', back.id).executeTakeFirstOrThrow()).is_return).toBe(true);
    expect(await refusalOf(receiveReworkReturn(plater, { originalWorkOrderId: wo.id, poNumber: 'RMA-2', quantity: 19, containers: 1, weightKg: undefined, customerLot: '', conditionNote: '', reason: 'More rust' }))).toMatch(
      /^BAD_INPUT: Only 18 of the 30 parts shipped on W2099-\d+ can still come back\./,
    );
    const count = await sql<{ n: number }>`select count(*)::int as n from work_orders where rework_of_id = ${wo.id}`.execute(db);
    expect(count.rows[0]!.n).toBe(1);
  });
});
