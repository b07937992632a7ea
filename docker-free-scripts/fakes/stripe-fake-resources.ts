// Customers, payment intents, charges and refunds of the Stripe fake.
import {
  StripeFakeError,
  currencyParam,
  limitParam,
  metadataParam,
  missing,
  optInteger,
  optString,
  reqInteger,
  type Params,
} from './stripe-fake-params';
import {
  newId,
  nowSeconds,
  type Charge,
  type Customer,
  type PaymentIntent,
  type Refund,
  type StripeStore,
} from './stripe-fake-store';
import type { WebhookSender } from './stripe-fake-webhooks';

export type FakeContext = { store: StripeStore; webhooks: WebhookSender; baseUrl: () => string };

export function listOf<T>(url: string, items: T[], limit: number) {
  return { object: 'list' as const, url, has_more: items.length > limit, data: items.slice(0, limit) };
}

/** Replaces id fields named in `expand` with the objects they point to. */
export function expand<T extends object>(
  object: T,
  fields: string[],
  resolvers: Record<string, (id: string) => unknown>,
): T {
  const out: Record<string, unknown> = { ...(object as Record<string, unknown>) };
  for (const field of fields) {
    const resolve = resolvers[field];
    if (!resolve) throw new StripeFakeError(400, `This property cannot be expanded (${field}).`, 'expand');
    const id = out[field];
    if (typeof id === 'string') out[field] = resolve(id) ?? id;
  }
  return out as T;
}

const nullable = (v: string | undefined) => (v === undefined || v === '' ? null : v);

export function getCustomer(ctx: FakeContext, id: string): Customer {
  const customer = ctx.store.state.customers[id];
  if (!customer) throw missing('customer', id);
  return customer;
}

/** For ids given as parameters Stripe answers 400 rather than 404. */
export function customerParam(ctx: FakeContext, p: Params): string | null {
  const id = nullable(optString(p, 'customer'));
  if (id && !ctx.store.state.customers[id]) throw missing('customer', id, 'customer', 400);
  return id;
}

export function createCustomer(ctx: FakeContext, p: Params): Customer {
  const customer: Customer = {
    id: newId('cus', 14),
    object: 'customer',
    created: nowSeconds(),
    livemode: false,
    email: nullable(optString(p, 'email')),
    name: nullable(optString(p, 'name')),
    phone: nullable(optString(p, 'phone')),
    description: nullable(optString(p, 'description')),
    metadata: metadataParam(p),
  };
  ctx.store.state.customers[customer.id] = customer;
  ctx.store.save();
  return customer;
}

export function updateCustomer(ctx: FakeContext, id: string, p: Params): Customer {
  const customer = getCustomer(ctx, id);
  for (const key of ['email', 'name', 'phone', 'description'] as const) {
    const value = optString(p, key);
    if (value !== undefined) customer[key] = nullable(value);
  }
  customer.metadata = metadataParam(p, customer.metadata);
  ctx.store.save();
  return customer;
}

export function listCustomers(ctx: FakeContext, p: Params) {
  const email = optString(p, 'email')?.toLowerCase();
  const all = Object.values(ctx.store.state.customers).reverse();
  const matching = email ? all.filter((c) => c.email?.toLowerCase() === email) : all;
  return listOf('/v1/customers', matching, limitParam(p));
}

export function getPaymentIntent(ctx: FakeContext, id: string): PaymentIntent {
  const intent = ctx.store.state.paymentIntents[id];
  if (!intent) throw missing('payment_intent', id);
  return intent;
}

export function getCharge(ctx: FakeContext, id: string): Charge {
  const charge = ctx.store.state.charges[id];
  if (!charge) throw missing('charge', id);
  return charge;
}

export function getRefund(ctx: FakeContext, id: string): Refund {
  const refund = ctx.store.state.refunds[id];
  if (!refund) throw missing('refund', id);
  return refund;
}

export function newPaymentIntent(fields: {
  amount: number;
  currency: string;
  customer: string | null;
  description: string | null;
  metadata: Record<string, string>;
  receipt_email: string | null;
}): PaymentIntent {
  return {
    id: newId('pi'),
    object: 'payment_intent',
    created: nowSeconds(),
    livemode: false,
    ...fields,
    amount_received: 0,
    status: 'requires_payment_method',
    payment_method_types: ['card'],
    latest_charge: null,
    last_payment_error: null,
  };
}

