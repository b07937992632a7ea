import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { JOB } from '@/lib/jobs/names';
import { JOBS } from '@/lib/jobs/registry';
import { acceptQuote, declineQuote, expireOverdueQuotes, markQuoteSent, reviseQuote } from '@/lib/quotes/lifecycle';
import { addQuoteLine, clearLineOverride, createQuote, overrideLinePrice, removeQuoteLine } from '@/lib/quotes/mutations';
import { formatDocumentNumber, nextDocumentNumber } from '@/lib/quotes/numbering';
import type { LinePrice } from '@/lib/quotes/pricing';
import { findPortalQuotes, getPortalQuote, getQuote } from '@/lib/quotes/queries';
import { overrideSchema } from '@/lib/quotes/schemas';
import { finishId, makeCustomer, outcome, staff, type TestCustomer } from './fixtures';

afterAll(() => db.destroy());

let cust: TestCustomer;
let other: TestCustomer;
let estimator: Awaited<ReturnType<typeof staff>>;
let zincHs: string;
let nickel: string;

beforeAll(async () => {
  [cust, other, estimator, zincHs, nickel] = await Promise.all([makeCustomer(), makeCustomer(), staff('estimator'), finishId('ZN-B633-SC2-HS'), finishId('NI-B689-25')]);
});

async function draftWithLine(quantity = 3000) {
  const q = await createQuote(estimator, { customerId: cust.id, isRush: false, notes: '' });
  const line = await addQuoteLine(estimator, { quoteId: q.id, partId: cust.parts.screw, finishId: zincHs, quantity, basis: 'piece' });
  return { ...q, lineId: line.lineId, lineTotal: line.totalCents };
}

describe('numbering', () => {
  // A year of our own so no other test's numbers interleave.
  const at = new Date(Date.UTC(2987, 5, 1));

  it('formats quote and work-order numbers', () => {
    expect(formatDocumentNumber('quote', 2026, 1)).toBe('Q2026-0001');
    expect(formatDocumentNumber('work_order', 2026, 42)).toBe('W2026-00042');
  });

  it('issues numbers one after another, and a rolled-back create does not burn one', async () => {
    const first = await db.transaction().execute((trx) => nextDocumentNumber(trx, 'quote', at));
    const n = Number(first.split('-')[1]);
    await db
      .transaction()
      .execute(async (trx) => {
        await nextDocumentNumber(trx, 'quote', at);
        throw new Error('roll back');
      })
      .catch(() => undefined);
    const next = await db.transaction().execute((trx) => nextDocumentNumber(trx, 'quote', at));
    expect(next).toBe(formatDocumentNumber('quote', 2987, n + 1));
  });

  it('never gives two concurrent creates the same number', async () => {
    const numbers = await Promise.all(Array.from({ length: 8 }, () => db.transaction().execute((trx) => nextDocumentNumber(trx, 'quote', at))));
    expect(new Set(numbers).size).toBe(8);
  });

  it('numbers real quotes Q<year>-NNNN in order', async () => {
    const a = await createQuote(estimator, { customerId: cust.id, isRush: false, notes: '' });
    const b = await createQuote(estimator, { customerId: cust.id, isRush: false, notes: '' });
    expect(a.number).toMatch(new RegExp(`^Q${new Date().getUTCFullYear()}-\\d{4,}$`));
    expect(Number(b.number.slice(6))).toBe(Number(a.number.slice(6)) + 1);
  });
});

