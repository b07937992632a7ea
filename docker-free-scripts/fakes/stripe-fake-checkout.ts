// Checkout sessions of the Stripe fake, and what happens when the stand-in payment page is submitted.
import {
  StripeFakeError,
  currencyParam,
  expandList,
  metadataParam,
  missing,
  optList,
  optObject,
  optString,
  reqInteger,
  reqString,
  type Params,
} from './stripe-fake-params';
import {
  customerParam,
  expand,
  getPaymentIntent,
  listOf,
  newPaymentIntent,
  succeedPaymentIntent,
  type FakeContext,
} from './stripe-fake-resources';
import { newId, nowSeconds, type CheckoutSession, type LineItem } from './stripe-fake-store';

export const TEST_CARDS = {
  succeeds: '4242424242424242',
  declined: '4000000000000002',
} as const;

export const DECLINE_MESSAGE = 'Your card was declined.';

function parseLineItems(p: Params): LineItem[] {
  const raw = optList(p, 'line_items');
  if (!raw || raw.length === 0) throw new StripeFakeError(400, 'Missing required param: line_items.', 'line_items');
  return raw.map((entry, i) => {
    const at = `line_items[${i}]`;
    if (typeof entry !== 'object' || Array.isArray(entry)) throw new StripeFakeError(400, `Invalid object: ${at}`, at);
    if (entry.price !== undefined) {
      throw new StripeFakeError(400, `The local fake takes ${at}[price_data], not saved prices.`, `${at}[price]`);
    }
    const priceData = optObject(entry, 'price_data', `${at}[price_data]`);
    if (!priceData) throw new StripeFakeError(400, `Missing required param: ${at}[price_data].`, `${at}[price_data]`);
    const currency = currencyParam(priceData, 'currency', `${at}[price_data][currency]`);
    const unitAmount = reqInteger(priceData, 'unit_amount', `${at}[price_data][unit_amount]`, 0);
    const productData = optObject(priceData, 'product_data', `${at}[price_data][product_data]`);
    if (!productData) {
      throw new StripeFakeError(400, `Missing required param: ${at}[price_data][product_data].`,
        `${at}[price_data][product_data]`);
    }
    const name = reqString(productData, 'name', `${at}[price_data][product_data][name]`);
    const quantity = reqInteger(entry, 'quantity', `${at}[quantity]`, 1);
    const total = unitAmount * quantity;
    return {
      id: newId('li'),
      object: 'item',
      description: name,
      quantity,
      currency,
      amount_subtotal: total,
      amount_total: total,
      price: { id: newId('price'), object: 'price', currency, unit_amount: unitAmount, product: newId('prod', 14) },
    };
  });
}

export function createCheckoutSession(ctx: FakeContext, p: Params): CheckoutSession {
  const mode = reqString(p, 'mode');
  if (mode !== 'payment') {
    throw new StripeFakeError(400, `The local fake supports mode "payment" only, not "${mode}".`, 'mode');
  }
  const items = parseLineItems(p);
  const currency = items[0]?.currency ?? 'usd';
  if (items.some((item) => item.currency !== currency)) {
    throw new StripeFakeError(400, 'All line items must use the same currency.', 'line_items');
  }
  const amount = items.reduce((sum, item) => sum + item.amount_total, 0);
  if (amount <= 0) throw new StripeFakeError(400, 'The total amount due must be greater than zero.', 'line_items');
  const customer = customerParam(ctx, p);
  const customerEmail = optString(p, 'customer_email') || null;
  if (customer && customerEmail) {
    throw new StripeFakeError(400, 'Give either customer or customer_email, not both.', 'customer_email');
  }
  const intentData = optObject(p, 'payment_intent_data') ?? {};
  const id = newId('cs_test', 40);
  const created = nowSeconds();
  const session: CheckoutSession = {
    id,
    object: 'checkout.session',
    created,
    livemode: false,
    metadata: metadataParam(p),
    mode: 'payment',
    status: 'open',
    payment_status: 'unpaid',
    amount_subtotal: amount,
    amount_total: amount,
    currency,
    customer,
    customer_email: customerEmail,
    customer_details: null,
    client_reference_id: optString(p, 'client_reference_id') || null,
    success_url: optString(p, 'success_url') || null,
    cancel_url: optString(p, 'cancel_url') || null,
    url: `${ctx.baseUrl()}/pay/${id}`,
    payment_intent: null,
    expires_at: created + 24 * 3600,
  };
  const state = ctx.store.state;
  state.sessions[id] = session;
  state.lineItems[id] = items;
  state.sessionIntentData[id] = {
    metadata: metadataParam(intentData),
    description: optString(intentData, 'description', 'payment_intent_data[description]') || null,
  };
  ctx.store.save();
  return session;
}

