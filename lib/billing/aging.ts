// Receivables aging: open invoices sorted into buckets by days past due, with totals per bucket
// and per customer. Pure.
import { daysBetweenIso } from './dates';

export type AgingBucket = 'current' | 'days_1_30' | 'days_31_60' | 'days_61_90' | 'over_90';

export const AGING_BUCKETS: readonly { key: AgingBucket; label: string }[] = [
  { key: 'current', label: 'Current' },
  { key: 'days_1_30', label: '1–30 days' },
  { key: 'days_31_60', label: '31–60 days' },
  { key: 'days_61_90', label: '61–90 days' },
  { key: 'over_90', label: 'Over 90 days' },
];

/** Not yet due, or due today, is current; the first day after the due date is 1 day past due. */
export function agingBucket(daysPastDue: number): AgingBucket {
  if (!Number.isInteger(daysPastDue)) throw new RangeError(`Days past due must be a whole number; got ${String(daysPastDue)}.`);
  if (daysPastDue <= 0) return 'current';
  if (daysPastDue <= 30) return 'days_1_30';
  if (daysPastDue <= 60) return 'days_31_60';
  if (daysPastDue <= 90) return 'days_61_90';
  return 'over_90';
}

export type AgingInput = {
  invoiceId: string;
  number: string;
  customerId: string;
  customerName: string;
  dueOn: string;
  openCents: number;
};

export type AgedInvoice = AgingInput & { daysPastDue: number; bucket: AgingBucket };
export type BucketTotals = Record<AgingBucket, number>;
export type CustomerAging = { customerId: string; customerName: string; totals: BucketTotals; totalCents: number };
export type AgingReport = { asOf: string; invoices: AgedInvoice[]; totals: BucketTotals; totalCents: number; customers: CustomerAging[] };

export const emptyBucketTotals = (): BucketTotals => ({ current: 0, days_1_30: 0, days_31_60: 0, days_61_90: 0, over_90: 0 });

/** Invoices with nothing open (paid, credited, overpaid) are left out. */
export function ageReceivables(invoices: readonly AgingInput[], asOf: string): AgingReport {
  const aged: AgedInvoice[] = invoices
    .filter((i) => i.openCents > 0)
    .map((i) => {
      const daysPastDue = daysBetweenIso(i.dueOn, asOf);
      return { ...i, daysPastDue, bucket: agingBucket(daysPastDue) };
    })
    .sort((a, b) => b.daysPastDue - a.daysPastDue || a.number.localeCompare(b.number));
  return { asOf, invoices: aged, ...sumAging(aged.map((i) => ({ customerId: i.customerId, customerName: i.customerName, bucket: i.bucket, openCents: i.openCents }))) };
}

/**
 * Open amounts by bucket, overall and per customer (owing most first): from single invoices, or
 * from sums per customer and bucket that the database worked out (lib/billing/queries.ts).
 */
export function sumAging(amounts: Iterable<{ customerId: string; customerName: string; bucket: AgingBucket; openCents: number }>): Pick<AgingReport, 'totals' | 'totalCents' | 'customers'> {
  const totals = emptyBucketTotals();
  const byCustomer = new Map<string, CustomerAging>();
  for (const a of amounts) {
    totals[a.bucket] += a.openCents;
    let c = byCustomer.get(a.customerId);
    if (!c) {
      c = { customerId: a.customerId, customerName: a.customerName, totals: emptyBucketTotals(), totalCents: 0 };
      byCustomer.set(a.customerId, c);
    }
    c.totals[a.bucket] += a.openCents;
    c.totalCents += a.openCents;
  }
  const customers = [...byCustomer.values()].sort((a, b) => b.totalCents - a.totalCents || a.customerName.localeCompare(b.customerName));
  return { totals, totalCents: customers.reduce((t, c) => t + c.totalCents, 0), customers };
}
