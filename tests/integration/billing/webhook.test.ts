// The Stripe webhook route on the real test database: events signed with the SDK's own
// Stripe.webhooks.generateTestHeaderString, for success, decline, replay, forged and stale
// signatures, events out of order, and refunds.
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POST } from '@/app/api/webhooks/stripe/route';
import { db } from '@/db';
import { issueInvoice } from '@/lib/billing/mutations';
import { customerId, makeOrder, OWNER, sessionUser } from './fixtures';

// Read when a request arrives, so setting them here is in time.
const SECRET = 'whsec_billing_integration_test';
process.env.STRIPE_WEBHOOK_SECRET = SECRET;
process.env.SMTP_PORT ??= '2526'; // the test mail fake

afterAll(() => db.destroy());

const rid = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
type Obj = Record<string, unknown>;
const event = (type: string, object: Obj, id = rid('evt')) => ({ id, object: 'event', type, created: Math.floor(Date.now() / 1000), data: { object } });

async function deliver(evt: object, opts: { secret?: string; timestamp?: number; body?: string; header?: string | null } = {}) {
  const payload = JSON.stringify(evt);
  const header = opts.header === undefined
    ? Stripe.webhooks.generateTestHeaderString({ payload, secret: opts.secret ?? SECRET, timestamp: opts.timestamp })
    : opts.header;
  const headers: Record<string, string> = { 'content-type': 'application/json' };
  if (header !== null) headers['stripe-signature'] = header;
  const res = await POST(new Request('http://127.0.0.1:3100/api/webhooks/stripe', { method: 'POST', headers, body: opts.body ?? payload }));
  return { status: res.status, body: (await res.json()) as { duplicate?: boolean; outcome?: string; error?: { code: string; message: string } } };
}

let invoiceId = '';
let totalCents = 0;

async function freshInvoice(): Promise<{ id: string; total: number }> {
  const owner = await sessionUser(OWNER);
  // 1000 × 18.5 ¢ = 18 500 ¢; NGF 7.25 %: 1341.25 → 1341 ¢; total 19 841 ¢
  const o = await makeOrder({ customer: 'NGF', quantity: 1000, unitPriceCents: 18.5 });
  const inv = await issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] });
  return { id: inv.id, total: 19_841 };
}

async function state(id = invoiceId) {
  const inv = await db.selectFrom('invoices').select(['status', 'paid_cents']).where('id', '=', id).executeTakeFirstOrThrow();
  const payments = await db.selectFrom('payments').select(['kind', 'amount_cents']).where('invoice_id', '=', id).orderBy('created_at').execute();
  return { status: inv.status, paid: inv.paid_cents, payments: payments.map((p) => `${p.kind}:${p.amount_cents}`) };
}

const session = (pi: string, amount: number, id = invoiceId) => ({
  id: rid('cs_test'), object: 'checkout.session', payment_status: 'paid', payment_intent: pi, amount_total: amount, currency: 'usd', metadata: { invoice_id: id },
});
const intent = (pi: string, amount: number, id = invoiceId) => ({
  id: pi, object: 'payment_intent', amount, amount_received: amount, currency: 'usd', metadata: { invoice_id: id }, latest_charge: rid('ch'),
});

beforeAll(async () => {
  ({ id: invoiceId, total: totalCents } = await freshInvoice());
});

describe('signature checks', () => {
  it('refuses a forged signature with 400 and records nothing', async () => {
    const evt = event('checkout.session.completed', session(rid('pi'), totalCents));
    const r = await deliver(evt, { secret: 'whsec_someone_else' });
    expect(r.status).toBe(400);
    expect(r.body.error?.message).toMatch(/signature could not be verified/);
    expect(await db.selectFrom('stripe_events').select('id').where('id', '=', evt.id).executeTakeFirst()).toBeUndefined();
    expect(await state()).toEqual({ status: 'issued', paid: 0, payments: [] });
  });

  it('refuses a body changed after signing', async () => {
    const evt = event('checkout.session.completed', session(rid('pi'), 1));
    const tampered = JSON.stringify({ ...evt, data: { object: { ...evt.data.object, amount_total: 999_999 } } });
    expect((await deliver(evt, { body: tampered })).status).toBe(400);
  });

  it('refuses a stale timestamp (older than the 5-minute tolerance) and a missing header', async () => {
    const evt = event('checkout.session.completed', session(rid('pi'), totalCents));
    const r = await deliver(evt, { timestamp: Math.floor(Date.now() / 1000) - 600 });
    expect(r.status).toBe(400);
    expect(r.body.error?.message).toMatch(/tolerance/i);
    expect((await deliver(evt, { header: null })).status).toBe(400);
    expect(await state()).toEqual({ status: 'issued', paid: 0, payments: [] });
  });
});