export function getCheckoutSession(ctx: FakeContext, id: string): CheckoutSession {
  const session = ctx.store.state.sessions[id];
  if (!session) throw missing('checkout.session', id);
  return session;
}

export function sessionLineItems(ctx: FakeContext, id: string): LineItem[] {
  return ctx.store.state.lineItems[id] ?? [];
}

/** The session as the API returns it, with `expand[]` applied. */
export function presentSession(ctx: FakeContext, session: CheckoutSession, p: Params) {
  const fields = expandList(p).filter((f) => f !== 'line_items');
  const expanded: Record<string, unknown> = expand(session, fields, {
    customer: (cid) => ctx.store.state.customers[cid],
    payment_intent: (pid) => ctx.store.state.paymentIntents[pid],
  });
  if (expandList(p).includes('line_items')) {
    const items = sessionLineItems(ctx, session.id);
    expanded.line_items = listOf(`/v1/checkout/sessions/${session.id}/line_items`, items, 100);
  }
  return expanded;
}

export type PayOutcome =
  | { kind: 'paid'; redirectTo: string | null }
  | { kind: 'declined' }
  | { kind: 'unknown_card' }
  | { kind: 'not_open' };

function intentForSession(ctx: FakeContext, session: CheckoutSession) {
  if (session.payment_intent) return getPaymentIntent(ctx, session.payment_intent);
  const data = ctx.store.state.sessionIntentData[session.id];
  const customerEmail = session.customer
    ? (ctx.store.state.customers[session.customer]?.email ?? null)
    : session.customer_email;
  const intent = newPaymentIntent({
    amount: session.amount_total,
    currency: session.currency,
    customer: session.customer,
    description: data?.description ?? sessionLineItems(ctx, session.id).map((i) => i.description).join(', '),
    metadata: { ...(data?.metadata ?? {}) },
    receipt_email: customerEmail,
  });
  ctx.store.state.paymentIntents[intent.id] = intent;
  session.payment_intent = intent.id;
  return intent;
}

export function successRedirect(session: CheckoutSession): string | null {
  return session.success_url ? session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id) : null;
}

/** Handles a submit of the stand-in payment page with the given card number. */
export async function payCheckoutSession(ctx: FakeContext, session: CheckoutSession, card: string): Promise<PayOutcome> {
  if (session.status !== 'open') return { kind: 'not_open' };
  const digits = card.replace(/[\s-]/g, '');
  if (digits !== TEST_CARDS.succeeds && digits !== TEST_CARDS.declined) return { kind: 'unknown_card' };

  const intent = intentForSession(ctx, session);
  if (digits === TEST_CARDS.declined) {
    intent.status = 'requires_payment_method';
    intent.last_payment_error = {
      type: 'card_error',
      code: 'card_declined',
      decline_code: 'generic_decline',
      message: DECLINE_MESSAGE,
    };
    ctx.store.save();
    await ctx.webhooks.emit('payment_intent.payment_failed', intent);
    return { kind: 'declined' };
  }

  succeedPaymentIntent(ctx, intent);
  session.status = 'complete';
  session.payment_status = 'paid';
  session.customer_details = { email: intent.receipt_email };
  ctx.store.save();
  await ctx.webhooks.emit('checkout.session.completed', session);
  await ctx.webhooks.emit('payment_intent.succeeded', intent);
  return { kind: 'paid', redirectTo: successRedirect(session) };
}
