import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, InvoiceStatus } from '@/db/types';
import { openBalanceCents } from './arithmetic';
import { type AgedInvoice, type AgingBucket, agingBucket, type AgingReport, sumAging } from './aging';
import { daysBetweenIso, isoDate, todayIso } from './dates';
import { isUuid } from './orders';

// Reading invoices. Staff read any invoice; the customer area passes its own customer id as the
// scope, which goes into the WHERE clause, so another customer's invoice is simply not found.

export type InvoiceScope = { customerId: string } | 'staff';

export type InvoiceSummary = {
  id: string;
  number: string;
  customerId: string;
  customerName: string;
  status: InvoiceStatus;
  issuedOn: string;
  dueOn: string;
  totalCents: number;
  paidCents: number;
  creditedCents: number;
  /** What is still owed; negative when the customer paid more (the excess is credit on account). */
  openCents: number;
  /** Money beyond the balance, held as the customer's credit on account. */
  excessCents: number;
  isOverdue: boolean;
  currency: string;
};

function summaryQuery(database: Kysely<Database>) {
  return database
    .selectFrom('invoices as i')
    .innerJoin('customers as c', 'c.id', 'i.customer_id')
    .select([
      'i.id', 'i.number', 'i.customer_id', 'c.name as customer_name', 'i.status', 'i.issued_on', 'i.due_on',
      'i.total_cents', 'i.paid_cents', 'i.credited_cents', 'i.currency',
    ]);
}

type SummaryRow = Awaited<ReturnType<ReturnType<typeof summaryQuery>['execute']>>[number];

function toSummary(r: SummaryRow, today: string): InvoiceSummary {
  const openCents = openBalanceCents({ totalCents: r.total_cents, paidCents: r.paid_cents, creditedCents: r.credited_cents });
  const dueOn = isoDate(r.due_on);
  return {
    id: r.id,
    number: r.number,
    customerId: r.customer_id,
    customerName: r.customer_name,
    status: r.status,
    issuedOn: isoDate(r.issued_on),
    dueOn,
    totalCents: r.total_cents,
    paidCents: r.paid_cents,
    creditedCents: r.credited_cents,
    openCents,
    excessCents: Math.max(0, -openCents),
    isOverdue: openCents > 0 && dueOn < today,
    currency: r.currency,
  };
}

export type InvoiceFilter = { status?: InvoiceStatus | 'open' | 'overdue'; customerId?: string };

export async function findInvoices(scope: InvoiceScope, filter: InvoiceFilter = {}, database: Kysely<Database> = defaultDb): Promise<InvoiceSummary[]> {
  let q = summaryQuery(database).orderBy('i.issued_on', 'desc').orderBy('i.number', 'desc').limit(500);
  const customerId = scope === 'staff' ? filter.customerId : scope.customerId;
  if (customerId !== undefined) {
    if (!isUuid(customerId)) return [];
    q = q.where('i.customer_id', '=', customerId);
  }
  if (filter.status === 'open' || filter.status === 'overdue') q = q.where('i.status', 'in', ['issued', 'partly_paid']);
  else if (filter.status) q = q.where('i.status', '=', filter.status);
  if (filter.status === 'overdue') q = q.where('i.due_on', '<', sql<Date>`current_date`);
  const today = todayIso();
  return (await q.execute()).map((r) => toSummary(r, today));
}

/** Where a page of a customer's invoices ends: the next page starts after this one (newest first). */
export type InvoiceCursor = { issuedOn: string; number: string };
export const PORTAL_PAGE_SIZE = 25;

/**
 * One page of a customer's invoices, newest first, by key (issued on, number) so that the tenth
 * year's page costs what the first does; `next` is where the page after it starts, or null.
 */
export async function findInvoicePage(
  customerId: string,
  before: InvoiceCursor | null,
  size: number = PORTAL_PAGE_SIZE,
  database: Kysely<Database> = defaultDb,
): Promise<{ invoices: InvoiceSummary[]; next: InvoiceCursor | null }> {
  if (!isUuid(customerId)) return { invoices: [], next: null };
  let q = summaryQuery(database).where('i.customer_id', '=', customerId).orderBy('i.issued_on', 'desc').orderBy('i.number', 'desc').limit(size + 1);
  if (before) q = q.where(sql<boolean>`(i.issued_on, i.number) < (${before.issuedOn}::date, ${before.number})`);
  const rows = await q.execute();
  const today = todayIso();
  const invoices = rows.slice(0, size).map((r) => toSummary(r, today));
  const last = invoices.at(-1);
  return { invoices, next: rows.length > size && last ? { issuedOn: last.issuedOn, number: last.number } : null };
}

