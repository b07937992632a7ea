import 'server-only';
import { sql, type Transaction } from 'kysely';
import type { Database } from '@/db/types';
import { lockInvoice, refreshInvoiceBalance } from './balance';

// Card payments and refunds as Stripe reports them. A payment is keyed on its payment intent, so
// checkout.session.completed and payment_intent.succeeded (in either order) record it once; a
// refund is keyed on its charge and the charge's running refunded total, so replays add nothing.

type Trx = Transaction<Database>;

export type CardPaymentFacts = {
  invoiceId: string;
  paymentIntentId: string;
  chargeId: string | null;
  amountCents: number;
  currency: string;
  receivedAt: Date;
};

export type CardRefundFacts = Omit<CardPaymentFacts, 'chargeId'> & { chargeId: string; refundedTotalCents: number };

export type RecordResult = { invoiceId: string | null; paymentId: string | null; isNew: boolean; note: string };

export async function recordCardPayment(trx: Trx, f: CardPaymentFacts): Promise<RecordResult> {
  const invoice = await lockInvoice(trx, f.invoiceId);
  if (!invoice) return { invoiceId: null, paymentId: null, isNew: false, note: `ignored: no invoice ${f.invoiceId}` };
  if (f.currency.toLowerCase() !== invoice.currency) {
    return { invoiceId: invoice.id, paymentId: null, isNew: false, note: `ignored: paid in ${f.currency}, invoiced in ${invoice.currency}` };
  }
  if (!Number.isSafeInteger(f.amountCents) || f.amountCents <= 0) {
    return { invoiceId: invoice.id, paymentId: null, isNew: false, note: 'ignored: no amount received' };
  }
  const inserted = await trx
    .insertInto('payments')
    .values({
      invoice_id: invoice.id,
      customer_id: invoice.customer_id,
      kind: 'payment',
      method: 'card',
      amount_cents: f.amountCents,
      currency: invoice.currency,
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
    return { invoiceId: invoice.id, paymentId: null, isNew: false, note: 'payment already recorded' };
  }
  const after = await refreshInvoiceBalance(trx, invoice.id);
  return { invoiceId: invoice.id, paymentId: inserted.id, isNew: true, note: `payment recorded; invoice ${after.status.replace('_', ' ')}` };
}

export async function recordCardRefund(trx: Trx, f: CardRefundFacts): Promise<RecordResult> {
  // The refund may be the first we hear of the payment (events can arrive in any order).
  const payment = await recordCardPayment(trx, f);
  if (!payment.invoiceId || payment.note.startsWith('ignored')) return { ...payment, isNew: false };
  const already = await trx
    .selectFrom('payments')
    .select(sql<number>`coalesce(sum(amount_cents), 0)::bigint`.as('refunded'))
    .where('kind', '=', 'refund')
    .where('stripe_charge_id', '=', f.chargeId)
    .executeTakeFirstOrThrow();
  const delta = f.refundedTotalCents - Number(already.refunded);
  if (delta <= 0) return { invoiceId: payment.invoiceId, paymentId: null, isNew: false, note: 'refund already recorded' };
  const refund = await trx
    .insertInto('payments')
    .values({
      invoice_id: payment.invoiceId,
      customer_id: sql<string>`(select customer_id from invoices where id = ${payment.invoiceId})`,
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
