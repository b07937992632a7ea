import type { Metadata } from 'next';
import Link from 'next/link';
import { formatMoney, Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { KeyPager, readCursor } from '@/components/ui/key-pager';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, TFoot, Th, THead, Tr } from '@/components/ui/table';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { AGING_BUCKETS, type BucketTotals, sumAging } from '@/lib/billing/aging';
import { receivablesReport } from '@/lib/billing/queries';
import { formatDay } from '@/lib/quotes/format';
import { BillingTabs } from '../_components/billing-tabs';
import { LINK } from '../_components/invoice-view';

export const metadata: Metadata = { title: 'Receivables' };

/** Customers listed by name before the rest are summed on one line (all of them on asking). */
const TOP_CUSTOMERS = 10;


function BucketCells({ totals }: { totals: BucketTotals }) {
  return (
    <>
      {AGING_BUCKETS.map((b) => (
        <Td key={b.key} numeric className={totals[b.key] === 0 ? 'text-ink-faint' : undefined}>
          <Money cents={totals[b.key]} />
        </Td>
      ))}
    </>
  );
}

export default async function ReceivablesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser('invoices.read', '/invoices/receivables');
  const params = await searchParams;
  const cursor = readCursor(params.after, /^\d{4}-\d{2}-\d{2}$/, /^[A-Za-z0-9-]{1,40}$/);
  const after = cursor ? { dueOn: cursor[0], number: cursor[1] } : null;
  const report = await receivablesReport(undefined, undefined, { after });
  const shown = report.invoices.length;
  // The customers owing most come first; the rest on asking (the footer's totals are over all of them).
  const allCustomers = params.customers === 'all';
  const customers = allCustomers ? report.customers : report.customers.slice(0, TOP_CUSTOMERS);
  const rest = report.customers.slice(customers.length);
  // The rest on one line: their buckets summed as the report sums invoices.
  const restAging = sumAging(rest.flatMap((c) => AGING_BUCKETS.map((b) => ({ customerId: c.customerId, customerName: c.customerName, bucket: b.key, openCents: c.totals[b.key] }))));
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Receivables"
        description={`What customers owe as of ${formatDay(report.asOf)}, by days past the due date. Paid and credited invoices are left out; overpayments show as credit on account.`}
      />
      <BillingTabs canIssue={can(user, 'invoices.issue')} />
      {report.credits.length ? (
        <Card title={`Credit on account: ${formatMoney(report.creditCents)}`} description="Paid beyond what was invoiced, and not yet refunded or applied. Not part of what is owed below." padding="none">
          <Table caption="Credit on account by customer" captionHidden dense>
            <THead>
              <tr>
                <Th>Customer</Th>
                <Th numeric>Credit on account</Th>
              </tr>
            </THead>
            <TBody>
              {report.credits.map((c) => (
                <Tr key={c.customerId}>
                  <Td>
                    <Link href="/invoices?show=overpaid" className={LINK}>{c.customerName}</Link>
                  </Td>
                  <Td numeric>
                    <Money cents={c.creditCents} />
                  </Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        </Card>
      ) : null}
      {report.invoices.length === 0 ? (
        <EmptyState title="Nothing is owed" description="Every issued invoice is paid or credited." />
      ) : (
        <>
          <Card
            title="By customer"
            description={
              rest.length
                ? `The ${customers.length} owing most, of ${report.customers.length}; the totals below are over all of them.`
                : report.customers.length > TOP_CUSTOMERS
                  ? `All ${report.customers.length} customers who owe.`
                  : undefined
            }
            padding="none"
          >
            <Table caption="Receivables by customer and age" captionHidden>
              <THead>
                <tr>
                  <Th>Customer</Th>
                  {AGING_BUCKETS.map((b) => (
                    <Th key={b.key} numeric>
                      {b.label}
                    </Th>
                  ))}
                  <Th numeric>Total</Th>
                </tr>
              </THead>
              <TBody>
                {customers.map((c) => (
                  <Tr key={c.customerId}>
                    <Td>{c.customerName}</Td>
                    <BucketCells totals={c.totals} />
                    <Td numeric className="font-semibold">
                      <Money cents={c.totalCents} />
                    </Td>
                  </Tr>
                ))}
                {rest.length ? (
                  <Tr>
                    <Td>
                      <Link href="/invoices/receivables?customers=all" className={LINK}>
                        {rest.length} more {rest.length === 1 ? 'customer' : 'customers'}
                      </Link>
                    </Td>
                    <BucketCells totals={restAging.totals} />
                    <Td numeric>
                      <Money cents={restAging.totalCents} />
                    </Td>
                  </Tr>
                ) : null}
              </TBody>
              <TFoot>
                <tr>
                  <Td>All customers</Td>
                  <BucketCells totals={report.totals} />
                  <Td numeric>
                    <Money cents={report.totalCents} />
                  </Td>
                </tr>
              </TFoot>
            </Table>
          </Card>
          <Card
            title="Open invoices"
            description={`${report.invoiceCount.toLocaleString('en-US')} open, most overdue first${report.invoiceCount > shown ? `; ${shown} on this page` : ''}.`}
            padding="none"
          >
            <Table caption="Open invoices, most overdue first" captionHidden dense>
              <THead>
                <tr>
                  <Th>Invoice</Th>
                  <Th>Customer</Th>
                  <Th>Due</Th>
                  <Th numeric>Days past due</Th>
                  <Th>Age</Th>
                  <Th numeric>Open</Th>
                </tr>
              </THead>
              <TBody>
                {report.invoices.map((i) => (
                  <Tr key={i.invoiceId}>
                    <Td>
                      <Link href={`/invoices/${i.invoiceId}`} className={LINK}>{i.number}</Link>
                    </Td>
                    <Td>{i.customerName}</Td>
                    <Td>{formatDay(i.dueOn)}</Td>
                    <Td numeric>{i.daysPastDue > 0 ? i.daysPastDue : '—'}</Td>
                    <Td>{AGING_BUCKETS.find((b) => b.key === i.bucket)?.label}</Td>
                    <Td numeric>
                      <Money cents={i.openCents} />
                    </Td>
                  </Tr>
                ))}
              </TBody>
            </Table>
          </Card>
          <KeyPager
            what="open invoices"
            firstLabel="Most overdue"
            moreLabel="Next"
            basePath="/invoices/receivables"
            onFirstPage={!after}
            olderHref={report.next ? `/invoices/receivables?after=${report.next.dueOn}~${encodeURIComponent(report.next.number)}` : null}
          />
        </>
      )}
    </div>
  );
}