describe('drafting and pricing', () => {
  it('prices a line from the engine and keeps the quote total', async () => {
    const q = await draftWithLine();
    const detail = (await getQuote(q.id))!;
    const line = detail.lines[0]!;
    expect(line.cost.components.map((c) => c.key)).toEqual(['metal', 'additives', 'power', 'labour', 'tankTime', 'masking', 'bake']);
    // The part is 39 HRC: the bake is charged.
    expect(line.cost.bake.applies).toBe(true);
    expect(line.cost.components.find((c) => c.key === 'bake')!.cents).toBeGreaterThan(0);
    expect(detail.total_cents).toBe(line.totalCents);
    expect(line.totalCents).toBe(line.cost.totalCents);
  });

  it('refuses a part of another customer and a per-kg price for a part without weight', async () => {
    const q = await createQuote(estimator, { customerId: cust.id, isRush: false, notes: '' });
    expect(await outcome(addQuoteLine(estimator, { quoteId: q.id, partId: other.parts.screw, finishId: zincHs, quantity: 10, basis: 'piece' }))).toMatch(/^BAD_INPUT: That part is not one of this customer/);
    expect(await outcome(addQuoteLine(estimator, { quoteId: q.id, partId: cust.parts.noWeight, finishId: nickel, quantity: 10, basis: 'kg' }))).toMatch(/^BAD_INPUT: The part has no weight/);
  });

  it('records an override with reason, who and when, and can go back to the computed price', async () => {
    const q = await draftWithLine();
    await overrideLinePrice(estimator, { quoteId: q.id, lineId: q.lineId, price: 123456, reason: 'Matched last year’s price for this part' });
    const line = (await getQuote(q.id))!.lines[0]!;
    expect(line.totalCents).toBe(123456);
    expect(line.computedTotalCents).toBe(q.lineTotal);
    expect(line.override).toMatchObject({ cents: 123456, reason: 'Matched last year’s price for this part', by: estimator.name });
    expect(line.override!.at).toBeInstanceOf(Date);
    // Unit price follows the overridden total: 123 456 ¢ ÷ 3000 pieces.
    expect(line.unitPriceCents).toBeCloseTo(41.152, 4);
    const audit = await db.selectFrom('audit_log').select('detail').where('entity_id', '=', q.id).where('action', '=', 'quote.line.override').executeTakeFirstOrThrow();
    expect(audit.detail).toMatchObject({ newCents: 123456, computedCents: q.lineTotal });
    await clearLineOverride(estimator, { quoteId: q.id, lineId: q.lineId });
    expect((await getQuote(q.id))!.total_cents).toBe(q.lineTotal);
  });

  it('requires a reason for an override', () => {
    const r = overrideSchema.safeParse({ quoteId: cust.id, lineId: cust.id, price: '1,250.50', reason: ' ' });
    expect(r.success).toBe(false);
    const ok = overrideSchema.safeParse({ quoteId: cust.id, lineId: cust.id, price: '$1,250.50', reason: 'Customer supplies masking' });
    expect(ok.success && ok.data.price).toBe(125050);
  });

  it('a plater and a supervisor cannot price, override or remove lines', async () => {
    const q = await draftWithLine(100);
    for (const role of ['plater', 'supervisor'] as const) {
      const who = await staff(role);
      expect(await outcome(addQuoteLine(who, { quoteId: q.id, partId: cust.parts.stem, finishId: nickel, quantity: 5, basis: 'piece' }))).toBe('FORBIDDEN: You are not allowed to do this.');
      expect(await outcome(overrideLinePrice(who, { quoteId: q.id, lineId: q.lineId, price: 1, reason: 'cheaper please' }))).toBe('FORBIDDEN: You are not allowed to do this.');
      expect(await outcome(removeQuoteLine(who, { quoteId: q.id, lineId: q.lineId }))).toBe('FORBIDDEN: You are not allowed to do this.');
    }
    expect(await outcome(addQuoteLine(cust.contact, { quoteId: q.id, partId: cust.parts.stem, finishId: nickel, quantity: 5, basis: 'piece' }))).toBe('FORBIDDEN: You are not allowed to do this.');
    expect((await getQuote(q.id))!.lines[0]!.override).toBeNull();
  });
});

