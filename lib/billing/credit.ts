import 'server-only';
import { sql, type Kysely } from 'kysely';
import { formatMoney } from '@/components/money';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { excessCents, openBalanceCents } from './arithmetic';
import { lockInvoice, refreshInvoiceBalance } from './balance';
import { recordCardRefund } from './card-payments';
import { getPaymentException } from './exceptions';
import { invoiceExcessSql } from './queries';
import type { ApplyCreditInput, RefundExcessInput, ResolveExceptionInput } from './schemas';
import Stripe from 'stripe';
import { paymentServiceError, stripeClient } from './stripe';

// Credit on account: what a customer paid beyond an invoice's balance. It stays on the invoice
// that received it (status "overpaid") until the owner refunds it or applies it to another open
// invoice of the same customer; each of those is an entry of its own, audited, never an edit.

const balanceOf = (i: { total_cents: number; paid_cents: number; credited_cents: number }) => ({
  totalCents: i.total_cents,
  paidCents: i.paid_cents,
  creditedCents: i.credited_cents,
});

export type CustomerCredit = { customerId: string; creditCents: number; invoices: { id: string; number: string; excessCents: number }[] };

/** A customer's credit on account, invoice by invoice. */
export async function customerCredit(customerId: string, database: Kysely<Database> = defaultDb): Promise<CustomerCredit> {
  const rows = await database
    .selectFrom('invoices as i')
    .select(['i.id', 'i.number', sql<number>`${invoiceExcessSql}::bigint`.as('excess')])
    .where('i.customer_id', '=', customerId)
    .where('i.status', '=', 'overpaid')
    .orderBy('i.issued_on')
    .orderBy('i.number')
    .execute();
  const invoices = rows.map((r) => ({ id: r.id, number: r.number, excessCents: Number(r.excess) }));
  return { customerId, creditCents: invoices.reduce((s, i) => s + i.excessCents, 0), invoices };
}

export async function applyCredit(actorId: string | null, input: ApplyCreditInput, database: Kysely<Database> = defaultDb): Promise<{ id: string }> {
  return database.transaction().execute(async (trx) => {
    // Both rows locked in a stable order, so two applications cannot cross and deadlock.
    const [a, b] = [input.fromInvoiceId, input.toInvoiceId].sort();
    const first = await lockInvoice(trx, a!);
    const second = await lockInvoice(trx, b!);
    const from = first?.id === input.fromInvoiceId ? first : second;
    const to = first?.id === input.toInvoiceId ? first : second;
    if (!from) throw new AppError('NOT_FOUND', 'The invoice holding the credit does not exist.');
    if (!to) throw new AppError('NOT_FOUND', 'That invoice does not exist.', { toInvoiceId: ['Choose an open invoice of the same customer.'] });
    if (to.customer_id !== from.customer_id) {
      throw new AppError('BAD_INPUT', `Credit stays with its customer: invoice ${to.number} is another customer's.`, { toInvoiceId: ['Choose an open invoice of the same customer.'] });
    }
    if (to.currency !== from.currency) throw new AppError('BAD_INPUT', `Invoice ${to.number} is in another currency.`, { toInvoiceId: ['Choose an invoice in the same currency.'] });
    const excess = excessCents(balanceOf(from));
    const open = openBalanceCents(balanceOf(to));
    if (excess <= 0) throw new AppError('CONFLICT', `Invoice ${from.number} holds no credit on account.`);
    if (open <= 0) throw new AppError('BAD_INPUT', `Invoice ${to.number} has nothing open.`, { toInvoiceId: ['Choose an invoice with a balance due.'] });
    const most = Math.min(excess, open);
    if (input.amount > most) {
      throw new AppError('BAD_INPUT', `Apply at most ${formatMoney(most)}: the credit is ${formatMoney(excess)} and invoice ${to.number} has ${formatMoney(open)} open.`, {
        amount: [`Enter at most ${formatMoney(most)}.`],
      });
    }
    const entry = await trx
      .insertInto('credit_applications')
      .values({ customer_id: from.customer_id, from_invoice_id: from.id, to_invoice_id: to.id, amount_cents: input.amount, note: input.note, applied_by: actorId })
      .returning('id')
      .executeTakeFirstOrThrow();
    await refreshInvoiceBalance(trx, from.id);
    await refreshInvoiceBalance(trx, to.id);
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actorId, action: 'invoice.credit_apply', entity: 'invoice', entity_id: from.id, detail: JSON.stringify({ toInvoice: to.number, amountCents: input.amount }) })
      .execute();
    return entry;
  });
}

