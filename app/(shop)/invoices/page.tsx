import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { findInvoices, type InvoiceFilter } from '@/lib/billing/queries';
import { BillingTabs } from './_components/billing-tabs';
import { InvoiceTable } from './_components/invoice-table';

export const metadata: Metadata = { title: 'Invoices' };

const FILTERS: { key: string; label: string; filter: InvoiceFilter['status'] }[] = [
  { key: 'open', label: 'Open', filter: 'open' },
  { key: 'overdue', label: 'Overdue', filter: 'overdue' },
  { key: 'paid', label: 'Paid', filter: 'paid' },
  { key: 'overpaid', label: 'Overpaid (credit on account)', filter: 'overpaid' },
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
          <InvoiceTable invoices={invoices} basePath="/invoices" audience="staff" />
        </Card>
      )}
    </div>
  );
}
