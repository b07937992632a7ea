import 'server-only';
import { sql, type Transaction } from 'kysely';
import type { Database, Invoice, PaymentExceptionReason } from '@/db/types';
import { formatMoney } from '@/components/money';
import { excessCents, openBalanceCents } from './arithmetic';
import { lockInvoice, refreshInvoiceBalance } from './balance';
import { formatExceptionAmount, isHeldOffBooks, raisePaymentException } from './exceptions';

// Card payments and refunds as Stripe reports them. A payment is keyed on its payment intent, so
// checkout.session.completed and payment_intent.succeeded (in either order) record it once; a
// refund is keyed on its charge and the charge's running refunded total, so replays add nothing.
// Money that arrived is never dropped: what fits no invoice becomes a payment exception, and
// what is more than the invoice asked is recorded (the excess is credit on account) and flagged.

type Trx = Transaction<Database>;

export type CardPaymentFacts = {
  /** From the payment's metadata; null when it names none. */
  invoiceId: string | null;
  /** The customer the checkout was opened for (metadata), when Stripe sent one. */
  customerId?: string | null;
  /** What the session or payment intent asked for, when known. */
  askedCents?: number | null;
  /** The checkout session, when the event is about one. */
  checkoutSessionId?: string | null;
  paymentIntentId: string;
  chargeId: string | null;
  amountCents: number;
  currency: string;
  receivedAt: Date;
  /** The event id and the object Stripe sent, kept with an exception. */
  evidence?: { eventId: string | null; payload: unknown };
};

export type CardRefundFacts = Omit<CardPaymentFacts, 'chargeId'> & { chargeId: string; refundedTotalCents: number };

export type RecordResult = { invoiceId: string | null; paymentId: string | null; isNew: boolean; note: string; exceptionId?: string | null };

function held(trx: Trx, f: CardPaymentFacts, reason: PaymentExceptionReason, message: string, invoice: Invoice | undefined) {
  return raisePaymentException(trx, {
    reason,
    message,
    amountCents: f.amountCents,
    currency: f.currency,
    invoiceId: invoice?.id ?? null,
    customerId: reason === 'other_customer' ? null : (invoice?.customer_id ?? null),
    paymentId: null,
    source: 'stripe',
    stripeEventId: f.evidence?.eventId ?? null,
    stripePaymentIntentId: f.paymentIntentId,
    payload: f.evidence?.payload,
  });
}

/** Why a payment that does go on this invoice still needs the owner's eye, or null. */
async function reviewReason(trx: Trx, f: CardPaymentFacts, before: Invoice): Promise<{ reason: PaymentExceptionReason; message: string } | null> {
  const money = (c: number) => formatExceptionAmount(c, f.currency);
  const open = openBalanceCents({ totalCents: before.total_cents, paidCents: before.paid_cents, creditedCents: before.credited_cents });
  if (before.status === 'credited') {
    return { reason: 'credited_invoice', message: `${money(f.amountCents)} arrived for invoice ${before.number}, which is credited in full; all of it is credit on account.` };
  }
  if (open <= 0) {
    return { reason: 'already_paid', message: `${money(f.amountCents)} arrived for invoice ${before.number}, which was already paid; all of it is credit on account.` };
  }
  let asked = f.askedCents ?? null;
  if (f.checkoutSessionId) {
    const checkout = await trx.selectFrom('invoice_checkouts').select('amount_cents').where('id', '=', f.checkoutSessionId).executeTakeFirst();
    if (checkout) asked = checkout.amount_cents;
  } else {
    // A payment intent carries no session id: it must match one of the checkouts opened for the invoice.
    const checkouts = await trx.selectFrom('invoice_checkouts').select('amount_cents').where('invoice_id', '=', before.id).execute();
    if (checkouts.length && !checkouts.some((c) => c.amount_cents === f.amountCents)) asked = checkouts[checkouts.length - 1]!.amount_cents;
  }
  if (asked !== null && asked !== f.amountCents) {
    return { reason: 'amount_differs', message: `${money(f.amountCents)} arrived for invoice ${before.number}; the checkout asked for ${money(asked)}.` };
  }
  if (f.amountCents > open) {
    return { reason: 'overpaid', message: `${money(f.amountCents)} arrived for invoice ${before.number}, ${money(f.amountCents - open)} more than its balance of ${money(open)}.` };
  }
  return null;
}