/** Stripe's own refusal (already refunded, more than the charge) as it said it; anything else as the service being unreachable. */
function refundError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof Stripe.errors.StripeInvalidRequestError) return new AppError('CONFLICT', `Stripe refused the refund: ${err.message}`);
  return paymentServiceError(err);
}

async function checkExcess(database: Kysely<Database>, invoiceId: string, amount: number) {
  const invoice = await database.selectFrom('invoices').selectAll().where('id', '=', invoiceId).executeTakeFirst();
  if (!invoice) throw new AppError('NOT_FOUND', 'That invoice does not exist.');
  const excess = excessCents(balanceOf(invoice));
  if (excess <= 0) throw new AppError('CONFLICT', `Invoice ${invoice.number} holds no credit on account to refund.`);
  if (amount > excess) throw new AppError('BAD_INPUT', `Refund at most the credit of ${formatMoney(excess)}.`, { amount: [`Enter at most ${formatMoney(excess)}.`] });
  return invoice;
}

/**
 * Gives the excess back. By card: a refund through Stripe on one of the invoice's card payments,
 * recorded at once keyed on the charge's refunded total, the same key the charge.refunded event
 * uses, so the event adds nothing. By check or transfer: a refund entry of the office's.
 */
export async function refundExcess(actorId: string | null, input: RefundExcessInput, database: Kysely<Database> = defaultDb): Promise<{ message: string }> {
  const invoice = await checkExcess(database, input.invoiceId, input.amount);
  if (input.method !== 'card') {
    await database.transaction().execute(async (trx) => {
      const locked = (await lockInvoice(trx, invoice.id))!;
      if (input.amount > excessCents(balanceOf(locked))) throw new AppError('CONFLICT', 'The credit changed meanwhile; look again and retry.');
      await trx
        .insertInto('payments')
        .values({
          invoice_id: locked.id,
          customer_id: locked.customer_id,
          kind: 'refund',
          method: input.method,
          amount_cents: input.amount,
          currency: locked.currency,
          reference: input.reference || 'Refund of credit on account',
          recorded_by: actorId,
        })
        .execute();
      await refreshInvoiceBalance(trx, locked.id);
      await trx
        .insertInto('audit_log')
        .values({ actor_id: actorId, action: 'invoice.refund_excess', entity: 'invoice', entity_id: locked.id, detail: JSON.stringify({ amountCents: input.amount, method: input.method }) })
        .execute();
    });
    return { message: `${formatMoney(input.amount)} refunded by ${input.method === 'check' ? 'check' : 'bank transfer'}.` };
  }
  // A card payment on this invoice with enough left unrefunded.
  const cards = await database
    .selectFrom('payments as p')
    .select([
      'p.stripe_payment_intent_id',
      'p.amount_cents',
      sql<number>`(select coalesce(sum(r.amount_cents), 0) from payments r where r.kind = 'refund' and r.stripe_payment_intent_id = p.stripe_payment_intent_id)::bigint`.as('refunded'),
    ])
    .where('p.invoice_id', '=', invoice.id)
    .where('p.kind', '=', 'payment')
    .where('p.method', '=', 'card')
    .orderBy('p.received_at', 'desc')
    .execute();
  const card = cards.find((c) => c.amount_cents - Number(c.refunded) >= input.amount);
  if (!card?.stripe_payment_intent_id) {
    throw new AppError('BAD_INPUT', 'No single card payment on this invoice has that much left to refund; refund by check or transfer instead.', { method: ['Choose check or bank transfer.'] });
  }
  const intentId = card.stripe_payment_intent_id;
  let chargeId: string;
  let refundedTotal: number;
  let refundId: string;
  try {
    const stripe = stripeClient();
    // The idempotency key makes a double click one refund.
    const refund = await stripe.refunds.create(
      { payment_intent: intentId, amount: input.amount, metadata: { invoice_id: invoice.id, reason: 'credit on account' } },
      { idempotencyKey: `refund-excess:${invoice.id}:${invoice.paid_cents}:${input.amount}` },
    );
    refundId = refund.id;
    chargeId = typeof refund.charge === 'string' ? refund.charge : (refund.charge?.id ?? '');
    const charge = await stripe.charges.retrieve(chargeId);
    refundedTotal = charge.amount_refunded;
  } catch (err) {
    throw refundError(err);
  }
  await database.transaction().execute(async (trx) => {
    await recordCardRefund(trx, {
      invoiceId: invoice.id,
      paymentIntentId: intentId,
      chargeId,
      amountCents: card.amount_cents,
      refundedTotalCents: refundedTotal,
      currency: invoice.currency,
      receivedAt: new Date(),
    });
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actorId, action: 'invoice.refund_excess', entity: 'invoice', entity_id: invoice.id, detail: JSON.stringify({ amountCents: input.amount, method: 'card', refundId }) })
      .execute();
  });
  return { message: `${formatMoney(input.amount)} refunded to the card (${refundId}).` };
}

