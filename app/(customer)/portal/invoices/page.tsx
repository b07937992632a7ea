import type { Metadata } from 'next';
import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { KeyPager, readCursor } from '@/components/ui/key-pager';
import { findPortalInvoices, portalInvoiceTotals } from '@/lib/billing/portal';
import { InvoiceTable } from '../../../(shop)/invoices/_components/invoice-table';

export const metadata: Metadata = { title: 'Invoices' };

export default async function PortalInvoicesPage({ searchParams }: { searchParams: Promise<{ before?: string }> }) {
  const user = await requirePageUser('portal.use', '/portal/invoices');
  const cursor = readCursor((await searchParams).before, /^\d{4}-\d{2}-\d{2}$/, /^I\d{4}-\d{5,}$/);
  const before = cursor ? { issuedOn: cursor[0], number: cursor[1] } : null;
  // The totals are over every invoice of the company, not the page shown.
  const [{ invoices, next }, { openCents: open, creditCents: credit }] = await Promise.all([findPortalInvoices(user, before), portalInvoiceTotals(user)]);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Invoices"
        description="Your company's invoices: open ones can be paid online by card. Each invoice has its PDF and payment history."
        meta={
          invoices.length || open || credit ? (
            <span className="text-sm text-ink-muted">
              Open: <Money cents={open} />
              {credit > 0 ? (
                <>
                  {' '}· Credit on account: <Money cents={credit} />
                </>
              ) : null}
            </span>
          ) : null
        }
      />
      {invoices.length === 0 ? (
        <EmptyState title="No invoices yet" description="Invoices appear here when we bill shipped orders." />
      ) : (
        <Card padding="none">
          <InvoiceTable invoices={invoices} basePath="/portal/invoices" audience="customer" />
        </Card>
      )}
      <KeyPager what="invoices" basePath="/portal/invoices" onFirstPage={!before} olderHref={next ? `/portal/invoices?before=${next.issuedOn}~${next.number}` : null} />
    </div>
  );
}