describe('sending, revising and expiry', () => {
  it('will not send an empty quote or to another company’s contact', async () => {
    const empty = await createQuote(estimator, { customerId: cust.id, isRush: false, notes: '' });
    expect(await outcome(markQuoteSent(estimator, { quoteId: empty.id, contactUserId: cust.contact.id }))).toMatch(/^CONFLICT: Add at least one line/);
    const q = await draftWithLine(50);
    expect(await outcome(markQuoteSent(estimator, { quoteId: q.id, contactUserId: other.contact.id }))).toMatch(/^BAD_INPUT: Choose a contact/);
  });

  it('a sent quote is read-only; Revise copies it to rev B and supersedes rev A', async () => {
    const q = await draftWithLine(200);
    const sent = await markQuoteSent(estimator, { quoteId: q.id, contactUserId: cust.contact.id });
    const a = (await getQuote(q.id))!;
    expect(a.status).toBe('sent');
    // Valid for the rate set's days (demo rates: 30).
    expect(Math.round((sent.expiresAt.getTime() - a.sent_at!.getTime()) / 86_400_000)).toBe(a.valid_days);
    expect(await outcome(overrideLinePrice(estimator, { quoteId: q.id, lineId: q.lineId, price: 1, reason: 'after sending' }))).toMatch(/^CONFLICT: This quote is sent and can no longer be changed/);
    const b = await reviseQuote(estimator, q.id);
    expect(b.revision).toBe('B');
    const [oldA, newB] = await Promise.all([getQuote(q.id), getQuote(b.id)]);
    expect(oldA!.status).toBe('superseded');
    expect(newB!.status).toBe('draft');
    expect(newB!.number).toBe(oldA!.number);
    expect(newB!.lines.map((l) => [l.quantity, l.totalCents])).toEqual(oldA!.lines.map((l) => [l.quantity, l.totalCents]));
    expect(newB!.revisions.map((r) => r.revision)).toEqual(['A', 'B']);
    expect(await outcome(reviseQuote(estimator, q.id))).toMatch(/^CONFLICT: A superseded quote cannot be revised/);
    // The superseded revision is not offered to the customer.
    expect(await getPortalQuote(cust.id, q.id)).toBeNull();
  });

  it('a sent quote past its date reads as expired and cannot be accepted', async () => {
    const q = await draftWithLine(20);
    await markQuoteSent(estimator, { quoteId: q.id, contactUserId: cust.contact.id }, db, new Date(Date.now() - 31 * 86_400_000));
    expect((await getQuote(q.id))!.effective_status).toBe('expired');
    expect(await outcome(acceptQuote(cust.contact, { quoteId: q.id, poNumber: 'PO-LATE', neededBy: null }))).toMatch(/^CONFLICT: This quote expired on/);
    expect(await expireOverdueQuotes()).toBeGreaterThanOrEqual(1);
    expect((await getQuote(q.id))!.status).toBe('expired');
    // An expired quote may be revised into a fresh draft.
    expect((await reviseQuote(estimator, q.id)).revision).toBe('B');
  });

  it('the daily expiry job expires a sent quote past its date once, leaves a running one sent, and the customer can then neither accept nor decline it', async () => {
    const job = JOBS.find((j) => j.name === JOB.quoteExpiry);
    expect(job?.cron).toMatch(/^\d+ \d+ \* \* \*$/); // once a day
    const overdue = await draftWithLine(30);
    const running = await draftWithLine(40);
    const draft = await draftWithLine(50);
    await markQuoteSent(estimator, { quoteId: overdue.id, contactUserId: cust.contact.id }, db, new Date(Date.now() - 31 * 86_400_000));
    await markQuoteSent(estimator, { quoteId: running.id, contactUserId: cust.contact.id });
    const rows = () => db.selectFrom('quotes').select(['id', 'status', 'updated_at']).where('id', 'in', [overdue.id, running.id, draft.id]).orderBy('id').execute();
    const readBefore = Object.fromEntries((await rows()).map((r) => [r.id, r.status]));
    expect(readBefore).toEqual({ [overdue.id]: 'sent', [running.id]: 'sent', [draft.id]: 'draft' });

    const startedAt = new Date();
    const first = (await job!.handler({})) as { expired: number };
    expect(first.expired).toBeGreaterThanOrEqual(1);
    const afterFirst = await rows();
    expect(Object.fromEntries(afterFirst.map((r) => [r.id, r.status]))).toEqual({ [overdue.id]: 'expired', [running.id]: 'sent', [draft.id]: 'draft' });

    // Run again: nothing that was due by the first run is left to change, and our rows stay as they were.
    await job!.handler({});
    expect(await expireOverdueQuotes(db, startedAt)).toBe(0);
    expect(await rows()).toEqual(afterFirst);

    expect(await outcome(acceptQuote(cust.contact, { quoteId: overdue.id, poNumber: 'PO-EXPIRED', neededBy: null }))).toMatch(/^CONFLICT: This quote expired on/);
    expect(await outcome(declineQuote(cust.contact, { quoteId: overdue.id, reason: 'too late' }))).toMatch(/^CONFLICT: This quote expired on/);
    const orders = await db.selectFrom('work_orders as w').innerJoin('quote_lines as l', 'l.id', 'w.quote_line_id').select('w.id').where('l.quote_id', '=', overdue.id).execute();
    expect(orders).toHaveLength(0);
    expect((await findPortalQuotes(cust.id)).find((q) => q.id === overdue.id)?.status).toBe('expired');
    // The running quote is still open to the customer.
    expect((await acceptQuote(cust.contact, { quoteId: running.id, poNumber: 'PO-IN-TIME', neededBy: null })).workOrders).toHaveLength(1);
  });
});

