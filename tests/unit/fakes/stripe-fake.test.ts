import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import Stripe from 'stripe';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { startStripeFake, type StripeFake } from '@/docker-free-scripts/fakes/stripe-fake';

const SECRET = 'whsec_unit_test_secret';
const quiet = () => undefined;

type Received = { body: string; signature: string };
type Receiver = { url: string; received: Received[]; failNext: number; close(): Promise<void> };

/** A stand-in for the app's webhook route: keeps the raw body and signature of each delivery. */
async function startReceiver(): Promise<Receiver> {
  const state = { received: [] as Received[], failNext: 0 };
  const server = http.createServer((req, res) => {
    let body = '';
    req.on('data', (c: Buffer) => (body += c.toString('utf8')));
    req.on('end', () => {
      if (state.failNext > 0) {
        state.failNext -= 1;
        res.writeHead(500).end('not now');
        return;
      }
      state.received.push({ body, signature: String(req.headers['stripe-signature'] ?? '') });
      res.writeHead(200, { 'content-type': 'application/json' }).end('{"received":true}');
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  return Object.assign(state, {
    url: `http://127.0.0.1:${port}/api/webhooks/stripe`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  });
}

let stateDir: string;
let receiver: Receiver;
let fake: StripeFake;
let stripe: Stripe;

async function startFake() {
  fake = await startStripeFake({
    port: 0,
    stateDir,
    webhookUrl: receiver.url,
    webhookSecret: SECRET,
    retryDelaysMs: [30, 60],
    log: quiet,
  });
  // The client settings the app uses (STACK.md, "Hosted-service fakes").
  stripe = new Stripe('sk_test_unit', {
    host: '127.0.0.1',
    port: fake.port,
    protocol: 'http',
    maxNetworkRetries: 0,
    telemetry: false,
  });
}

beforeEach(async () => {
  stateDir = fs.mkdtempSync(path.join(os.tmpdir(), 'stripe-fake-'));
  receiver = await startReceiver();
  await startFake();
});

afterEach(async () => {
  await fake.close();
  await receiver.close();
  fs.rmSync(stateDir, { recursive: true, force: true });
});

const eventsOfType = (type: string) =>
  receiver.received.filter((r) => (JSON.parse(r.body) as { type: string }).type === type);

function createSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) {
  return stripe.checkout.sessions.create({
    mode: 'payment',
    customer_email: 'buyer@customer.test',
    client_reference_id: 'inv_1001',
    metadata: { invoice_id: 'inv_1001' },
    payment_intent_data: { metadata: { invoice_id: 'inv_1001' } },
    line_items: [
      { quantity: 2, price_data: { currency: 'usd', unit_amount: 1250, product_data: { name: 'Zinc plating, lot 7' } } },
      { quantity: 1, price_data: { currency: 'usd', unit_amount: 500, product_data: { name: 'Bake for hydrogen relief' } } },
    ],
    success_url: 'http://127.0.0.1:3000/pay/done?session_id={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:3000/invoices/inv_1001',
    ...extra,
  });
}

function submitCard(sessionUrl: string, card: string) {
  return fetch(sessionUrl, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card }).toString(),
    redirect: 'manual',
  });
}