/**
 * The owner's answer to a payment exception. "keep" closes one whose money is on an invoice
 * (any excess stays credit on account). "refund" sends money that is on no invoice back through
 * Stripe; money that is on an invoice is refunded from the invoice's credit instead.
 */
export async function resolvePaymentException(actorId: string | null, input: ResolveExceptionInput, database: Kysely<Database> = defaultDb): Promise<{ message: string }> {
  const ex = await getPaymentException(input.exceptionId, database);
  if (!ex) throw new AppError('NOT_FOUND', 'That payment exception does not exist.');
  if (ex.status === 'resolved') throw new AppError('CONFLICT', 'That payment exception is already resolved.');
  let resolution: string;
  if (input.action === 'keep') {
    if (!ex.payment_id) {
      throw new AppError('BAD_INPUT', 'This money is on no invoice, so it cannot simply be kept: refund it.', { action: ['Choose refund.'] });
    }
    resolution = input.note || 'Reviewed; the money stays on the invoice and any excess is credit on account.';
  } else {
    if (ex.payment_id) {
      throw new AppError('BAD_INPUT', `This money is on invoice ${ex.invoice_number ?? ''}: refund the excess from the invoice's page, then keep this as reviewed.`, { action: ['Refund from the invoice.'] });
    }
    if (!ex.stripe_payment_intent_id || ex.amount_cents <= 0) throw new AppError('BAD_INPUT', 'There is no card payment to refund here.');
    let refundId: string;
    try {
      const refund = await stripeClient().refunds.create(
        { payment_intent: ex.stripe_payment_intent_id, amount: ex.amount_cents, metadata: { payment_exception: ex.id } },
        { idempotencyKey: `refund-exception:${ex.id}` },
      );
      refundId = refund.id;
    } catch (err) {
      throw refundError(err);
    }
    resolution = `Refunded through Stripe (${refundId})${input.note ? `: ${input.note}` : '.'}`;
  }
  await database.transaction().execute(async (trx) => {
    const done = await trx
      .updateTable('payment_exceptions')
      .set({ status: 'resolved', resolution: resolution.slice(0, 1000), resolved_by: actorId, resolved_at: sql`now()` })
      .where('id', '=', ex.id)
      .where('status', '=', 'open')
      .returning('id')
      .executeTakeFirst();
    if (!done) throw new AppError('CONFLICT', 'That payment exception was resolved meanwhile.');
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actorId, action: `payment_exception.${input.action}`, entity: 'payment_exception', entity_id: ex.id, detail: JSON.stringify({ resolution }) })
      .execute();
  });
  return { message: resolution };
}
