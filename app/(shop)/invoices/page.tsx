import type { Metadata } from 'next';
import Link from 'next/link';
import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { findInvoices, type InvoiceFilter } from '@/lib/billing/queries';
import { formatDay } from '@/lib/quotes/format';
import { BillingTabs } from './_components/billing-tabs';
import { InvoiceStatusBadge, LINK } from './_components/invoice-view';

export const metadata: Metadata = { title: 'Invoices' };

const FILTERS: { key: string; label: string; filter: InvoiceFilter['status'] }[] = [
  { key: 'open', label: 'Open', filter: 'open' },
  { key: 'overdue', label: 'Overdue', filter: 'overdue' },
  { key: 'paid', label: 'Paid', filter: 'paid' },
  { key: 'all', label: 'All', filter: undefined },
];

export default async function InvoicesPage({ searchParams }: { searchParams: Promise<{ show?: string }> }) {
  const user = await requirePageUser('invoices.read', '/invoices');
  const { show } = await searchParams;
  const current = FILTERS.find((f) => f.key === show) ?? FILTERS[3]!;
  const invoices = await findInvoices('staff', { status: current.filter });
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Invoices" description="Invoices issued from shipped work orders, what each customer has paid, and what is still open." />
      <BillingTabs canIssue={can(user, 'invoices.issue')} />
      <nav aria-label="Show invoices" className="flex flex-wrap gap-2 text-sm">
        {FILTERS.map((f) => (
          <Link
            key={f.key}
            href={`/invoices?show=${f.key}`}
            aria-current={f === current ? 'true' : undefined}
            className={f === current ? 'rounded-md bg-action-soft px-2.5 py-1 font-medium text-action no-underline' : 'rounded-md px-2.5 py-1 no-underline hover:bg-surface-muted'}
          >
            {f.label}
          </Link>
        ))}
      </nav>
      {invoices.length === 0 ? (
        <EmptyState
          title={current.key === 'all' ? 'No invoices yet' : `No ${current.label.toLowerCase()} invoices`}
          description="Invoices are made from shipped work orders. Choose New invoice to bill a customer's shipped orders."
        />
      ) : (
        <Card padding="none">
          <Table caption="Invoices" captionHidden>
            <THead>
              <tr>
                <Th>Invoice</Th>
                <Th>Customer</Th>
                <Th>Date</Th>
                <Th>Due</Th>
                <Th>Status</Th>
                <Th numeric>Total</Th>
                <Th numeric>Open</Th>
              </tr>
            </THead>
            <TBody>
              {invoices.map((i) => (
                <Tr key={i.id}>
                  <Td>
                    <Link href={`/invoices/${i.id}`} className={LINK}>{i.number}</Link>
                  </Td>
                  <Td>{i.customerName}</Td>
                  <Td>{formatDay(i.issuedOn)}</Td>
                  <Td>{formatDay(i.dueOn)}</Td>
                  <Td>
                    <InvoiceStatusBadge summary={i} />
                  </Td>
                  <Td numeric>
                    <Money cents={i.totalCents} />
                  </Td>
                  <Td numeric>
                    <Money cents={i.openCents} accounting />
                  </Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        </Card>
      )}
    </div>
  );
}