/** What a customer owes over every invoice, and the credit it holds on account: sums in SQL, not of a page. */
export async function customerInvoiceTotals(customerId: string, database: Kysely<Database> = defaultDb): Promise<{ openCents: number; creditCents: number }> {
  if (!isUuid(customerId)) return { openCents: 0, creditCents: 0 };
  // Each sum reads only its own invoices, through a partial index (open; overpaid), not the customer's whole history.
  const r = await database
    .selectNoFrom([
      sql<number>`(select coalesce(sum(greatest(i.total_cents - i.credited_cents - i.paid_cents, 0)), 0)::bigint from invoices i where i.customer_id = ${customerId} and i.status in ('issued', 'partly_paid'))`.as('open'),
      sql<number>`(select coalesce(sum(${invoiceExcessSql}), 0)::bigint from invoices i where i.customer_id = ${customerId} and i.status = 'overpaid')`.as('credit'),
    ])
    .executeTakeFirstOrThrow();
  return { openCents: Number(r.open), creditCents: Number(r.credit) };
}

export async function getInvoiceDetail(scope: InvoiceScope, invoiceId: string, database: Kysely<Database> = defaultDb) {
  if (!isUuid(invoiceId)) return null;
  if (scope !== 'staff' && !isUuid(scope.customerId)) return null;
  let q = database.selectFrom('invoices as i').selectAll('i').where('i.id', '=', invoiceId);
  if (scope !== 'staff') q = q.where('i.customer_id', '=', scope.customerId);
  const invoice = await q.executeTakeFirst();
  if (!invoice) return null;
  const [lines, creditNotes, payments, declines, customer, creditMoves] = await Promise.all([
    database.selectFrom('invoice_lines').selectAll().where('invoice_id', '=', invoice.id).orderBy('line_no').execute(),
    database.selectFrom('credit_notes').selectAll().where('invoice_id', '=', invoice.id).orderBy('created_at').execute(),
    database.selectFrom('payments').selectAll().where('invoice_id', '=', invoice.id).orderBy('received_at').orderBy('created_at').execute(),
    database
      .selectFrom('stripe_events')
      .select(['id', 'outcome', 'received_at'])
      .where('invoice_id', '=', invoice.id)
      .where('outcome', 'like', 'declined:%')
      .orderBy('received_at', 'desc')
      .limit(5)
      .execute(),
    database.selectFrom('customers').select(['id', 'name', 'code']).where('id', '=', invoice.customer_id).executeTakeFirstOrThrow(),
    database
      .selectFrom('credit_applications as a')
      .innerJoin('invoices as f', 'f.id', 'a.from_invoice_id')
      .innerJoin('invoices as t', 't.id', 'a.to_invoice_id')
      .select(['a.id', 'a.amount_cents', 'a.note', 'a.created_at', 'a.from_invoice_id', 'a.to_invoice_id', 'f.number as from_number', 't.number as to_number'])
      .where((eb) => eb.or([eb('a.from_invoice_id', '=', invoice.id), eb('a.to_invoice_id', '=', invoice.id)]))
      .orderBy('a.created_at')
      .execute(),
  ]);
  const today = todayIso();
  const summary = toSummary({ ...invoice, customer_name: customer.name }, today);
  return { invoice, summary, customer, lines, creditNotes, payments, declines, creditMoves };
}

export type InvoiceDetail = NonNullable<Awaited<ReturnType<typeof getInvoiceDetail>>>;

export async function findReminders(invoiceId: string, database: Kysely<Database> = defaultDb) {
  return database.selectFrom('invoice_reminders').selectAll().where('invoice_id', '=', invoiceId).orderBy('sent_at').execute();
}

/** What an overpaid invoice (alias "i") holds beyond its balance: its part of the customer's credit on account. */
export const invoiceExcessSql = sql<number>`(i.paid_cents + i.credited_cents - i.total_cents)`;

export type CustomerCredit = { customerId: string; customerName: string; creditCents: number };

