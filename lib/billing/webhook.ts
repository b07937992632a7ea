import 'server-only';
import type { Kysely, Transaction } from 'kysely';
import type Stripe from 'stripe';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { recordCardPayment, recordCardRefund, type RecordResult } from './card-payments';
import { sendReceiptEmail } from './emails';
import { notifyOwnersOfException } from './exceptions';
import { isUuid } from './orders';
import { verifyStripeSignature } from './stripe';

// Stripe events, verified by signature and processed once each: the event id is written to
// stripe_events in the same transaction as its effect, so a replay finds it there and stops.

type Trx = Transaction<Database>;

export type EventResult = { duplicate: boolean; outcome: string; invoiceId: string | null; newPaymentId: string | null; exceptionId: string | null };

const idOf = (v: string | { id: string } | null | undefined): string | null => (typeof v === 'string' ? v : (v?.id ?? null));
const atOf = (event: Stripe.Event) => new Date(event.created * 1000);

/** The invoice id the metadata names, when it is a well-formed id; anything else names no invoice. */
function metaInvoiceId(metadata: Stripe.Metadata | null | undefined): string | null {
  const id = metadata?.invoice_id;
  return isUuid(id) ? id : null;
}

function metaCustomerId(metadata: Stripe.Metadata | null | undefined): string | null {
  const id = metadata?.customer_id;
  return isUuid(id) ? id : null;
}

/** The invoice a charge belongs to: its metadata, else the payment already recorded for its intent. */
async function invoiceOfIntent(trx: Trx, metadata: Stripe.Metadata | null | undefined, paymentIntentId: string | null): Promise<string | null> {
  const fromMeta = metaInvoiceId(metadata);
  if (fromMeta || !paymentIntentId) return fromMeta;
  const row = await trx.selectFrom('payments').select('invoice_id').where('stripe_payment_intent_id', '=', paymentIntentId).executeTakeFirst();
  return row?.invoice_id ?? null;
}

const ignored = (note: string): RecordResult => ({ invoiceId: null, paymentId: null, isNew: false, note: `ignored: ${note}` });

async function applyEvent(trx: Trx, event: Stripe.Event): Promise<RecordResult> {
  switch (event.type) {
    case 'checkout.session.completed': {
      const s = event.data.object;
      const intent = idOf(s.payment_intent);
      if (s.payment_status !== 'paid' || !intent) return { ...ignored('session complete, payment not yet received'), invoiceId: metaInvoiceId(s.metadata) };
      return recordCardPayment(trx, {
        invoiceId: metaInvoiceId(s.metadata),
        customerId: metaCustomerId(s.metadata),
        askedCents: null,
        checkoutSessionId: s.id,
        paymentIntentId: intent,
        chargeId: null,
        amountCents: s.amount_total ?? 0,
        currency: s.currency ?? '',
        receivedAt: atOf(event),
        evidence: { eventId: event.id, payload: s },
      });
    }
    case 'payment_intent.succeeded': {
      const pi = event.data.object;
      return recordCardPayment(trx, {
        invoiceId: metaInvoiceId(pi.metadata),
        customerId: metaCustomerId(pi.metadata),
        askedCents: Number.isSafeInteger(pi.amount) ? pi.amount : null,
        paymentIntentId: pi.id,
        chargeId: idOf(pi.latest_charge),
        amountCents: pi.amount_received,
        currency: pi.currency,
        receivedAt: atOf(event),
        evidence: { eventId: event.id, payload: pi },
      });
    }
    case 'payment_intent.payment_failed': {
      const pi = event.data.object;
      const reason = pi.last_payment_error?.message ?? 'the payment failed';
      // Nothing changes on the invoice; the event row keeps the reason for the payment history.
      return { invoiceId: metaInvoiceId(pi.metadata), paymentId: null, isNew: false, note: `declined: ${reason}`.slice(0, 300) };
    }
    case 'charge.refunded': {
      const ch = event.data.object;
      const intent = idOf(ch.payment_intent);
      const invoiceId = await invoiceOfIntent(trx, ch.metadata, intent);
      if (!intent) return ignored('refund of a charge with no payment intent');
      if (!invoiceId) return ignored('refund of a charge that is not for an invoice');
      return recordCardRefund(trx, {
        invoiceId,
        customerId: metaCustomerId(ch.metadata),
        paymentIntentId: intent,
        chargeId: ch.id,
        amountCents: ch.amount_captured || ch.amount,
        refundedTotalCents: ch.amount_refunded,
        currency: ch.currency,
        receivedAt: atOf(event),
        evidence: { eventId: event.id, payload: ch },
      });
    }
    default:
      return ignored(`event type ${event.type} is not used`);
  }
}

export async function processStripeEvent(event: Stripe.Event, database: Kysely<Database> = defaultDb): Promise<EventResult> {
  return database.transaction().execute(async (trx) => {
    const fresh = await trx
      .insertInto('stripe_events')
      .values({ id: event.id, type: event.type, outcome: 'received', stripe_created_at: atOf(event) })
      .onConflict((oc) => oc.column('id').doNothing())
      .returning('id')
      .executeTakeFirst();
    if (!fresh) return { duplicate: true, outcome: 'already processed', invoiceId: null, newPaymentId: null, exceptionId: null };
    const result = await applyEvent(trx, event);
    const invoiceExists = result.invoiceId
      ? !!(await trx.selectFrom('invoices').select('id').where('id', '=', result.invoiceId).executeTakeFirst())
      : false;
    await trx
      .updateTable('stripe_events')
      .set({ outcome: result.note.slice(0, 500), invoice_id: invoiceExists ? result.invoiceId : null })
      .where('id', '=', event.id)
      .execute();
    return {
      duplicate: false,
      outcome: result.note,
      invoiceId: result.invoiceId,
      newPaymentId: result.isNew && result.note.startsWith('payment') ? result.paymentId : null,
      exceptionId: result.exceptionId ?? null,
    };
  });
}

/** The whole webhook: verify, process once, then (after commit) e-mail a receipt and tell the owner of an exception. */
export async function handleStripeWebhook(rawBody: string, signature: string | null): Promise<EventResult> {
  const event = verifyStripeSignature(rawBody, signature);
  const result = await processStripeEvent(event);
  if (result.newPaymentId) await sendReceiptEmail(result.newPaymentId);
  if (result.exceptionId) await notifyOwnersOfException(result.exceptionId);
  return result;
}
