// Issuing invoices from shipped work orders, numbering, credit notes and manual payments, on the
// real test database. Expected amounts are worked out by hand beside each check.
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { addDaysIso, isoDate, todayIso } from '@/lib/billing/dates';
import { issueCreditNote, issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { getInvoiceDetail } from '@/lib/billing/queries';
import { AppError } from '@/lib/errors';
import { customerId, lastSeq, makeOrder, OWNER, sessionUser } from './fixtures';

afterAll(() => db.destroy());

const YEAR = Number(todayIso().slice(0, 4));

async function failure(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'no error';
  } catch (e) {
    return e instanceof AppError ? `${e.code}: ${e.message}` : String(e);
  }
}

describe('issuing an invoice', () => {
  it('bills shipped orders at their unit prices, taxes the subtotal and marks the orders invoiced', async () => {
    const owner = await sessionUser(OWNER);
    const a = await makeOrder({ customer: 'NGF', quantity: 1250, unitPriceCents: 18.5 });
    const b = await makeOrder({ customer: 'NGF', quantity: 2450, unitPriceCents: 1234.5678, basis: 'hundred' });
    const before = await lastSeq('invoice', YEAR);
    const inv = await issueInvoice(owner.id, {
      customerId: await customerId('NGF'),
      orderIds: [a.id, b.id],
      extras: [
        { kind: 'rush', description: 'Rush surcharge', quantity: 1, unitPriceCents: 7500 },
        { kind: 'rework', description: 'Re-plate 12 pc at no charge', quantity: 12, unitPriceCents: 999 },
      ],
    });
    expect(inv.number).toBe(`I${YEAR}-${String(before + 1).padStart(5, '0')}`);
    const d = (await getInvoiceDetail('staff', inv.id))!;
    // 1250 × 18.5 ¢ = 23 125 ¢; 24.5 hundreds × 1234.5678 ¢ = 30 246.9111 → 30 247 ¢; rush 7 500 ¢; rework 0 ¢
    expect(d.lines.map((l) => l.amount_cents)).toEqual([23_125, 30_247, 7_500, 0]);
    // subtotal 60 872 ¢; NGF's rate 7.25 %: 4413.22 → 4413 ¢; total 65 285 ¢
    expect([d.invoice.subtotal_cents, d.invoice.tax_cents, d.invoice.total_cents]).toEqual([60_872, 4_413, 65_285]);
    expect(d.invoice.status).toBe('issued');
    expect(d.summary.dueOn).toBe(addDaysIso(todayIso(), 30)); // NGF: net 30
    expect(d.invoice.billing_email).toBe('ap@northgate-fastener.test');
    expect(d.invoice.rounding_rule).toMatch(/half-up to the cent/);
    const orders = await db.selectFrom('work_orders').select(['state']).where('id', 'in', [a.id, b.id]).execute();
    expect(orders.map((o) => o.state)).toEqual(['invoiced', 'invoiced']);
    const events = await db.selectFrom('work_order_events').select('note').where('work_order_id', '=', a.id).where('to_state', '=', 'invoiced').execute();
    expect(events).toEqual([{ note: `Invoice ${inv.number}` }]);
  });

  it('refuses an order that has not shipped, and writes nothing', async () => {
    const owner = await sessionUser(OWNER);
    const shipped = await makeOrder({ customer: 'NGF' });
    const inspected = await makeOrder({ customer: 'NGF', state: 'inspected' });
    const before = await lastSeq('invoice', YEAR);
    expect(await failure(issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [shipped.id, inspected.id], extras: [] }))).toBe(
      `CONFLICT: Only shipped work orders can be invoiced: ${inspected.number} is inspected.`,
    );
    expect(await lastSeq('invoice', YEAR)).toBe(before);
    const state = await db.selectFrom('work_orders').select('state').where('id', '=', shipped.id).executeTakeFirstOrThrow();
    expect(state.state).toBe('shipped');
  });

  it('refuses orders of two customers on one invoice', async () => {
    const owner = await sessionUser(OWNER);
    const ngf = await makeOrder({ customer: 'NGF' });
    const hvi = await makeOrder({ customer: 'HVI' });
    expect(await failure(issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [ngf.id, hvi.id], extras: [] }))).toMatch(
      new RegExp(`^CONFLICT: An invoice is for one customer: ${hvi.number} belongs to Halvorsen`),
    );
  });

  it('refuses an order already invoiced, naming the invoice', async () => {
    const owner = await sessionUser(OWNER);
    const o = await makeOrder({ customer: 'HVI' });
    const first = await issueInvoice(owner.id, { customerId: await customerId('HVI'), orderIds: [o.id], extras: [] });
    expect(await failure(issueInvoice(owner.id, { customerId: await customerId('HVI'), orderIds: [o.id], extras: [] }))).toBe(
      `CONFLICT: ${o.number} is already on invoice ${first.number}.`,
    );
  });

  it('lets only one of two simultaneous invoices take the same order', async () => {
    const owner = await sessionUser(OWNER);
    const o = await makeOrder({ customer: 'HVI' });
    const cid = await customerId('HVI');
    const results = await Promise.allSettled([0, 1].map(() => issueInvoice(owner.id, { customerId: cid, orderIds: [o.id], extras: [] })));
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    const rejected = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
    expect(rejected.reason).toBeInstanceOf(AppError);
    const lines = await db.selectFrom('invoice_lines').select('invoice_id').where('work_order_id', '=', o.id).execute();
    expect(lines).toHaveLength(1);
  });

  it('refuses an order with an open nonconformance until it is closed', async () => {
    const owner = await sessionUser(OWNER);
    const o = await makeOrder({ customer: 'NGF' });
    const ncr = await db
      .insertInto('nonconformances')
      .values({ work_order_id: o.id, source: 'thickness', description: 'Two parts below minimum thickness' })
      .returning('id')
      .executeTakeFirstOrThrow();
    expect(await failure(issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] }))).toBe(
      `CONFLICT: ${o.number} has an open nonconformance; quality must close it before the order is invoiced.`,
    );
    await db
      .updateTable('nonconformances')
      .set({ disposition: 'rework', dispositioned_at: new Date(), closed_at: new Date() })
      .where('id', '=', ncr.id)
      .execute();
    await expect(issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] })).resolves.toMatchObject({ number: expect.any(String) });
  });

  it('numbers invoices one after another and never reuses a number after a failure', async () => {
    const owner = await sessionUser(OWNER);
    const cid = await customerId('BRL');
    const first = await issueInvoice(owner.id, { customerId: cid, orderIds: [(await makeOrder({ customer: 'BRL' })).id], extras: [] });
    await failure(issueInvoice(owner.id, { customerId: cid, orderIds: [(await makeOrder({ customer: 'BRL', state: 'plated' })).id], extras: [] }));
    const second = await issueInvoice(owner.id, { customerId: cid, orderIds: [(await makeOrder({ customer: 'BRL' })).id], extras: [] });
    const seq = (n: string) => Number(n.split('-')[1]);
    expect(seq(second.number)).toBe(seq(first.number) + 1);
  });

  it('refuses a future invoice date', async () => {
    const owner = await sessionUser(OWNER);
    const o = await makeOrder({ customer: 'BRL' });
    expect(await failure(issueInvoice(owner.id, { customerId: await customerId('BRL'), orderIds: [o.id], extras: [], issuedOn: addDaysIso(todayIso(), 1) }))).toBe(
      'BAD_INPUT: An invoice cannot be dated in the future.',
    );
  });
});

