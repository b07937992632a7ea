// A customer's invoices page by key, newest first: walking every page gives each invoice once, in
// order, and the totals the portal shows are over every invoice, not the page on screen.
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { customerInvoiceTotals, findInvoicePage, findInvoices, type InvoiceCursor } from '@/lib/billing/queries';
import { findPortalOrders, type OrderCursor } from '@/lib/orders/queries';
import { sql } from 'kysely';
import { inRolledBackTransaction } from '../records/helpers';
import { customerId } from './fixtures';

afterAll(() => db.destroy());

describe('paging by key', () => {
  it('walks a customer’s invoices three at a time, each once and newest first; totals cover them all', async () => {
    const id = await customerId('HVI');
    const all = await findInvoices('staff', { customerId: id });
    expect(all.length).toBeGreaterThan(3);
    const seen: string[] = [];
    let before: InvoiceCursor | null = null;
    for (let guard = 0; guard < 1000; guard++) {
      const page = await findInvoicePage(id, before, 3);
      expect(page.invoices.length).toBeLessThanOrEqual(3);
      seen.push(...page.invoices.map((i) => i.number));
      if (!page.next) break;
      before = page.next;
    }
    expect(seen).toEqual(all.map((i) => i.number));
    const totals = await customerInvoiceTotals(id);
    // By hand over the full list: what is still owed on open invoices, and what overpaid ones hold.
    expect(totals.openCents).toBe(all.filter((i) => i.status === 'issued' || i.status === 'partly_paid').reduce((s, i) => s + Math.max(0, i.openCents), 0));
    expect(totals.creditCents).toBe(all.filter((i) => i.status === 'overpaid').reduce((s, i) => s + i.excessCents, 0));
  });

  it('walks a customer’s orders the same way', async () => {
    const id = await customerId('NGF');
    const first = await findPortalOrders(id, null, 500);
    const seen: string[] = [];
    let before: OrderCursor | null = null;
    for (let guard = 0; guard < 1000; guard++) {
      const page = await findPortalOrders(id, before, 4);
      seen.push(...page.orders.map((o) => o.id));
      if (!page.next) break;
      before = page.next;
    }
    expect(seen).toEqual(first.orders.map((o) => o.id));
    expect(new Set(seen).size).toBe(seen.length);
  });

  it('keeps two orders made within one millisecond apart when a page ends between them', async () => {
    const id = await customerId('NGF');
    await inRolledBackTransaction(async (trx) => {
      const two = await trx.selectFrom('work_orders').select('id').where('customer_id', '=', id).orderBy('id').limit(2).execute();
      expect(two).toHaveLength(2);
      // The same millisecond; the one with the smaller id the later by a fraction of it.
      await sql`update work_orders set created_at = timestamptz '2031-01-01 00:00:00.123400+00' where id = ${two[0]!.id}`.execute(trx);
      await sql`update work_orders set created_at = timestamptz '2031-01-01 00:00:00.123456+00' where id = ${two[1]!.id}`.execute(trx);
      const first = await findPortalOrders(id, null, 1, trx);
      expect(first.orders.map((o) => o.id)).toEqual([two[1]!.id]);
      const second = await findPortalOrders(id, first.next, 1, trx);
      expect(second.orders.map((o) => o.id)).toEqual([two[0]!.id]);
    });
  });
});
