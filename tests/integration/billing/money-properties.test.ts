// Property tests over random sequences of invoices, card payments (some in another currency or
// larger than asked), checks, refunds, credit notes and credit applications, in any order and with
// events replayed: every cent that arrived is on an invoice or in the exceptions list, for every
// customer receipts − refunds = applied to invoices + credit on account to the cent, no invoice
// holds more than it asks without saying "overpaid", and the aging adds up to the open balances.
import { randomBytes } from 'node:crypto';
import fc from 'fast-check';
import type Stripe from 'stripe';
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { excessCents, openBalanceCents } from '@/lib/billing/arithmetic';
import { applyCredit, refundExcess } from '@/lib/billing/credit';
import { todayIso } from '@/lib/billing/dates';
import { issueCreditNote, issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { ageReceivables } from '@/lib/billing/aging';
import { receivablesReport } from '@/lib/billing/queries';
import { processStripeEvent } from '@/lib/billing/webhook';
import { AppError } from '@/lib/errors';
import { customerId, makeOrder, OWNER, sessionUser } from './fixtures';

process.env.SMTP_PORT ??= '2526';
afterAll(() => db.destroy());

const rid = (p: string) => `${p}_${randomBytes(10).toString('hex')}`;

type Op =
  | { kind: 'card'; inv: number; amount: number; currency: 'usd' | 'eur' }
  | { kind: 'check'; inv: number; amount: number }
  | { kind: 'cardRefund'; pay: number; share: number }
  | { kind: 'creditNote'; inv: number; share: number }
  | { kind: 'apply'; from: number; to: number; share: number }
  | { kind: 'refundExcess'; inv: number; share: number }
  | { kind: 'replay'; nth: number };

// Invoices are 21 450 ¢ (NGF) and 21 300 ¢ (HVI), so payments up to 30 000 ¢ often overpay.
const amount = fc.integer({ min: 1, max: 30_000 });
// Refunds, credit notes and applications take a share of what is there, now and then more than all of it.
const share = fc.integer({ min: 1, max: 120 });
const inv = fc.integer({ min: 0, max: 2 });
const op: fc.Arbitrary<Op> = fc.oneof(
  fc.record({ kind: fc.constant('card' as const), inv, amount, currency: fc.constantFrom('usd' as const, 'usd' as const, 'usd' as const, 'eur' as const) }),
  fc.record({ kind: fc.constant('check' as const), inv, amount }),
  fc.record({ kind: fc.constant('cardRefund' as const), pay: fc.nat(5), share }),
  fc.record({ kind: fc.constant('creditNote' as const), inv, share }),
  fc.record({ kind: fc.constant('apply' as const), from: inv, to: fc.constantFrom(0, 1), share }),
  fc.record({ kind: fc.constant('refundExcess' as const), inv, share }),
  fc.record({ kind: fc.constant('replay' as const), nth: fc.nat(10) }),
);

const portion = (available: number, pct: number) => Math.max(1, Math.ceil((Math.max(0, available) * pct) / 100));

async function balanceOf(id: string) {
  const r = await db.selectFrom('invoices').select(['total_cents', 'paid_cents', 'credited_cents']).where('id', '=', id).executeTakeFirstOrThrow();
  return { totalCents: r.total_cents, paidCents: r.paid_cents, creditedCents: r.credited_cents };
}

const expected = async (p: Promise<unknown>) => {
  try {
    await p;
  } catch (err) {
    if (!(err instanceof AppError)) throw err; // a refusal is fine; anything else is a bug
  }
};

async function runSequence(ops: Op[]) {
  const owner = await sessionUser(OWNER);
  // Two invoices of one customer (credit can move between them) and one of another.
  const customers = [await customerId('NGF'), await customerId('NGF'), await customerId('HVI')];
  const invoices: string[] = [];
  for (const c of customers) {
    const o = await makeOrder({ customer: c === customers[2] ? 'HVI' : 'NGF', quantity: 100, unitPriceCents: 200 });
    invoices.push((await issueInvoice(owner.id, { customerId: c, orderIds: [o.id], extras: [] })).id);
  }
  const intents: { pi: string; charge: string; amount: number; refunded: number; invoice: string }[] = [];
  const events: Stripe.Event[] = [];
  const sent = { usd: 0, eur: 0 }; // every cent the customers sent, by currency
  let refundedCents = 0; // every cent sent back

  const send = async (evt: Stripe.Event) => {
    events.push(evt);
    await processStripeEvent(evt);
  };
  const eventOf = (type: string, object: object) => ({ id: rid('evt'), object: 'event', type, created: Math.floor(Date.now() / 1000), data: { object } }) as unknown as Stripe.Event;

  for (const o of ops) {
    switch (o.kind) {
      case 'card': {
        const pi = rid('pi');
        const charge = rid('ch');
        sent[o.currency] += o.amount;
        if (o.currency === 'usd') intents.push({ pi, charge, amount: o.amount, refunded: 0, invoice: invoices[o.inv]! });
        await send(eventOf('payment_intent.succeeded', { id: pi, object: 'payment_intent', amount: o.amount, amount_received: o.amount, currency: o.currency, metadata: { invoice_id: invoices[o.inv] }, latest_charge: charge }));
        break;
      }
      case 'check': {
        await recordManualPayment(owner.id, { invoiceId: invoices[o.inv]!, amount: o.amount, method: 'check', reference: '', receivedOn: todayIso(), acceptExcess: true });
        sent.usd += o.amount;
        break;
      }
      case 'cardRefund': {
        const p = intents[o.pay % Math.max(1, intents.length)];
        if (!p) break;
        const total = Math.min(p.amount, p.refunded + portion(p.amount - p.refunded, o.share));
        if (total <= p.refunded) break;
        const before = await db.selectFrom('payments').select('id').where('kind', '=', 'refund').execute();
        await send(eventOf('charge.refunded', { id: p.charge, object: 'charge', amount: p.amount, amount_captured: p.amount, amount_refunded: total, currency: 'usd', payment_intent: p.pi, metadata: { invoice_id: p.invoice } }));
        const after = await db.selectFrom('payments').select('id').where('kind', '=', 'refund').execute();
        // Either the refund is on the books, or (more than the invoice holds) it is an exception.
        if (after.length > before.length) refundedCents += total - p.refunded;
        p.refunded = total;
        break;
      }
      case 'creditNote':
        await expected(issueCreditNote(owner.id, { invoiceId: invoices[o.inv]!, amount: portion(openBalanceCents(await balanceOf(invoices[o.inv]!)), o.share), reason: 'property test' }));
        break;
      case 'apply': {
        const from = invoices[o.from]!;
        const to = invoices[o.to]!;
        const most = Math.min(excessCents(await balanceOf(from)), openBalanceCents(await balanceOf(to)));
        if (from !== to) await expected(applyCredit(owner.id, { fromInvoiceId: from, toInvoiceId: to, amount: portion(most, o.share), note: '' }));
        break;
      }
      case 'refundExcess': {
        const before = await db.selectFrom('payments').select('id').where('invoice_id', '=', invoices[o.inv]!).where('kind', '=', 'refund').execute();
        const want = portion(excessCents(await balanceOf(invoices[o.inv]!)), o.share);
        await expected(refundExcess(owner.id, { invoiceId: invoices[o.inv]!, amount: want, method: 'check', reference: '' }));
        const after = await db.selectFrom('payments').select('id').where('invoice_id', '=', invoices[o.inv]!).where('kind', '=', 'refund').execute();
        if (after.length > before.length) refundedCents += want;
        break;
      }
      case 'replay': {
        const e = events[o.nth % Math.max(1, events.length)];
        if (e) await processStripeEvent(e);
        break;
      }
    }
  }
  return { invoices, intents: intents.map((i) => i.pi), sent, refundedCents };
}

/** The receivables report with its invoice list read page by page to the end, the way the page's "Next" link walks it. */
async function everyReceivable() {
  const first = await receivablesReport(todayIso(), db, { size: 40 });
  const listed = [...first.invoices];
  for (let next = first.next; next; ) {
    const page = await receivablesReport(first.asOf, db, { size: 40, after: next });
    listed.push(...page.invoices);
    next = page.next;
  }
  return { ...first, listed };
}

describe('the books add up, whatever happens in whatever order', () => {
  it('receipts − refunds = applied + credit on account; every cent is on an invoice or an exception; aging = open balances', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(op, { minLength: 1, maxLength: 14 }), async (ops) => {
        const run = await runSequence(ops);
        const rows = await db.selectFrom('invoices').selectAll().where('id', 'in', run.invoices).execute();
        const payments = await db.selectFrom('payments').selectAll().where('invoice_id', 'in', run.invoices).execute();
        const moves = await db.selectFrom('credit_applications').selectAll().where('from_invoice_id', 'in', run.invoices).execute();
        const offBooks = await db
          .selectFrom('payment_exceptions')
          .select(['amount_cents', 'reason', 'currency'])
          .where('payment_id', 'is', null)
          .where('reason', '<>', 'refund_exceeds_payments')
          .where((eb) => eb.or([eb('invoice_id', 'in', run.invoices), eb('stripe_payment_intent_id', 'in', run.intents.length ? run.intents : ['none'])]))
          .execute();

        // Nothing dropped: what was sent is on the run's invoices or held as an exception.
        const receipts = payments.filter((p) => p.kind === 'payment').reduce((s, p) => s + p.amount_cents, 0);
        const refunds = payments.filter((p) => p.kind === 'refund').reduce((s, p) => s + p.amount_cents, 0);
        const held = (currency: string) => offBooks.filter((e) => e.currency === currency).reduce((s, e) => s + e.amount_cents, 0);
        expect(receipts + held('usd')).toBe(run.sent.usd);
        expect(held('eur')).toBe(run.sent.eur);
        expect(refunds).toBe(run.refundedCents);
        // Money in another currency never lands on an invoice.
        for (const p of payments) expect(p.currency).toBe(rows.find((r) => r.id === p.invoice_id)!.currency);

        for (const cust of new Set(rows.map((r) => r.customer_id))) {
          const mine = rows.filter((r) => r.customer_id === cust);
          const ids = new Set(mine.map((r) => r.id));
          const got = payments.filter((p) => ids.has(p.invoice_id)).reduce((s, p) => s + (p.kind === 'payment' ? p.amount_cents : -p.amount_cents), 0);
          const applied = mine.reduce((s, r) => s + Math.min(r.paid_cents, r.total_cents - r.credited_cents), 0);
          const credit = mine.reduce((s, r) => s + excessCents({ totalCents: r.total_cents, paidCents: r.paid_cents, creditedCents: r.credited_cents }), 0);
          expect(got).toBe(applied + credit);
        }
        for (const r of rows) {
          const ledger =
            payments.filter((p) => p.invoice_id === r.id).reduce((s, p) => s + (p.kind === 'payment' ? p.amount_cents : -p.amount_cents), 0) +
            moves.filter((m) => m.to_invoice_id === r.id).reduce((s, m) => s + m.amount_cents, 0) -
            moves.filter((m) => m.from_invoice_id === r.id).reduce((s, m) => s + m.amount_cents, 0);
          expect(r.paid_cents).toBe(ledger);
          expect(r.paid_cents).toBeGreaterThanOrEqual(0);
          const open = openBalanceCents({ totalCents: r.total_cents, paidCents: r.paid_cents, creditedCents: r.credited_cents });
          if (open < 0) expect(r.status).toBe('overpaid');
          if (r.status === 'overpaid') expect(open).toBeLessThan(0);
        }
        const report = await everyReceivable();
        const aged = report.listed.filter((i) => run.invoices.includes(i.invoiceId)).reduce((s, i) => s + i.openCents, 0);
        // The totals summed in SQL, bucket by bucket and customer by customer, are the aging of every invoice the pages list.
        const pure = ageReceivables(report.listed, report.asOf);
        expect(report.listed.length).toBe(report.invoiceCount);
        expect(report.totals).toEqual(pure.totals);
        expect(report.totalCents).toBe(pure.totalCents);
        expect(report.customers).toEqual(pure.customers);
        expect(report.listed.map((i) => i.invoiceId)).toEqual(pure.invoices.map((i) => i.invoiceId));
        const openSum = rows.reduce((s, r) => s + Math.max(0, openBalanceCents({ totalCents: r.total_cents, paidCents: r.paid_cents, creditedCents: r.credited_cents })), 0);
        expect(aged).toBe(openSum);
      }),
      { numRuns: 40 },
    );
  }, 120_000);
});