describe('after issue: credit notes and payments', () => {
  async function hviInvoice() {
    const owner = await sessionUser(OWNER);
    // 1000 × 100 ¢ = 100 000 ¢; HVI's rate 6 %: 6 000 ¢; total 106 000 ¢
    const o = await makeOrder({ customer: 'HVI', quantity: 1000, unitPriceCents: 100 });
    const inv = await issueInvoice(owner.id, { customerId: await customerId('HVI'), orderIds: [o.id], extras: [] });
    return { owner, inv };
  }

  it('a credit note gets its own number, reduces the open balance and cannot exceed it', async () => {
    const { owner, inv } = await hviInvoice();
    const before = await lastSeq('credit_note', YEAR);
    const cn = await issueCreditNote(owner.id, { invoiceId: inv.id, amount: 6_000, reason: 'Tax-exempt certificate received' });
    expect(cn.number).toBe(`C${YEAR}-${String(before + 1).padStart(5, '0')}`);
    let d = (await getInvoiceDetail('staff', inv.id))!;
    expect(d.summary.openCents).toBe(100_000); // 106 000 − 6 000
    expect(d.invoice.status).toBe('issued');
    expect(d.invoice.total_cents).toBe(106_000); // the invoice itself is unchanged
    expect(await failure(issueCreditNote(owner.id, { invoiceId: inv.id, amount: 100_001, reason: 'Too much' }))).toBe(
      'BAD_INPUT: A credit note can reduce the open balance of $1,000.00 at most.',
    );
    await issueCreditNote(owner.id, { invoiceId: inv.id, amount: 100_000, reason: 'Order cancelled by agreement' });
    d = (await getInvoiceDetail('staff', inv.id))!;
    expect([d.invoice.status, d.summary.openCents, d.invoice.credited_cents]).toEqual(['credited', 0, 106_000]);
  });

  it('a check for part of the balance makes it partly paid, the rest makes it paid', async () => {
    const { owner, inv } = await hviInvoice();
    const today = todayIso();
    await recordManualPayment(owner.id, { invoiceId: inv.id, amount: 50_000, method: 'check', reference: 'Check 10442', receivedOn: today });
    let d = (await getInvoiceDetail('staff', inv.id))!;
    expect([d.invoice.status, d.summary.openCents]).toEqual(['partly_paid', 56_000]);
    expect(await failure(recordManualPayment(owner.id, { invoiceId: inv.id, amount: 56_001, method: 'check', reference: '', receivedOn: today }))).toBe(
      'BAD_INPUT: That is $0.01 more than the open balance of $560.00. Tick "Keep the excess as credit on account" to record it all.',
    );
    await recordManualPayment(owner.id, { invoiceId: inv.id, amount: 56_000, method: 'bank_transfer', reference: 'TRX-88', receivedOn: today });
    d = (await getInvoiceDetail('staff', inv.id))!;
    expect([d.invoice.status, d.summary.openCents, d.payments.length]).toEqual(['paid', 0, 2]);
    expect(isoDate(d.payments[0]!.received_at)).toBe(today);
  });
});
