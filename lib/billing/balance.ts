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
 * Recomputes paid, credited and status from the payments and credit notes on record. Never
 * incremented in place, so a replayed or reordered event cannot make the balance drift.
 */
export async function refreshInvoiceBalance(trx: Trx, invoiceId: string): Promise<Invoice> {
  const sums = await trx
    .selectFrom('invoices as i')
    .select([
      'i.total_cents',
      sql<number>`(select coalesce(sum(case when p.kind = 'payment' then p.amount_cents else -p.amount_cents end), 0)::bigint
        from payments p where p.invoice_id = i.id)`.as('paid'),
      sql<number>`(select coalesce(sum(cn.amount_cents), 0)::bigint from credit_notes cn where cn.invoice_id = i.id)`.as('credited'),
    ])
    .where('i.id', '=', invoiceId)
    .executeTakeFirstOrThrow();
  const balance = { totalCents: sums.total_cents, paidCents: Math.max(0, Number(sums.paid)), creditedCents: Number(sums.credited) };
  return trx
    .updateTable('invoices')
    .set({ paid_cents: balance.paidCents, credited_cents: balance.creditedCents, status: invoiceStatus(balance), updated_at: sql`now()` })
    .where('id', '=', invoiceId)
    .returningAll()
    .executeTakeFirstOrThrow();
}
