// Money that does not fit an invoice as asked, on the real test database: overpayments become
// credit on account (shown, refundable, applicable), and payments that cannot be matched land in
// the exceptions list with what Stripe sent. Events go through the webhook route, signed with the
// SDK's own Stripe.webhooks.generateTestHeaderString.
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POST } from '@/app/api/webhooks/stripe/route';
import { db } from '@/db';
import { applyCredit, customerCredit, refundExcess, resolvePaymentException } from '@/lib/billing/credit';
import { countOpenExceptions } from '@/lib/billing/exceptions';
import { issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { getInvoiceDetail, receivablesReport } from '@/lib/billing/queries';
import { todayIso } from '@/lib/billing/dates';
import { customerId, makeOrder, OWNER, sessionUser } from './fixtures';

const SECRET = 'whsec_payment_exceptions_test';
process.env.STRIPE_WEBHOOK_SECRET = SECRET;
process.env.SMTP_PORT ??= '2526';

afterAll(() => db.destroy());

const rid = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
const event = (type: string, object: Record<string, unknown>, id = rid('evt')) => ({ id, object: 'event', type, created: Math.floor(Date.now() / 1000), data: { object } });

async function deliver(evt: object) {
  const payload = JSON.stringify(evt);
  const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET });
  const res = await POST(new Request('http://127.0.0.1:3100/api/webhooks/stripe', { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload }));
  return { status: res.status, body: (await res.json()) as { outcome?: string } };
}

const intent = (o: { pi?: string; invoiceId: string | null; amount: number; received?: number; currency?: string; customerId?: string }) => ({
  id: o.pi ?? rid('pi'),
  object: 'payment_intent',
  amount: o.amount,
  amount_received: o.received ?? o.amount,
  currency: o.currency ?? 'usd',
  metadata: { ...(o.invoiceId ? { invoice_id: o.invoiceId } : {}), ...(o.customerId ? { customer_id: o.customerId } : {}) },
  latest_charge: rid('ch'),
});

// 1000 × 18.5 ¢ = 18 500 ¢; NGF's tax 7.25 % → 1341 ¢; total 19 841 ¢ (hand arithmetic).
const NGF_TOTAL = 19_841;

async function ngfInvoice(): Promise<string> {
  const owner = await sessionUser(OWNER);
  const o = await makeOrder({ customer: 'NGF', quantity: 1000, unitPriceCents: 18.5 });
  return (await issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] })).id;
}

async function exceptionsFor(where: { invoiceId?: string; intent?: string }) {
  let q = db.selectFrom('payment_exceptions').selectAll().orderBy('created_at');
  if (where.invoiceId) q = q.where('invoice_id', '=', where.invoiceId);
  if (where.intent) q = q.where('stripe_payment_intent_id', '=', where.intent);
  return q.execute();
}

let ngf = '';
beforeAll(async () => {
  ngf = await customerId('NGF');
});

