import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { changeWorkOrderState, STATE_LABELS } from '@/lib/orders/states';
import { formatMoney } from '@/components/money';
import { invoiceStatus, openBalanceCents, ROUNDING_RULE } from './arithmetic';
import { lockInvoiceOrThrow, refreshInvoiceBalance } from './balance';
import { addDaysIso, daysBetweenIso, todayIso } from './dates';
import { draftInvoice, type ExtraLine } from './lines';
import { nextBillingNumber } from './numbering';
import { loadOrdersForInvoice, type OrderForInvoice } from './orders';
import type { CreditNoteInput, ManualPaymentInput } from './schemas';

// Issuing invoices and credit notes, and recording payments received by check or transfer.
// An issued invoice is never edited; a credit note corrects it.

type Trx = Transaction<Database>;

export type IssueInvoiceRequest = {
  customerId: string;
  orderIds: readonly string[];
  extras: readonly ExtraLine[];
  /** Defaults to today; may be back-dated up to a year, never in the future. */
  issuedOn?: string;
  notes?: string;
};

const list = (orders: OrderForInvoice[]) => orders.map((o) => o.number).join(', ');

/** Every reason the chosen orders cannot be billed together, checked before anything is written. */
function refuseUnbillable(customerId: string, wanted: readonly string[], orders: OrderForInvoice[]): void {
  const missing = wanted.length - orders.length;
  if (missing > 0) throw new AppError('NOT_FOUND', `${missing === 1 ? 'One of the chosen work orders does' : `${missing} of the chosen work orders do`} not exist.`);
  const foreign = orders.filter((o) => o.customerId !== customerId);
  if (foreign.length) {
    throw new AppError('CONFLICT', `An invoice is for one customer: ${list(foreign)} belong${foreign.length === 1 ? 's' : ''} to ${foreign[0]!.customerName}.`);
  }
  const invoiced = orders.filter((o) => o.invoiceNumber !== null || o.state === 'invoiced');
  if (invoiced.length) {
    throw new AppError('CONFLICT', invoiced.map((o) => `${o.number} is already on invoice ${o.invoiceNumber ?? '(unknown)'}.`).join(' '));
  }
  const unshipped = orders.filter((o) => o.state !== 'shipped');
  if (unshipped.length) {
    throw new AppError(
      'CONFLICT',
      `Only shipped work orders can be invoiced: ${unshipped.map((o) => `${o.number} is ${STATE_LABELS[o.state].toLowerCase()}`).join(', ')}.`,
    );
  }
  const held = orders.filter((o) => o.hasOpenNonconformance);
  if (held.length) {
    throw new AppError('CONFLICT', `${list(held)} ${held.length === 1 ? 'has' : 'have'} an open nonconformance; quality must close it before the order is invoiced.`);
  }
}

function checkIssueDate(issuedOn: string, today: string): void {
  const ahead = daysBetweenIso(today, issuedOn);
  if (ahead > 0) throw new AppError('BAD_INPUT', 'An invoice cannot be dated in the future.', { issuedOn: ['Use today or an earlier date.'] });
  if (ahead < -366) throw new AppError('BAD_INPUT', 'An invoice can be back-dated by a year at most.', { issuedOn: ['Use a date within the last year.'] });
}

async function billingEmailOf(trx: Trx, customerId: string, own: string | null): Promise<string | null> {
  if (own) return own;
  const contact = await trx
    .selectFrom('customer_contacts')
    .select('email')
    .where('customer_id', '=', customerId)
    .where('is_billing', '=', true)
    .where('email', 'is not', null)
    .orderBy('created_at')
    .executeTakeFirst();
  return contact?.email ?? null;
}

export async function issueInvoice(actorId: string | null, req: IssueInvoiceRequest, database: Kysely<Database> = defaultDb): Promise<{ id: string; number: string }> {
  const orderIds = [...new Set(req.orderIds)];
  if (orderIds.length === 0) throw new AppError('BAD_INPUT', 'Choose at least one shipped work order.', { orderIds: ['Choose at least one shipped work order.'] });
  const issuedOn = req.issuedOn ?? todayIso();
  checkIssueDate(issuedOn, todayIso());
  return database.transaction().execute(async (trx) => {
    const customer = await trx.selectFrom('customers').selectAll().where('id', '=', req.customerId).forUpdate().executeTakeFirst();
    if (!customer) throw new AppError('NOT_FOUND', 'That customer does not exist.');
    // Lock the orders first, in a stable order, so two invoices cannot take the same order.
    await trx.selectFrom('work_orders').select('id').where('id', 'in', orderIds).orderBy('id').forUpdate().execute();
    const orders = await loadOrdersForInvoice(trx, { orderIds });
    refuseUnbillable(customer.id, orderIds, orders);

    const draft = draftInvoice(orders, req.extras, customer.tax_rate_bp);
    const number = await nextBillingNumber(trx, 'invoice', Number(issuedOn.slice(0, 4)));
    const invoice = await trx
      .insertInto('invoices')
      .values({
        number,
        customer_id: customer.id,
        issued_on: issuedOn,
        due_on: addDaysIso(issuedOn, customer.payment_terms_days),
        payment_terms_days: customer.payment_terms_days,
        tax_rate_bp: customer.tax_rate_bp,
        subtotal_cents: draft.totals.subtotalCents,
        tax_cents: draft.totals.taxCents,
        total_cents: draft.totals.totalCents,
        status: invoiceStatus({ totalCents: draft.totals.totalCents, paidCents: 0, creditedCents: 0 }),
        bill_to_name: customer.name,
        bill_to_address: customer.billing_address,
        billing_email: await billingEmailOf(trx, customer.id, customer.billing_email),
        notes: req.notes?.trim() ?? '',
        rounding_rule: ROUNDING_RULE,
        issued_by: actorId,
      })
      .returning(['id', 'number'])
      .executeTakeFirstOrThrow();
    await trx
      .insertInto('invoice_lines')
      .values(
        draft.lines.map((l, i) => ({
          invoice_id: invoice.id,
          line_no: i + 1,
          kind: l.kind,
          work_order_id: l.workOrderId,
          description: l.description,
          quantity: l.quantity,
          unit: l.unit,
          unit_price_cents: l.unitPriceCents,
          amount_cents: draft.totals.lineAmounts[i]!,
        })),
      )
      .execute();
    for (const o of orders) {
      await changeWorkOrderState(trx, { workOrderId: o.id, to: 'invoiced', actorId, note: `Invoice ${number}` });
    }
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actorId, action: 'invoice.issue', entity: 'invoice', entity_id: invoice.id, detail: JSON.stringify({ number, totalCents: draft.totals.totalCents, orders: orders.map((o) => o.number) }) })
      .execute();
    return invoice;
  });
}

