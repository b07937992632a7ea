import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { appUrl } from '@/lib/email/mailer';
import { AppError } from '@/lib/errors';
import { recordCardPayment } from './card-payments';
import { sendReceiptEmail } from './emails';
import { notifyOwnersOfException } from './exceptions';
import { getInvoiceDetail } from './queries';
import { paymentServiceError, stripeClient } from './stripe';

// Paying an invoice online. The amount is the invoice's open balance read from the database here,
// never a figure from the browser; the customer's own id scopes the invoice lookup.

const NOT_FOUND = 'That invoice was not found.';

function customerScope(user: SessionUser): { customerId: string } {
  if (user.role !== 'customer' || !user.customerId) throw new AppError('NOT_FOUND', NOT_FOUND);
  return { customerId: user.customerId };
}

/** An open checkout for the same amount is reused, so a double click cannot open two payments. */
async function reusableCheckout(invoiceId: string, amountCents: number): Promise<string | null> {
  const recent = await db
    .selectFrom('invoice_checkouts')
    .select(['id', 'url'])
    .where('invoice_id', '=', invoiceId)
    .where('amount_cents', '=', amountCents)
    .where('expires_at', '>', sql<Date>`now() + interval '10 minutes'`)
    .orderBy('created_at', 'desc')
    .executeTakeFirst();
  if (!recent) return null;
  try {
    const session = await stripeClient().checkout.sessions.retrieve(recent.id);
    return session.status === 'open' && session.url ? session.url : null;
  } catch {
    return null;
  }
}

export async function startInvoiceCheckout(user: SessionUser, invoiceId: string): Promise<{ url: string }> {
  const detail = await getInvoiceDetail(customerScope(user), invoiceId);
  if (!detail) throw new AppError('NOT_FOUND', NOT_FOUND);
  const { invoice, summary } = detail;
  if (summary.openCents <= 0) throw new AppError('CONFLICT', `Invoice ${invoice.number} has nothing left to pay.`);
  const reuse = await reusableCheckout(invoice.id, summary.openCents);
  if (reuse) return { url: reuse };

  const metadata = { invoice_id: invoice.id, invoice_number: invoice.number, customer_id: invoice.customer_id };
  let session;
  try {
    session = await stripeClient().checkout.sessions.create({
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: { currency: invoice.currency, unit_amount: summary.openCents, product_data: { name: `Invoice ${invoice.number}` } },
        },
      ],
      metadata,
      payment_intent_data: { metadata, description: `Invoice ${invoice.number}` },
      customer_email: user.email,
      client_reference_id: invoice.id,
      success_url: appUrl(`/portal/invoices/${invoice.id}?payment=done&session={CHECKOUT_SESSION_ID}`),
      cancel_url: appUrl(`/portal/invoices/${invoice.id}?payment=cancelled`),
    });
  } catch (err) {
    throw paymentServiceError(err);
  }
  if (!session.url) throw paymentServiceError(new Error('checkout session has no url'));
  await db
    .insertInto('invoice_checkouts')
    .values({
      id: session.id,
      invoice_id: invoice.id,
      customer_id: invoice.customer_id,
      amount_cents: summary.openCents,
      url: session.url,
      expires_at: new Date(session.expires_at * 1000),
      created_by: user.id,
    })
    .execute();
  return { url: session.url };
}

/**
 * On return from the payment page: if the webhook has not arrived yet, ask Stripe about the
 * session and record the payment the same way the webhook would (keyed on the payment intent).
 */
export async function confirmCheckoutReturn(user: SessionUser, invoiceId: string, sessionId: string): Promise<void> {
  if (!/^cs_[A-Za-z0-9_]{1,200}$/.test(sessionId)) return;
  const scope = customerScope(user);
  const known = await db
    .selectFrom('invoice_checkouts')
    .select('id')
    .where('id', '=', sessionId)
    .where('invoice_id', '=', invoiceId)
    .where('customer_id', '=', scope.customerId)
    .executeTakeFirst();
  if (!known) return;
  let session;
  try {
    session = await stripeClient().checkout.sessions.retrieve(sessionId);
  } catch {
    return; // the webhook will still arrive
  }
  const intent = typeof session.payment_intent === 'string' ? session.payment_intent : session.payment_intent?.id;
  if (session.payment_status !== 'paid' || !intent || session.metadata?.invoice_id !== invoiceId) return;
  const result = await db.transaction().execute((trx) =>
    recordCardPayment(trx, {
      invoiceId,
      customerId: typeof session.metadata?.customer_id === 'string' ? session.metadata.customer_id : null,
      checkoutSessionId: session.id,
      paymentIntentId: intent,
      chargeId: null,
      amountCents: session.amount_total ?? 0,
      currency: session.currency ?? '',
      receivedAt: new Date(),
      evidence: { eventId: null, payload: session },
    }),
  );
  if (result.isNew && result.paymentId) await sendReceiptEmail(result.paymentId);
  if (result.exceptionId) await notifyOwnersOfException(result.exceptionId);
}