export function createPaymentIntent(ctx: FakeContext, p: Params): PaymentIntent {
  const intent = newPaymentIntent({
    amount: reqInteger(p, 'amount', 'amount', 1),
    currency: currencyParam(p, 'currency'),
    customer: customerParam(ctx, p),
    description: nullable(optString(p, 'description')),
    metadata: metadataParam(p),
    receipt_email: nullable(optString(p, 'receipt_email')),
  });
  ctx.store.state.paymentIntents[intent.id] = intent;
  ctx.store.save();
  return intent;
}

export function updatePaymentIntent(ctx: FakeContext, id: string, p: Params): PaymentIntent {
  const intent = getPaymentIntent(ctx, id);
  const amount = optInteger(p, 'amount', 'amount', 1);
  if (amount !== undefined) {
    if (intent.status === 'succeeded') {
      throw new StripeFakeError(400, 'The amount of a succeeded PaymentIntent cannot be changed.', 'amount');
    }
    intent.amount = amount;
  }
  if (p.customer !== undefined) intent.customer = customerParam(ctx, p);
  const description = optString(p, 'description');
  if (description !== undefined) intent.description = nullable(description);
  const receiptEmail = optString(p, 'receipt_email');
  if (receiptEmail !== undefined) intent.receipt_email = nullable(receiptEmail);
  intent.metadata = metadataParam(p, intent.metadata);
  ctx.store.save();
  return intent;
}

export function listPaymentIntents(ctx: FakeContext, p: Params) {
  const customer = optString(p, 'customer');
  const all = Object.values(ctx.store.state.paymentIntents).reverse();
  const matching = customer ? all.filter((pi) => pi.customer === customer) : all;
  return listOf('/v1/payment_intents', matching, limitParam(p));
}

/** Marks an intent paid in full and records the charge behind it. */
export function succeedPaymentIntent(ctx: FakeContext, intent: PaymentIntent): Charge {
  const charge: Charge = {
    id: newId('ch'),
    object: 'charge',
    created: nowSeconds(),
    livemode: false,
    metadata: { ...intent.metadata },
    amount: intent.amount,
    amount_captured: intent.amount,
    amount_refunded: 0,
    currency: intent.currency,
    customer: intent.customer,
    payment_intent: intent.id,
    paid: true,
    captured: true,
    refunded: false,
    status: 'succeeded',
    description: intent.description,
  };
  ctx.store.state.charges[charge.id] = charge;
  intent.status = 'succeeded';
  intent.amount_received = intent.amount;
  intent.latest_charge = charge.id;
  intent.last_payment_error = null;
  return charge;
}

export async function createRefund(ctx: FakeContext, p: Params): Promise<Refund> {
  const intentId = optString(p, 'payment_intent');
  const chargeId = optString(p, 'charge');
  if (!intentId && !chargeId) {
    throw new StripeFakeError(400, 'Missing required param: payment_intent (or charge).', 'payment_intent');
  }
  let charge: Charge | undefined;
  if (intentId) {
    const intent = ctx.store.state.paymentIntents[intentId];
    if (!intent) throw missing('payment_intent', intentId, 'payment_intent', 400);
    if (intent.status !== 'succeeded' || !intent.latest_charge) {
      throw new StripeFakeError(400, `PaymentIntent ${intentId} has no successful charge to refund.`, 'payment_intent');
    }
    charge = ctx.store.state.charges[intent.latest_charge];
  } else if (chargeId) {
    charge = ctx.store.state.charges[chargeId];
    if (!charge) throw missing('charge', chargeId, 'charge', 400);
  }
  if (!charge) throw new StripeFakeError(400, 'No charge found to refund.', 'payment_intent');

  const remaining = charge.amount - charge.amount_refunded;
  if (remaining <= 0) {
    throw new StripeFakeError(400, `Charge ${charge.id} has already been refunded.`, undefined,
      'invalid_request_error', 'charge_already_refunded');
  }
  const amount = optInteger(p, 'amount', 'amount', 1) ?? remaining;
  if (amount > remaining) {
    throw new StripeFakeError(400,
      `Refund amount (${amount}) is greater than the unrefunded amount on the charge (${remaining}).`,
      'amount', 'invalid_request_error', 'amount_too_large');
  }
  const refund: Refund = {
    id: newId('re'),
    object: 'refund',
    created: nowSeconds(),
    livemode: false,
    metadata: metadataParam(p),
    amount,
    currency: charge.currency,
    charge: charge.id,
    payment_intent: charge.payment_intent,
    reason: nullable(optString(p, 'reason')),
    status: 'succeeded',
  };
  ctx.store.state.refunds[refund.id] = refund;
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount;
  ctx.store.save();
  await ctx.webhooks.emit('charge.refunded', charge);
  return refund;
}
