// Paying through the official SDK against the local Stripe fake, started in-process: the checkout
// session is created on the server for the open balance, the fake's payment page takes a test
// card, and the fake's own signed webhooks reach the route handler through a small relay.
import http from 'node:http';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POST } from '@/app/api/webhooks/stripe/route';
import { db } from '@/db';
import { startInvoiceCheckout } from '@/lib/billing/checkout';
import { refundExcess, resolvePaymentException } from '@/lib/billing/credit';
import { processStripeEvent } from '@/lib/billing/webhook';
import { todayIso } from '@/lib/billing/dates';
import { issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { stripeClient } from '@/lib/billing/stripe';
import { startStripeFake, type StripeFake } from '../../../docker-free-scripts/fakes/stripe-fake';
import { customerId, makeOrder, NGF_BUYER, OWNER, sessionUser } from './fixtures';

const SECRET = 'whsec_billing_fake_test';
let fake: StripeFake;
let relay: http.Server;
let stateDir: string;

// Forwards the fake's webhook POSTs to the route handler, headers and raw body untouched.
function startRelay(): Promise<string> {
  relay = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', async () => {
      const r = await POST(
        new Request('http://127.0.0.1/api/webhooks/stripe', {
          method: 'POST',
          headers: { 'stripe-signature': String(req.headers['stripe-signature'] ?? ''), 'content-type': 'application/json' },
          body: Buffer.concat(chunks).toString('utf8'),
        }),
      );
      res.writeHead(r.status, { 'content-type': 'application/json' });
      res.end(await r.text());
    });
  });
  return new Promise((resolve) => relay.listen(0, '127.0.0.1', () => resolve(`http://127.0.0.1:${(relay.address() as { port: number }).port}/`)));
}

beforeAll(async () => {
  stateDir = mkdtempSync(path.join(os.tmpdir(), 'ampwright-billing-fake-'));
  const webhookUrl = await startRelay();
  fake = await startStripeFake({ port: 0, stateDir, webhookUrl, webhookSecret: SECRET, retryDelaysMs: [], log: () => undefined });
  process.env.STRIPE_SECRET_KEY = 'sk_test_billing_fake';
  process.env.STRIPE_API_BASE = fake.url;
  process.env.STRIPE_WEBHOOK_SECRET = SECRET;
  process.env.SMTP_PORT ??= '2526';
});

afterAll(async () => {
  await fake?.close();
  await new Promise((r) => relay?.close(r));
  rmSync(stateDir, { recursive: true, force: true });
  await db.destroy();
});

async function submitCard(url: string, card: string): Promise<Response> {
  return fetch(url, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: `card=${card}`, redirect: 'manual' });
}

type FakeEventRow = { id: string; type: string; object_id: string; delivery: { status: string } | null };

