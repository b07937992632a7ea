import 'server-only';
import { sql, type Transaction } from 'kysely';
import type { Database, Invoice } from '@/db/types';
import { AppError } from '@/lib/errors';
import { invoiceStatus } from './arithmetic';

type Trx = Transaction<Database>;

/** Locks the invoice row: every change to an invoice's balance is serialised through this lock. */
export async function lockInvoice(trx: Trx, invoiceId: string): Promise<Invoice | undefined> {
  return trx.selectFrom('invoices').selectAll().where('id', '=', invoiceId).forUpdate().executeTakeFirst();
}

export async function lockInvoiceOrThrow(trx: Trx, invoiceId: string): Promise<Invoice> {
  const invoice = await lockInvoice(trx, invoiceId);
  if (!invoice) throw new AppError('NOT_FOUND', 'That invoice does not exist.');
  return invoice;
}

/**
 * Recomputes paid, credited and status from the payments, credit notes and credit applications on record. Never
 * incremented in place, so a replayed or reordered event cannot make the balance drift.
 */
export async function refreshInvoiceBalance(trx: Trx, invoiceId: string): Promise<Invoice> {
  const sums = await trx
    .selectFrom('invoices as i')
    .select([
      'i.total_cents',
      // money received less refunds, plus credit moved in from another invoice, less credit moved out
      sql<number>`((select coalesce(sum(case when p.kind = 'payment' then p.amount_cents else -p.amount_cents end), 0)
          from payments p where p.invoice_id = i.id)
        + (select coalesce(sum(a.amount_cents), 0) from credit_applications a where a.to_invoice_id = i.id)
        - (select coalesce(sum(a.amount_cents), 0) from credit_applications a where a.from_invoice_id = i.id))::bigint`.as('paid'),
      sql<number>`(select coalesce(sum(cn.amount_cents), 0)::bigint from credit_notes cn where cn.invoice_id = i.id)`.as('credited'),
    ])
    .where('i.id', '=', invoiceId)
    .executeTakeFirstOrThrow();
  const paid = Number(sums.paid);
  // Every path that takes money off an invoice checks the balance first; a negative here is a bug,
  // and the paid_cents check constraint refuses it rather than hiding it.
  const balance = { totalCents: sums.total_cents, paidCents: paid, creditedCents: Number(sums.credited) };
  return trx
    .updateTable('invoices')
    .set({ paid_cents: balance.paidCents, credited_cents: balance.creditedCents, status: invoiceStatus(balance), updated_at: sql`now()` })
    .where('id', '=', invoiceId)
    .returningAll()
    .executeTakeFirstOrThrow();
}