describe('an overpayment by card', () => {
  it('is recorded, marks the invoice overpaid, makes the excess credit on account, and tells the owner', async () => {
    const invoiceId = await ngfInvoice();
    const since = new Date(Date.now() - 1000);
    const pi = rid('pi');
    // The defect as found: a signed payment_intent.succeeded with amount_received 999 999 999 ¢.
    const r = await deliver(event('payment_intent.succeeded', intent({ pi, invoiceId, amount: NGF_TOTAL, received: 999_999_999 })));
    expect(r.status).toBe(200);
    expect(r.body.outcome).toBe('payment recorded; invoice overpaid; $9,999,801.58 credit on account');

    const d = (await getInvoiceDetail('staff', invoiceId))!;
    expect([d.invoice.status, d.invoice.paid_cents, d.summary.openCents, d.summary.excessCents]).toEqual(['overpaid', 999_999_999, NGF_TOTAL - 999_999_999, 999_999_999 - NGF_TOTAL]);

    const [ex] = await exceptionsFor({ invoiceId });
    expect(ex).toMatchObject({ reason: 'amount_differs', status: 'open', amount_cents: 999_999_999, customer_id: ngf, source: 'stripe', stripe_payment_intent_id: pi });
    expect(ex!.payment_id).not.toBeNull();
    expect((ex!.payload as { amount_received: number }).amount_received).toBe(999_999_999);
    expect(ex!.message).toBe(`$9,999,999.99 arrived for invoice ${d.invoice.number}; the checkout asked for $198.41.`);

    // The excess is not owed money: it is out of the aging and in the credits beside it.
    const report = await receivablesReport();
    expect(report.invoices.some((i) => i.invoiceId === invoiceId)).toBe(false);
    expect(report.credits.find((c) => c.customerId === ngf)!.creditCents).toBeGreaterThanOrEqual(999_999_999 - NGF_TOTAL);
    expect((await customerCredit(ngf)).invoices.find((i) => i.id === invoiceId)!.excessCents).toBe(999_999_999 - NGF_TOTAL);

    const mails = await db.selectFrom('emails').select(['to_address', 'subject']).where('template', '=', 'payment-exception').where(sql<boolean>`created_at >= ${since}`).execute();
    expect(mails.map((m) => m.to_address)).toContain(OWNER);
    expect(mails[0]!.subject).toBe('Payment to check: Amount differs from what was asked ($9,999,999.99)');
    expect((await countOpenExceptions()).count).toBeGreaterThanOrEqual(1);
  });

  it('for an invoice that is already paid is credit on account in full, flagged once however often Stripe repeats it', async () => {
    const invoiceId = await ngfInvoice();
    await deliver(event('payment_intent.succeeded', intent({ invoiceId, amount: NGF_TOTAL })));
    const pi = rid('pi');
    const second = intent({ pi, invoiceId, amount: 5_000 });
    expect((await deliver(event('payment_intent.succeeded', second))).body.outcome).toBe('payment recorded; invoice overpaid; $50.00 credit on account');
    // The session event about the same payment, then a fresh copy of the intent event.
    const sessionEvent = { id: rid('cs_test'), object: 'checkout.session', payment_status: 'paid', payment_intent: pi, amount_total: 5_000, currency: 'usd', metadata: { invoice_id: invoiceId } };
    expect((await deliver(event('checkout.session.completed', sessionEvent))).body.outcome).toBe('payment already recorded');
    await deliver(event('payment_intent.succeeded', second));
    const exs = await exceptionsFor({ invoiceId });
    expect(exs.map((e) => e.reason)).toEqual(['already_paid']);
    const d = (await getInvoiceDetail('staff', invoiceId))!;
    expect([d.invoice.status, d.summary.excessCents, d.payments.length]).toEqual(['overpaid', 5_000, 2]);
  });
});

describe('payments that fit no invoice', () => {
  it('in another currency: nothing on the invoice, an exception with the amount and what Stripe sent', async () => {
    const invoiceId = await ngfInvoice();
    const pi = rid('pi');
    const r = await deliver(event('payment_intent.succeeded', intent({ pi, invoiceId, amount: 18_000, currency: 'eur' })));
    expect(r.body.outcome).toMatch(/^exception: €180\.00 arrived for invoice I\d{4}-\d{5}, which is invoiced in USD\.$/);
    const d = (await getInvoiceDetail('staff', invoiceId))!;
    expect([d.invoice.status, d.invoice.paid_cents, d.payments.length]).toEqual(['issued', 0, 0]);
    const [ex] = await exceptionsFor({ intent: pi });
    expect(ex).toMatchObject({ reason: 'wrong_currency', amount_cents: 18_000, currency: 'eur', payment_id: null, invoice_id: invoiceId });
    expect((await countOpenExceptions()).offBooksCents).toBeGreaterThanOrEqual(18_000);
  });

  it('for an unknown invoice, or naming none: an exception, once per payment', async () => {
    const pi = rid('pi');
    const ghost = '00000000-0000-4000-8000-000000000000';
    const r = await deliver(event('payment_intent.succeeded', intent({ pi, invoiceId: ghost, amount: 777 })));
    expect(r.body.outcome).toBe(`exception: $7.77 arrived (payment ${pi}) naming invoice id ${ghost}, which does not exist.`);
    await deliver(event('payment_intent.succeeded', intent({ pi, invoiceId: ghost, amount: 777 })));
    expect((await exceptionsFor({ intent: pi })).map((e) => [e.reason, e.amount_cents, e.invoice_id])).toEqual([['unknown_invoice', 777, null]]);

    const none = rid('pi');
    expect((await deliver(event('payment_intent.succeeded', intent({ pi: none, invoiceId: null, amount: 500 })))).body.outcome).toBe(`exception: $5.00 arrived (payment ${none}) naming no invoice.`);
  });

  it("for another customer's invoice: not put on that invoice", async () => {
    const invoiceId = await ngfInvoice();
    const pi = rid('pi');
    const r = await deliver(event('payment_intent.succeeded', intent({ pi, invoiceId, amount: NGF_TOTAL, customerId: await customerId('HVI') })));
    expect(r.body.outcome).toMatch(/^exception: .* from a checkout opened for another customer\.$/);
    expect((await getInvoiceDetail('staff', invoiceId))!.invoice.paid_cents).toBe(0);
    expect((await exceptionsFor({ intent: pi }))[0]).toMatchObject({ reason: 'other_customer', payment_id: null, customer_id: null });
  });

  it('for a credited invoice: credit on account in full, flagged', async () => {
    const owner = await sessionUser(OWNER);
    const invoiceId = await ngfInvoice();
    const { issueCreditNote } = await import('@/lib/billing/mutations');
    await issueCreditNote(owner.id, { invoiceId, amount: NGF_TOTAL, reason: 'Cancelled by agreement' });
    await deliver(event('payment_intent.succeeded', intent({ invoiceId, amount: NGF_TOTAL })));
    const d = (await getInvoiceDetail('staff', invoiceId))!;
    expect([d.invoice.status, d.summary.excessCents]).toEqual(['overpaid', NGF_TOTAL]);
    expect((await exceptionsFor({ invoiceId })).map((e) => e.reason)).toEqual(['credited_invoice']);
  });
});