/** Each customer's credit on account (overpayments not yet refunded or applied), by name, and their sum. */
export async function creditsOnAccount(database: Kysely<Database> = defaultDb): Promise<{ credits: CustomerCredit[]; creditCents: number }> {
  const rows = await database
    .selectFrom('invoices as i')
    .innerJoin('customers as c', 'c.id', 'i.customer_id')
    .select(['i.customer_id', 'c.name', sql<number>`sum(${invoiceExcessSql})::bigint`.as('credit')])
    .where('i.status', '=', 'overpaid')
    .groupBy(['i.customer_id', 'c.name'])
    .orderBy('c.name')
    .execute();
  const credits = rows.map((r) => ({ customerId: r.customer_id, customerName: r.name, creditCents: Number(r.credit) }));
  return { credits, creditCents: credits.reduce((t, c) => t + c.creditCents, 0) };
}

/** Open invoices a page at a time, most overdue first; the page after one starts past its last (due date, number). */
export type ReceivablesCursor = { dueOn: string; number: string };
export const RECEIVABLES_PAGE_SIZE = 25;

export type ReceivablesReport = AgingReport & {
  /** Every open invoice, of which `invoices` is one page. */
  invoiceCount: number;
  next: ReceivablesCursor | null;
  credits: CustomerCredit[];
  creditCents: number;
};

const openCentsSql = sql<number>`(i.total_cents - i.credited_cents - i.paid_cents)`;

/**
 * The aging of what is owed, beside each customer's credit on account. Totals by customer and
 * bucket are summed in SQL over every open invoice (buckets as agingBucket draws them); the list
 * of invoices is one page, by key, so ten years of a shop's invoices cost what a few do.
 */
export async function receivablesReport(
  asOf: string = todayIso(),
  database: Kysely<Database> = defaultDb,
  page: { after?: ReceivablesCursor | null; size?: number } = {},
): Promise<ReceivablesReport> {
  const size = page.size ?? RECEIVABLES_PAGE_SIZE;
  const days = sql<number>`(${asOf}::date - i.due_on)`;
  const bucket = sql<AgingBucket>`case when ${days} <= 0 then 'current' when ${days} <= 30 then 'days_1_30' when ${days} <= 60 then 'days_31_60' when ${days} <= 90 then 'days_61_90' else 'over_90' end`;
  let list = summaryQuery(database)
    .where('i.status', 'in', ['issued', 'partly_paid'])
    .where(sql<boolean>`${openCentsSql} > 0`)
    .orderBy('i.due_on')
    .orderBy('i.number')
    .limit(size + 1);
  if (page.after) list = list.where(sql<boolean>`(i.due_on, i.number) > (${page.after.dueOn}::date, ${page.after.number})`);
  const [grouped, rows, credit] = await Promise.all([
    database
      .selectFrom('invoices as i')
      .innerJoin('customers as c', 'c.id', 'i.customer_id')
      .select(['i.customer_id', 'c.name', bucket.as('bucket'), sql<string>`sum(${openCentsSql})::bigint`.as('open'), sql<number>`count(*)::int`.as('n')])
      .where('i.status', 'in', ['issued', 'partly_paid'])
      .where(sql<boolean>`${openCentsSql} > 0`)
      .groupBy(['i.customer_id', 'c.name', sql`3`])
      .execute(),
    list.execute(),
    creditsOnAccount(database),
  ]);
  const invoiceCount = grouped.reduce((n, g) => n + g.n, 0);
  const aging = sumAging(grouped.map((g) => ({ customerId: g.customer_id, customerName: g.name, bucket: g.bucket, openCents: Number(g.open) })));
  const invoices: AgedInvoice[] = rows.slice(0, size).map((r) => {
    const s = toSummary(r, asOf);
    const daysPastDue = daysBetweenIso(s.dueOn, asOf);
    return { invoiceId: s.id, number: s.number, customerId: s.customerId, customerName: s.customerName, dueOn: s.dueOn, openCents: s.openCents, daysPastDue, bucket: agingBucket(daysPastDue) };
  });
  const last = invoices.at(-1);
  return {
    asOf,
    invoices,
    invoiceCount,
    next: rows.length > size && last ? { dueOn: last.dueOn, number: last.number } : null,
    ...aging,
    ...credit,
  };
}

/** The shop's own name and address, printed on invoices (settings key 'shop'). */
export async function shopDetails(database: Kysely<Database> = defaultDb): Promise<{ name: string; address: string; phone: string; email: string }> {
  const row = await database.selectFrom('settings').select('value').where('key', '=', 'shop').executeTakeFirst();
  const v = (row?.value ?? {}) as Partial<Record<'name' | 'address' | 'phone' | 'email', string>>;
  return { name: v.name ?? 'Ampwright', address: v.address ?? '', phone: v.phone ?? '', email: v.email ?? '' };
}