describe('payment events', () => {
  it('records a declined card without changing the invoice', async () => {
    const failed = { ...intent(rid('pi'), totalCents), amount_received: 0, last_payment_error: { message: 'Your card was declined.' } };
    const evt = event('payment_intent.payment_failed', failed);
    const r = await deliver(evt);
    expect(r.status).toBe(200);
    expect(r.body.outcome).toBe('declined: Your card was declined.');
    expect(await state()).toEqual({ status: 'issued', paid: 0, payments: [] });
  });

  it('records a payment once, whichever of its two events arrives first, and ignores a replay', async () => {
    const pi = rid('pi');
    const first = event('payment_intent.succeeded', intent(pi, 10_000));
    expect((await deliver(first)).body.outcome).toBe('payment recorded; invoice partly paid');
    const second = event('checkout.session.completed', session(pi, 10_000));
    expect((await deliver(second)).body.outcome).toBe('payment already recorded');
    const replay = await deliver(first); // same event id, freshly signed
    expect(replay).toEqual({ status: 200, body: { received: true, duplicate: true, outcome: 'already processed' } });
    expect(await state()).toEqual({ status: 'partly_paid', paid: 10_000, payments: ['payment:10000'] });
  });

  it('pays the rest and e-mails a receipt', async () => {
    const since = new Date(Date.now() - 1000);
    const pi = rid('pi');
    const r = await deliver(event('checkout.session.completed', session(pi, totalCents - 10_000)));
    expect(r.body.outcome).toBe('payment recorded; invoice paid');
    expect(await state()).toEqual({ status: 'paid', paid: totalCents, payments: ['payment:10000', `payment:${totalCents - 10_000}`] });
    const mails = await db
      .selectFrom('emails')
      .select(['to_address', 'subject'])
      .where('template', '=', 'payment-receipt')
      .where(sql<boolean>`created_at >= ${since}`)
      .where('subject', 'like', '%$98.41%') // 19 841 − 10 000 = 9 841 ¢
      .execute();
    expect(mails.map((m) => m.to_address)).toContain('ap@northgate-fastener.test');
  });

  it('records refunds by the charge running total: replays and older totals add nothing', async () => {
    const { id } = await freshInvoice();
    const pi = rid('pi');
    const charge = { id: rid('ch'), object: 'charge', amount: 19_841, amount_captured: 19_841, currency: 'usd', payment_intent: pi, metadata: { invoice_id: id } };
    // The refund arrives before the payment's own events: the payment is recorded from the charge.
    const r1 = await deliver(event('charge.refunded', { ...charge, amount_refunded: 5_000 }));
    expect(r1.body.outcome).toBe('refund recorded; invoice partly paid');
    expect(await state(id)).toEqual({ status: 'partly_paid', paid: 14_841, payments: ['payment:19841', 'refund:5000'] });
    expect((await deliver(event('payment_intent.succeeded', intent(pi, 19_841, id)))).body.outcome).toBe('payment already recorded');
    await deliver(event('charge.refunded', { ...charge, amount_refunded: 7_000 }));
    await deliver(event('charge.refunded', { ...charge, amount_refunded: 5_000 })); // older news, new event id
    expect(await state(id)).toEqual({ status: 'partly_paid', paid: 12_841, payments: ['payment:19841', 'refund:5000', 'refund:2000'] });
  });

  it('answers 200 to events it does not use, and holds money for unknown invoices as a payment exception', async () => {
    expect((await deliver(event('customer.created', { id: rid('cus'), object: 'customer' }))).body.outcome).toBe('ignored: event type customer.created is not used');
    const pi = rid('pi');
    const ghost = await deliver(event('payment_intent.succeeded', intent(pi, 100, '00000000-0000-4000-8000-000000000000')));
    expect(ghost.status).toBe(200);
    expect(ghost.body.outcome).toMatch(/^exception: \$1\.00 arrived .* which does not exist\.$/);
    const held = await db.selectFrom('payment_exceptions').select(['reason', 'amount_cents', 'payment_id']).where('stripe_payment_intent_id', '=', pi).execute();
    expect(held).toEqual([{ reason: 'unknown_invoice', amount_cents: 100, payment_id: null }]);
  });
});