describe('credit on account is refunded or applied, each an entry of its own', () => {
  it('applies to another open invoice of the same customer, never beyond the credit or the balance', async () => {
    const owner = await sessionUser(OWNER);
    const from = await ngfInvoice();
    const to = await ngfInvoice();
    await recordManualPayment(owner.id, { invoiceId: from, amount: NGF_TOTAL + 3_000, method: 'check', reference: 'Check 1', receivedOn: todayIso(), acceptExcess: true });
    await expect(applyCredit(owner.id, { fromInvoiceId: from, toInvoiceId: to, amount: 3_001, note: '' })).rejects.toThrow('Apply at most $30.00');
    await applyCredit(owner.id, { fromInvoiceId: from, toInvoiceId: to, amount: 2_000, note: 'as agreed' });
    const a = (await getInvoiceDetail('staff', from))!;
    const b = (await getInvoiceDetail('staff', to))!;
    expect([a.invoice.status, a.summary.excessCents]).toEqual(['overpaid', 1_000]);
    expect([b.invoice.status, b.summary.openCents]).toEqual(['partly_paid', NGF_TOTAL - 2_000]);
    expect(b.creditMoves.map((m) => [m.from_number, m.amount_cents])).toEqual([[a.invoice.number, 2_000]]);
    const audit = await db.selectFrom('audit_log').select('action').where('entity_id', '=', from).where('action', '=', 'invoice.credit_apply').execute();
    expect(audit).toHaveLength(1);

    // Another customer's invoice is refused and nothing moves.
    const hviOrder = await makeOrder({ customer: 'HVI' });
    const hvi = await issueInvoice(owner.id, { customerId: await customerId('HVI'), orderIds: [hviOrder.id], extras: [] });
    await expect(applyCredit(owner.id, { fromInvoiceId: from, toInvoiceId: hvi.id, amount: 500, note: '' })).rejects.toThrow(/another customer's/);
    expect((await getInvoiceDetail('staff', from))!.summary.excessCents).toBe(1_000);
  });

  it('refunds by check, never more than the credit', async () => {
    const owner = await sessionUser(OWNER);
    const inv = await ngfInvoice();
    await recordManualPayment(owner.id, { invoiceId: inv, amount: NGF_TOTAL + 1_500, method: 'check', reference: 'Check 2', receivedOn: todayIso(), acceptExcess: true });
    await expect(refundExcess(owner.id, { invoiceId: inv, amount: 1_501, method: 'check', reference: '' })).rejects.toThrow('Refund at most the credit of $15.00.');
    await refundExcess(owner.id, { invoiceId: inv, amount: 1_500, method: 'check', reference: 'Check 901' });
    const d = (await getInvoiceDetail('staff', inv))!;
    expect([d.invoice.status, d.summary.openCents, d.payments.map((p) => `${p.kind}:${p.amount_cents}`).sort()]).toEqual(['paid', 0, [`payment:${NGF_TOTAL + 1_500}`, 'refund:1500']]);
  });

  it('a check above the balance asks to confirm, and changes nothing until it is confirmed', async () => {
    const owner = await sessionUser(OWNER);
    const inv = await ngfInvoice();
    await expect(recordManualPayment(owner.id, { invoiceId: inv, amount: NGF_TOTAL + 1, method: 'check', reference: '', receivedOn: todayIso() })).rejects.toThrow(
      'That is $0.01 more than the open balance of $198.41. Tick "Keep the excess as credit on account" to record it all.',
    );
    expect((await getInvoiceDetail('staff', inv))!.payments).toHaveLength(0);
  });

  it('an exception whose money is on no invoice cannot be closed by keeping it', async () => {
    const owner = await sessionUser(OWNER);
    const pi = rid('pi');
    await deliver(event('payment_intent.succeeded', intent({ pi, invoiceId: null, amount: 1_234 })));
    const [ex] = await exceptionsFor({ intent: pi });
    await expect(resolvePaymentException(owner.id, { exceptionId: ex!.id, action: 'keep', note: '' })).rejects.toThrow(/cannot simply be kept/);
    expect((await exceptionsFor({ intent: pi }))[0]!.status).toBe('open');
  });
});