describe('stripe fake through the real stripe SDK', () => {
  it('creates and retrieves a customer and a checkout session', async () => {
    const customer = await stripe.customers.create({ email: 'buyer@customer.test', name: 'Acme Hardware' });
    expect(customer.id).toMatch(/^cus_/);
    expect((await stripe.customers.retrieve(customer.id)) as Stripe.Customer).toMatchObject({
      email: 'buyer@customer.test',
      name: 'Acme Hardware',
    });

    const session = await createSession();
    expect(session.id).toMatch(/^cs_test_/);
    expect(session.url).toBe(`${fake.url}/pay/${session.id}`);
    expect(session).toMatchObject({ amount_total: 2 * 1250 + 500, currency: 'usd', status: 'open', payment_status: 'unpaid' });

    const again = await stripe.checkout.sessions.retrieve(session.id, { expand: ['line_items'] });
    expect(again.client_reference_id).toBe('inv_1001');
    expect(again.metadata).toEqual({ invoice_id: 'inv_1001' });
    expect(again.line_items?.data.map((i) => i.description)).toEqual(['Zinc plating, lot 7', 'Bake for hydrogen relief']);
  });

  it('serves a plain payment page for the session', async () => {
    const session = await createSession();
    const res = await fetch(session.url ?? '');
    const html = await res.text();
    expect(res.status).toBe(200);
    expect(html).toContain('<h1>Test payment</h1>');
    expect(html).toContain('$30.00');
    expect(html).toContain('This is a local test payment page. No real card is charged.');
    expect(html).toContain('<label for="card">Card number</label>');
    expect(html).toContain('href="http://127.0.0.1:3000/invoices/inv_1001"');
  });

  it('pays with 4242…, redirects, and sends webhooks that the SDK verifies', async () => {
    const session = await createSession();
    const res = await submitCard(session.url ?? '', '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:3000/pay/done?session_id=${session.id}`);

    const types = receiver.received.map((r) => (JSON.parse(r.body) as { type: string }).type);
    expect(types).toEqual(['checkout.session.completed', 'payment_intent.succeeded']);
    for (const { body, signature } of receiver.received) {
      const event = stripe.webhooks.constructEvent(body, signature, SECRET);
      expect(event.livemode).toBe(false);
      expect(() => stripe.webhooks.constructEvent(body, signature, 'whsec_wrong')).toThrow(
        Stripe.errors.StripeSignatureVerificationError,
      );
      expect(() => stripe.webhooks.constructEvent(body.replace('"livemode": false', '"livemode": true'), signature, SECRET))
        .toThrow(Stripe.errors.StripeSignatureVerificationError);
    }
    const completed = stripe.webhooks.constructEvent(receiver.received[0]!.body, receiver.received[0]!.signature, SECRET);
    const paidSession = completed.data.object as Stripe.Checkout.Session;
    expect(paidSession).toMatchObject({ id: session.id, status: 'complete', payment_status: 'paid', client_reference_id: 'inv_1001' });

    const retrieved = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent'] });
    const intent = retrieved.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({ status: 'succeeded', amount: 3000, amount_received: 3000 });
    expect(intent.metadata).toEqual({ invoice_id: 'inv_1001' });
    expect((await stripe.paymentIntents.retrieve(intent.id)).status).toBe('succeeded');

    // A second submit (double click) must not pay twice.
    const twice = await submitCard(session.url ?? '', '4242424242424242');
    expect(twice.status).toBe(303);
    expect(receiver.received).toHaveLength(2);
  });

  it('declines 4000…0002 with payment_failed and leaves the session open', async () => {
    const session = await createSession();
    const res = await submitCard(session.url ?? '', '4000000000000002');
    expect(res.status).toBe(402);
    expect(await res.text()).toContain('Your card was declined.');
    const failed = eventsOfType('payment_intent.payment_failed');
    expect(failed).toHaveLength(1);
    const event = stripe.webhooks.constructEvent(failed[0]!.body, failed[0]!.signature, SECRET);
    expect((event.data.object as Stripe.PaymentIntent).last_payment_error?.code).toBe('card_declined');
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');

    const other = await submitCard(session.url ?? '', '1111222233334444');
    expect(other.status).toBe(400);
    expect(await other.text()).toContain('Use one of the test card numbers.');
  });

  it('refunds part of a payment with a charge.refunded event, and refuses too much', async () => {
    const session = await createSession();
    await submitCard(session.url ?? '', '4242424242424242');
    const { payment_intent } = await stripe.checkout.sessions.retrieve(session.id);
    const refund = await stripe.refunds.create({ payment_intent: String(payment_intent), amount: 1000 });
    expect(refund).toMatchObject({ object: 'refund', amount: 1000, status: 'succeeded', currency: 'usd' });

    const refunded = eventsOfType('charge.refunded');
    expect(refunded).toHaveLength(1);
    const charge = stripe.webhooks.constructEvent(refunded[0]!.body, refunded[0]!.signature, SECRET).data.object as Stripe.Charge;
    expect(charge).toMatchObject({ amount: 3000, amount_refunded: 1000, refunded: false, payment_intent: payment_intent });

    await expect(stripe.refunds.create({ payment_intent: String(payment_intent), amount: 2001 })).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      code: 'amount_too_large',
      param: 'amount',
    });
  });

  it('refuses calls without a test secret key with 401', async () => {
    const live = new Stripe('sk_live_nope', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    await expect(live.customers.list()).rejects.toMatchObject({ type: 'StripeAuthenticationError', statusCode: 401 });
    const bare = await fetch(`${fake.url}/v1/customers`);
    expect(bare.status).toBe(401);
    const body = (await bare.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');
    expect(body.error.message).toMatch(/API key/);
  });

  it('answers missing objects with 404 and bad parameters with 400, in Stripe error shape', async () => {
    await expect(stripe.customers.retrieve('cus_missing')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 404,
      code: 'resource_missing',
    });
    await expect(createSession({ line_items: [] })).rejects.toMatchObject({ statusCode: 400, param: 'line_items' });
    await expect(createSession({ customer: 'cus_missing', customer_email: undefined })).rejects.toMatchObject({
      statusCode: 400,
      param: 'customer',
    });
  });

  it('retries a failed delivery, logs it, and resends on request', async () => {
    receiver.failNext = 1;
    const customer = await stripe.customers.create({ email: 'x@y.test' });
    const intent = await stripe.paymentIntents.create({ amount: 4200, currency: 'usd', customer: customer.id });
    expect(intent.status).toBe('requires_payment_method');

    const session = await createSession();
    await submitCard(session.url ?? '', '4242424242424242');
    await vi.waitFor(() => expect(receiver.received).toHaveLength(2), { timeout: 2000 });

    type Listed = { id: string; type: string; delivery: { status: string; attempts: unknown[] } };
    const log = (await (await fetch(`${fake.url}/_fake/events`)).json()) as { data: Listed[] };
    const completed = log.data.find((e) => e.type === 'checkout.session.completed');
    expect(completed?.delivery.status).toBe('delivered');
    expect(completed?.delivery.attempts).toHaveLength(2);

    const resend = await fetch(`${fake.url}/_fake/events/${completed?.id}/resend`, { method: 'POST' });
    expect(resend.status).toBe(200);
    const last = receiver.received.at(-1)!;
    expect(stripe.webhooks.constructEvent(last.body, last.signature, SECRET).id).toBe(completed?.id);
    expect((await fetch(`${fake.url}/_fake/events/evt_nope/resend`, { method: 'POST' })).status).toBe(404);
  });

  it('keeps its state across a restart', async () => {
    const customer = await stripe.customers.create({ email: 'kept@customer.test' });
    await fake.close();
    await startFake();
    expect(((await stripe.customers.retrieve(customer.id)) as Stripe.Customer).email).toBe('kept@customer.test');
  });
});