describe('the customer decides', () => {
  it('another company’s quote is not found, and its data never shows', async () => {
    const q = await draftWithLine(30);
    await markQuoteSent(estimator, { quoteId: q.id, contactUserId: cust.contact.id });
    expect(await getPortalQuote(other.id, q.id)).toBeNull();
    expect((await findPortalQuotes(other.id)).map((x) => x.id)).not.toContain(q.id);
    expect(await outcome(acceptQuote(other.contact, { quoteId: q.id, poNumber: 'PO-X', neededBy: null }))).toBe('NOT_FOUND: That quote does not exist.');
    expect(await outcome(declineQuote(other.contact, { quoteId: q.id, reason: 'not ours' }))).toBe('NOT_FOUND: That quote does not exist.');
    expect((await getQuote(q.id))!.status).toBe('sent');
  });

  it('a draft is not visible to the customer', async () => {
    const q = await draftWithLine(10);
    expect(await getPortalQuote(cust.id, q.id)).toBeNull();
    expect(await outcome(acceptQuote(cust.contact, { quoteId: q.id, poNumber: 'PO-D', neededBy: null }))).toBe('NOT_FOUND: That quote does not exist.');
  });

  it('accepting with a PO opens one work order per line in one go, numbered W<year>-NNNNN', async () => {
    const q = await createQuote(estimator, { customerId: cust.id, isRush: false, notes: '' });
    await addQuoteLine(estimator, { quoteId: q.id, partId: cust.parts.screw, finishId: zincHs, quantity: 1500, basis: 'piece' });
    await addQuoteLine(estimator, { quoteId: q.id, partId: cust.parts.stem, finishId: nickel, quantity: 40, basis: 'dm2' });
    await markQuoteSent(estimator, { quoteId: q.id, contactUserId: cust.contact.id });
    const a = await acceptQuote(cust.contact, { quoteId: q.id, poNumber: 'PO-7781', neededBy: null });
    expect(a.estimatorId).toBe(estimator.id);
    expect(a.workOrders).toHaveLength(2);
    const wos = await db.selectFrom('work_orders').selectAll().where('id', 'in', a.workOrders.map((w) => w.id)).orderBy('number').execute();
    expect(wos.map((w) => w.number)).toEqual(a.workOrders.map((w) => w.number));
    for (const w of wos) expect(w.number).toMatch(/^W\d{4}-\d{5,}$/);
    expect(wos.map((w) => [w.state, w.po_number, w.customer_id])).toEqual([
      ['accepted', 'PO-7781', cust.id],
      ['accepted', 'PO-7781', cust.id],
    ]);
    // The hardened screw needs a bake; the stem does not. Prices come from the quote lines.
    expect(wos.map((w) => w.bake_required)).toEqual([true, false]);
    const lines = (await getQuote(q.id))!.lines;
    expect(wos.map((w) => w.total_cents)).toEqual(lines.map((l) => l.totalCents));
    expect((wos[0]!.quoted_cost as LinePrice).subtotalCents).toBe(lines[0]!.cost.subtotalCents);
    const quote = (await getQuote(q.id))!;
    expect([quote.status, quote.po_number, quote.decider_name]).toEqual(['accepted', 'PO-7781', cust.contact.name]);
    expect(await outcome(acceptQuote(cust.contact, { quoteId: q.id, poNumber: 'PO-AGAIN', neededBy: null }))).toMatch(/^CONFLICT: This quote is already accepted/);
  });

  it('a failure inside the acceptance leaves the quote sent and opens no work order', async () => {
    const q = await draftWithLine(10);
    await markQuoteSent(estimator, { quoteId: q.id, contactUserId: cust.contact.id });
    // A PO the work-order table refuses (only spaces after trimming) fails inside the transaction.
    expect(await outcome(acceptQuote(cust.contact, { quoteId: q.id, poNumber: '   ', neededBy: null }))).toMatch(/unexpected|BAD_INPUT|violates/);
    expect((await getQuote(q.id))!.status).toBe('sent');
    const count = await db.selectFrom('work_orders as w').innerJoin('quote_lines as l', 'l.id', 'w.quote_line_id').select(sql<number>`count(*)::int`.as('n')).where('l.quote_id', '=', q.id).executeTakeFirstOrThrow();
    expect(count.n).toBe(0);
  });

  it('declining keeps the reason; the quote can then be revised', async () => {
    const q = await draftWithLine(10);
    await markQuoteSent(estimator, { quoteId: q.id, contactUserId: cust.contact.id });
    await declineQuote(cust.contact, { quoteId: q.id, reason: 'Found a shop nearer to us' });
    const d = (await getQuote(q.id))!;
    expect([d.status, d.decline_reason]).toEqual(['declined', 'Found a shop nearer to us']);
    expect(await outcome(acceptQuote(cust.contact, { quoteId: q.id, poNumber: 'PO-1', neededBy: null }))).toMatch(/^CONFLICT: This quote is already declined/);
    expect((await reviseQuote(estimator, q.id)).revision).toBe('B');
  });
});