export async function recordCardPayment(trx: Trx, f: CardPaymentFacts): Promise<RecordResult> {
  if (!Number.isSafeInteger(f.amountCents) || f.amountCents <= 0) {
    return { invoiceId: f.invoiceId, paymentId: null, isNew: false, note: 'ignored: no amount received' };
  }
  const invoice = f.invoiceId ? await lockInvoice(trx, f.invoiceId) : undefined;
  const money = formatExceptionAmount(f.amountCents, f.currency);
  let offBooks: { reason: PaymentExceptionReason; message: string } | null = null;
  if (!invoice) {
    offBooks = { reason: 'unknown_invoice', message: `${money} arrived (payment ${f.paymentIntentId}) naming ${f.invoiceId ? `invoice id ${f.invoiceId}, which does not exist` : 'no invoice'}.` };
  } else if (f.customerId && f.customerId !== invoice.customer_id) {
    offBooks = { reason: 'other_customer', message: `${money} arrived for invoice ${invoice.number} from a checkout opened for another customer.` };
  } else if (f.currency.toLowerCase() !== invoice.currency) {
    offBooks = { reason: 'wrong_currency', message: `${money} arrived for invoice ${invoice.number}, which is invoiced in ${invoice.currency.toUpperCase()}.` };
  }
  if (offBooks) {
    const exceptionId = await held(trx, f, offBooks.reason, offBooks.message, invoice);
    return { invoiceId: invoice?.id ?? null, paymentId: null, isNew: false, note: `exception: ${offBooks.message}`, exceptionId };
  }
  const before = invoice!;
  const review = await reviewReason(trx, f, before);
  const inserted = await trx
    .insertInto('payments')
    .values({
      invoice_id: before.id,
      customer_id: before.customer_id,
      kind: 'payment',
      method: 'card',
      amount_cents: f.amountCents,
      currency: before.currency,
      received_at: f.receivedAt,
      reference: 'Card payment online',
      stripe_payment_intent_id: f.paymentIntentId,
      stripe_charge_id: f.chargeId,
    })
    // The predicate is a literal so PostgreSQL can match the partial unique index.
    .onConflict((oc) => oc.column('stripe_payment_intent_id').where('kind', '=', sql.lit('payment')).doNothing())
    .returning('id')
    .executeTakeFirst();
  if (!inserted) {
    if (f.chargeId) {
      await trx
        .updateTable('payments')
        .set({ stripe_charge_id: f.chargeId })
        .where('stripe_payment_intent_id', '=', f.paymentIntentId)
        .where('kind', '=', 'payment')
        .where('stripe_charge_id', 'is', null)
        .execute();
    }
    return { invoiceId: before.id, paymentId: null, isNew: false, note: 'payment already recorded' };
  }
  const after = await refreshInvoiceBalance(trx, before.id);
  let exceptionId: string | null = null;
  if (review) {
    exceptionId = await raisePaymentException(trx, {
      ...review,
      amountCents: f.amountCents,
      currency: f.currency,
      invoiceId: before.id,
      customerId: before.customer_id,
      paymentId: inserted.id,
      source: 'stripe',
      stripeEventId: f.evidence?.eventId ?? null,
      stripePaymentIntentId: f.paymentIntentId,
      payload: f.evidence?.payload,
    });
  }
  const excess = excessCents({ totalCents: after.total_cents, paidCents: after.paid_cents, creditedCents: after.credited_cents });
  const credit = excess > 0 ? `; ${formatMoney(excess, after.currency)} credit on account` : '';
  return { invoiceId: before.id, paymentId: inserted.id, isNew: true, note: `payment recorded; invoice ${after.status.replace('_', ' ')}${credit}`, exceptionId };
}

export async function recordCardRefund(trx: Trx, f: CardRefundFacts): Promise<RecordResult> {
  // A refund of money held as an exception (never on an invoice) changes no invoice.
  if (await isHeldOffBooks(trx, f.paymentIntentId)) {
    return { invoiceId: null, paymentId: null, isNew: false, note: 'refund of a payment held as an exception' };
  }
  // The refund may be the first we hear of the payment (events can arrive in any order).
  const payment = await recordCardPayment(trx, f);
  if (!payment.invoiceId || payment.note.startsWith('ignored') || payment.note.startsWith('exception')) return { ...payment, isNew: false };
  const already = await trx
    .selectFrom('payments')
    .select(sql<number>`coalesce(sum(amount_cents), 0)::bigint`.as('refunded'))
    .where('kind', '=', 'refund')
    .where('stripe_charge_id', '=', f.chargeId)
    .executeTakeFirstOrThrow();
  const delta = f.refundedTotalCents - Number(already.refunded);
  if (delta <= 0) return { invoiceId: payment.invoiceId, paymentId: null, isNew: false, note: 'refund already recorded' };
  const invoice = (await lockInvoice(trx, payment.invoiceId))!;
  if (delta > invoice.paid_cents) {
    // Money left the shop beyond what this invoice holds: nothing to take it from, so the owner sees it.
    const message = `A refund of ${formatExceptionAmount(delta, f.currency)} on charge ${f.chargeId} is more than the ${formatMoney(invoice.paid_cents, invoice.currency)} paid on invoice ${invoice.number}.`;
    const exceptionId = await raisePaymentException(trx, {
      reason: 'refund_exceeds_payments',
      message,
      amountCents: delta,
      currency: f.currency,
      invoiceId: invoice.id,
      customerId: invoice.customer_id,
      paymentId: null,
      source: 'stripe',
      stripeEventId: f.evidence?.eventId ?? null,
      stripePaymentIntentId: f.paymentIntentId,
      payload: f.evidence?.payload,
    });
    return { invoiceId: invoice.id, paymentId: null, isNew: false, note: `exception: ${message}`, exceptionId };
  }
  const refund = await trx
    .insertInto('payments')
    .values({
      invoice_id: payment.invoiceId,
      customer_id: invoice.customer_id,
      kind: 'refund',
      method: 'card',
      amount_cents: delta,
      currency: f.currency.toLowerCase(),
      received_at: f.receivedAt,
      reference: 'Card refund',
      stripe_payment_intent_id: f.paymentIntentId,
      stripe_charge_id: f.chargeId,
      stripe_refund_key: `${f.chargeId}:${f.refundedTotalCents}`,
    })
    .onConflict((oc) => oc.column('stripe_refund_key').doNothing())
    .returning('id')
    .executeTakeFirst();
  if (!refund) return { invoiceId: payment.invoiceId, paymentId: null, isNew: false, note: 'refund already recorded' };
  const after = await refreshInvoiceBalance(trx, payment.invoiceId);
  return { invoiceId: payment.invoiceId, paymentId: refund.id, isNew: true, note: `refund recorded; invoice ${after.status.replace('_', ' ')}` };
}