export async function issueCreditNote(actorId: string | null, input: CreditNoteInput, database: Kysely<Database> = defaultDb): Promise<{ id: string; number: string }> {
  return database.transaction().execute(async (trx) => {
    const invoice = await lockInvoiceOrThrow(trx, input.invoiceId);
    const open = openBalanceCents({ totalCents: invoice.total_cents, paidCents: invoice.paid_cents, creditedCents: invoice.credited_cents });
    if (open <= 0) throw new AppError('CONFLICT', `Invoice ${invoice.number} has nothing open to credit. To return money already paid, refund the payment.`);
    if (input.amount > open) {
      throw new AppError('BAD_INPUT', `A credit note can reduce the open balance of ${formatMoney(open)} at most.`, { amount: [`Enter at most ${formatMoney(open)}.`] });
    }
    const issuedOn = todayIso();
    const number = await nextBillingNumber(trx, 'credit_note', Number(issuedOn.slice(0, 4)));
    const note = await trx
      .insertInto('credit_notes')
      .values({ number, invoice_id: invoice.id, customer_id: invoice.customer_id, amount_cents: input.amount, reason: input.reason, issued_on: issuedOn, issued_by: actorId })
      .returning(['id', 'number'])
      .executeTakeFirstOrThrow();
    await refreshInvoiceBalance(trx, invoice.id);
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actorId, action: 'invoice.credit', entity: 'invoice', entity_id: invoice.id, detail: JSON.stringify({ number, amountCents: input.amount, reason: input.reason }) })
      .execute();
    return note;
  });
}

export async function recordManualPayment(actorId: string | null, input: Omit<ManualPaymentInput, 'acceptExcess'> & { acceptExcess?: boolean }, database: Kysely<Database> = defaultDb): Promise<{ id: string }> {
  if (daysBetweenIso(todayIso(), input.receivedOn) > 0) {
    throw new AppError('BAD_INPUT', 'A payment cannot be received in the future.', { receivedOn: ['Use today or an earlier date.'] });
  }
  return database.transaction().execute(async (trx) => {
    const invoice = await lockInvoiceOrThrow(trx, input.invoiceId);
    const open = Math.max(0, openBalanceCents({ totalCents: invoice.total_cents, paidCents: invoice.paid_cents, creditedCents: invoice.credited_cents }));
    // Money that arrived is recorded; more than the balance only once the office confirms it, and
    // the excess is then the customer's credit on account.
    if (input.amount > open && !input.acceptExcess) {
      const excess = formatMoney(input.amount - open);
      throw new AppError('BAD_INPUT', `That is ${excess} more than the open balance of ${formatMoney(open)}. Tick "Keep the excess as credit on account" to record it all.`, {
        amount: [`${excess} above the open balance of ${formatMoney(open)}.`],
        acceptExcess: ['Tick to record the excess as credit on account.'],
      });
    }
    const payment = await trx
      .insertInto('payments')
      .values({
        invoice_id: invoice.id,
        customer_id: invoice.customer_id,
        kind: 'payment',
        method: input.method,
        amount_cents: input.amount,
        currency: invoice.currency,
        received_at: sql`${input.receivedOn}::date + time '12:00'`,
        reference: input.reference,
        recorded_by: actorId,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await refreshInvoiceBalance(trx, invoice.id);
    await trx
      .insertInto('audit_log')
      .values({
        actor_id: actorId,
        action: 'invoice.payment',
        entity: 'invoice',
        entity_id: invoice.id,
        detail: JSON.stringify({ amountCents: input.amount, method: input.method, excessCents: Math.max(0, input.amount - open) }),
      })
      .execute();
    return payment;
  });
}

export async function markInvoiceEmailed(invoiceId: string, database: Kysely<Database> = defaultDb): Promise<void> {
  await database.updateTable('invoices').set({ emailed_at: sql`now()` }).where('id', '=', invoiceId).execute();
}
