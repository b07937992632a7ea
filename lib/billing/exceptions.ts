import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { formatMoney } from '@/components/money';
import { db as defaultDb } from '@/db';
import type { Database, PaymentExceptionReason } from '@/db/types';
import { appUrl, sendEmail } from '@/lib/email/mailer';

// Payments that do not fit an invoice as asked. Each lands here with everything the payment
// service sent, and the owner is told; money that is on no invoice is shown nowhere else, so an
// open exception stays on the owner's home screen until it is refunded or put on an invoice.

type Trx = Transaction<Database>;

export const EXCEPTION_WORDS: Record<PaymentExceptionReason, string> = {
  amount_differs: 'Amount differs from what was asked',
  wrong_currency: 'Paid in another currency',
  unknown_invoice: 'No such invoice',
  other_customer: "Another customer's invoice",
  credited_invoice: 'Invoice already credited',
  already_paid: 'Invoice already paid',
  overpaid: 'More than the balance',
  refund_exceeds_payments: 'Refund larger than the payments',
};

export type ExceptionFacts = {
  reason: PaymentExceptionReason;
  message: string;
  amountCents: number;
  currency: string;
  invoiceId: string | null;
  customerId: string | null;
  /** The payment row, when the money is on the books; null when it is on no invoice. */
  paymentId: string | null;
  source: 'stripe' | 'office';
  stripeEventId?: string | null;
  stripePaymentIntentId?: string | null;
  payload?: unknown;
};

/** An amount in whatever currency it arrived in; a code Intl does not know is shown as it came. */
export function formatExceptionAmount(cents: number, currency: string): string {
  try {
    return formatMoney(cents, currency || 'usd');
  } catch {
    return `${cents} (minor units, ${currency || 'no currency'})`;
  }
}

/** Writes the exception in the caller's transaction; a second report of the same payment adds nothing. */
export async function raisePaymentException(trx: Trx, f: ExceptionFacts): Promise<string | null> {
  const row = await trx
    .insertInto('payment_exceptions')
    .values({
      reason: f.reason,
      message: f.message.slice(0, 1000),
      amount_cents: Math.max(0, Math.trunc(f.amountCents)),
      currency: /^[a-z]{3}$/.test(f.currency.toLowerCase()) ? f.currency.toLowerCase() : '',
      invoice_id: f.invoiceId,
      customer_id: f.customerId,
      payment_id: f.paymentId,
      source: f.source,
      stripe_event_id: f.stripeEventId ?? null,
      stripe_payment_intent_id: f.stripePaymentIntentId ?? null,
      payload: JSON.stringify(f.payload ?? {}),
    })
    .onConflict((oc) =>
      // The predicate is literal SQL so PostgreSQL can match the partial unique index.
      oc.columns(['stripe_payment_intent_id', 'reason']).where(sql<boolean>`stripe_payment_intent_id is not null`).doNothing(),
    )
    .returning('id')
    .executeTakeFirst();
  return row?.id ?? null;
}

/** True when this payment intent's money is held as an exception, on no invoice. */
export async function isHeldOffBooks(trx: Trx, paymentIntentId: string): Promise<boolean> {
  const row = await trx
    .selectFrom('payment_exceptions')
    .select('id')
    .where('stripe_payment_intent_id', '=', paymentIntentId)
    .where('payment_id', 'is', null)
    .executeTakeFirst();
  return !!row;
}

export async function countOpenExceptions(database: Kysely<Database> = defaultDb): Promise<{ count: number; offBooksCents: number }> {
  const r = await database
    .selectFrom('payment_exceptions')
    .select([
      sql<number>`count(*)::int`.as('count'),
      sql<number>`coalesce(sum(amount_cents) filter (where payment_id is null), 0)::bigint`.as('off_books'),
    ])
    .where('status', '=', 'open')
    .executeTakeFirstOrThrow();
  return { count: r.count, offBooksCents: Number(r.off_books) };
}

export type ExceptionListFilter = { status?: 'open' | 'resolved' | 'all'; before?: { createdAt: Date; id: string } };

/** Newest first, paged by (created_at, id) so a long history reads one page at a time. */
export async function findPaymentExceptions(filter: ExceptionListFilter = {}, limit = 50, database: Kysely<Database> = defaultDb) {
  let q = database
    .selectFrom('payment_exceptions as e')
    .leftJoin('invoices as i', 'i.id', 'e.invoice_id')
    .leftJoin('customers as c', 'c.id', 'e.customer_id')
    .selectAll('e')
    .select(['i.number as invoice_number', 'c.name as customer_name'])
    .orderBy('e.created_at', 'desc')
    .orderBy('e.id', 'desc')
    .limit(limit + 1);
  const status = filter.status ?? 'open';
  if (status !== 'all') q = q.where('e.status', '=', status);
  if (filter.before) {
    const { createdAt, id } = filter.before;
    q = q.where(sql<boolean>`(e.created_at, e.id) < (${createdAt}, ${id}::uuid)`);
  }
  const rows = await q.execute();
  return { rows: rows.slice(0, limit), hasMore: rows.length > limit };
}

export async function getPaymentException(id: string, database: Kysely<Database> = defaultDb) {
  return database
    .selectFrom('payment_exceptions as e')
    .leftJoin('invoices as i', 'i.id', 'e.invoice_id')
    .leftJoin('customers as c', 'c.id', 'e.customer_id')
    .selectAll('e')
    .select(['i.number as invoice_number', 'c.name as customer_name'])
    .where('e.id', '=', id)
    .executeTakeFirst();
}

/**
 * After the commit: e-mails every active owner about a new exception, once (the claim is
 * written before the send, in the same statement that checks it).
 */
export async function notifyOwnersOfException(exceptionId: string, database: Kysely<Database> = defaultDb): Promise<void> {
  const claimed = await database
    .updateTable('payment_exceptions')
    .set({ owner_notified_at: sql`now()` })
    .where('id', '=', exceptionId)
    .where('owner_notified_at', 'is', null)
    .returning(['reason', 'message', 'amount_cents', 'currency', 'payment_id'])
    .executeTakeFirst();
  if (!claimed) return;
  const owners = await database.selectFrom('users').select('email').where('role', '=', 'owner').where('is_active', '=', true).execute();
  const amount = formatExceptionAmount(claimed.amount_cents, claimed.currency);
  for (const o of owners) {
    await sendEmail({
      to: o.email,
      template: 'payment-exception',
      subject: `Payment to check: ${EXCEPTION_WORDS[claimed.reason]} (${amount})`,
      text: [
        claimed.message,
        '',
        claimed.payment_id
          ? 'The money is recorded on the invoice; any excess is the customer’s credit on account until it is refunded or applied.'
          : 'The money is not on any invoice yet. Refund it, or record it on the right invoice.',
        '',
        `Payment exceptions: ${appUrl('/invoices/exceptions')}`,
      ].join('\n'),
    });
  }
}