describe('paying an invoice through the local Stripe fake', () => {
  it('declines a card, then takes a payment for the open balance, once, and a refund', async () => {
    const owner = await sessionUser(OWNER);
    const buyer = await sessionUser(NGF_BUYER);
    const o = await makeOrder({ customer: 'NGF', quantity: 1000, unitPriceCents: 18.5 });
    // 18 500 ¢ + 7.25 % (1341.25 → 1341 ¢) = 19 841 ¢
    const inv = await issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] });

    const { url } = await startInvoiceCheckout(buyer, inv.id);
    expect(url).toMatch(new RegExp(`^${fake.url}/pay/cs_test_`));
    const sessionId = url.split('/pay/')[1]!;
    const session = await stripeClient().checkout.sessions.retrieve(sessionId);
    expect([session.amount_total, session.metadata?.invoice_id]).toEqual([19_841, inv.id]);
    expect(session.success_url).toContain(`/portal/invoices/${inv.id}?payment=done`);
    // A second click while the first payment page is open reuses it.
    expect((await startInvoiceCheckout(buyer, inv.id)).url).toBe(url);

    expect((await submitCard(url, '4000000000000002')).status).toBe(402);
    const declined = await db.selectFrom('stripe_events').select('outcome').where('invoice_id', '=', inv.id).execute();
    expect(declined.map((e) => e.outcome)).toEqual(['declined: Your card was declined.']);

    const paid = await submitCard(url, '4242424242424242');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toContain(`/portal/invoices/${inv.id}?payment=done&session=${sessionId}`);
    const invoice = () => db.selectFrom('invoices').select(['status', 'paid_cents']).where('id', '=', inv.id).executeTakeFirstOrThrow();
    expect(await invoice()).toEqual({ status: 'paid', paid_cents: 19_841 });

    // Replay every event the fake sent for this payment: nothing changes.
    const events = ((await (await fetch(`${fake.url}/_fake/events`)).json()) as { data: FakeEventRow[] }).data;
    const mine = events.filter((e) => e.object_id === sessionId || e.type === 'payment_intent.succeeded');
    expect(mine.length).toBeGreaterThanOrEqual(2);
    for (const e of mine) await fetch(`${fake.url}/_fake/events/${e.id}/resend`, { method: 'POST' });
    const payments = await db.selectFrom('payments').select(['kind', 'amount_cents']).where('invoice_id', '=', inv.id).execute();
    expect(payments).toEqual([{ kind: 'payment', amount_cents: 19_841 }]);

    // Nothing is left to pay, so no new payment page is opened.
    await expect(startInvoiceCheckout(buyer, inv.id)).rejects.toThrow(/nothing left to pay/);

    // A partial refund made through the SDK comes back as charge.refunded.
    const pi = (await stripeClient().checkout.sessions.retrieve(sessionId)).payment_intent as string;
    await stripeClient().refunds.create({ payment_intent: pi, amount: 5_000 });
    expect(await invoice()).toEqual({ status: 'partly_paid', paid_cents: 14_841 });
  });

  it('refunds credit on account to the card once, though the refund also comes back as an event', async () => {
    const owner = await sessionUser(OWNER);
    const buyer = await sessionUser(NGF_BUYER);
    const o = await makeOrder({ customer: 'NGF', quantity: 1000, unitPriceCents: 18.5 });
    const inv = await issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] });
    const { url } = await startInvoiceCheckout(buyer, inv.id);
    expect((await submitCard(url, '4242424242424242')).status).toBe(303);
    // The customer's check for the same invoice arrives too: the office confirms it as credit.
    await recordManualPayment(owner.id, { invoiceId: inv.id, amount: 19_841, method: 'check', reference: 'Check 77', receivedOn: todayIso(), acceptExcess: true });
    const invoice = () => db.selectFrom('invoices').select(['status', 'paid_cents']).where('id', '=', inv.id).executeTakeFirstOrThrow();
    expect(await invoice()).toEqual({ status: 'overpaid', paid_cents: 39_682 });

    const result = await refundExcess(owner.id, { invoiceId: inv.id, amount: 19_841, method: 'card', reference: '' });
    expect(result.message).toMatch(/^\$198\.41 refunded to the card \(re_/);
    expect(await invoice()).toEqual({ status: 'paid', paid_cents: 19_841 });
    const refunds = await db.selectFrom('payments').select(['amount_cents', 'method']).where('invoice_id', '=', inv.id).where('kind', '=', 'refund').execute();
    expect(refunds).toEqual([{ amount_cents: 19_841, method: 'card' }]);
    const pi = (await stripeClient().checkout.sessions.retrieve(url.split('/pay/')[1]!)).payment_intent as string;
    const charge = (await stripeClient().paymentIntents.retrieve(pi)).latest_charge as string;
    expect((await stripeClient().charges.retrieve(charge)).amount_refunded).toBe(19_841);
  });

  it('refunds money paid in another currency, held as an exception, without touching the invoice', async () => {
    const owner = await sessionUser(OWNER);
    const o = await makeOrder({ customer: 'NGF' });
    const inv = await issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] });
    const metadata = { invoice_id: inv.id };
    const session = await stripeClient().checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 12_345, product_data: { name: 'Wrong currency' } } }],
      metadata,
      payment_intent_data: { metadata },
      success_url: 'http://127.0.0.1:3100/portal',
      cancel_url: 'http://127.0.0.1:3100/portal',
    });
    expect((await submitCard(session.url!, '4242424242424242')).status).toBe(303);
    const ex = await db.selectFrom('payment_exceptions').selectAll().where('invoice_id', '=', inv.id).executeTakeFirstOrThrow();
    expect([ex.reason, ex.amount_cents, ex.currency, ex.payment_id]).toEqual(['wrong_currency', 12_345, 'eur', null]);

    const done = await resolvePaymentException(owner.id, { exceptionId: ex.id, action: 'refund', note: 'paid in euros by mistake' });
    expect(done.message).toMatch(/^Refunded through Stripe \(re_\w+\): paid in euros by mistake$/);
    const after = await db.selectFrom('payment_exceptions').select(['status', 'resolved_by']).where('id', '=', ex.id).executeTakeFirstOrThrow();
    expect(after).toEqual({ status: 'resolved', resolved_by: owner.id });
    // The refund's own event changes no invoice.
    expect(await db.selectFrom('payments').select('id').where('invoice_id', '=', inv.id).execute()).toEqual([]);
    expect((await db.selectFrom('invoices').select('status').where('id', '=', inv.id).executeTakeFirstOrThrow()).status).toBe('issued');
    await expect(resolvePaymentException(owner.id, { exceptionId: ex.id, action: 'refund', note: '' })).rejects.toThrow('already resolved');
  });

  it("passes on Stripe's own refusal of a refund, and leaves the exception open", async () => {
    const owner = await sessionUser(OWNER);
    const pi = `pi_not_at_stripe_${Date.now()}`;
    const evt = { id: `evt_${Date.now()}`, object: 'event', type: 'payment_intent.succeeded', created: Math.floor(Date.now() / 1000), data: { object: { id: pi, object: 'payment_intent', amount: 900, amount_received: 900, currency: 'usd', metadata: {}, latest_charge: null } } };
    await processStripeEvent(evt as never);
    const ex = await db.selectFrom('payment_exceptions').select(['id']).where('stripe_payment_intent_id', '=', pi).executeTakeFirstOrThrow();
    await expect(resolvePaymentException(owner.id, { exceptionId: ex.id, action: 'refund', note: '' })).rejects.toThrow(/^Stripe refused the refund: /);
    expect((await db.selectFrom('payment_exceptions').select('status').where('id', '=', ex.id).executeTakeFirstOrThrow()).status).toBe('open');
  });

  it('reports an unreachable payment service as such, with nothing charged', async () => {
    const buyer = await sessionUser(NGF_BUYER);
    const owner = await sessionUser(OWNER);
    const o = await makeOrder({ customer: 'NGF' });
    const inv = await issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] });
    const saved = process.env.STRIPE_API_BASE;
    process.env.STRIPE_API_BASE = 'http://127.0.0.1:9'; // nothing listens on the discard port
    try {
      await expect(startInvoiceCheckout(buyer, inv.id)).rejects.toThrow('The payment service could not be reached. Nothing was charged; please try again in a moment.');
    } finally {
      process.env.STRIPE_API_BASE = saved;
    }
  });
});
