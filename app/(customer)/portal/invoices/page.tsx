import type { Metadata } from 'next';
import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findPortalInvoices } from '@/lib/billing/portal';
import { InvoiceTable } from '../../../(shop)/invoices/_components/invoice-table';

export const metadata: Metadata = { title: 'Invoices' };

export default async function PortalInvoicesPage() {
  const user = await requirePageUser('portal.use', '/portal/invoices');
  const invoices = await findPortalInvoices(user);
  const open = invoices.reduce((s, i) => s + Math.max(0, i.openCents), 0);
  const credit = invoices.reduce((s, i) => s + i.excessCents, 0);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Invoices"
        description="Your company's invoices: open ones can be paid online by card. Each invoice has its PDF and payment history."
        meta={
          invoices.length ? (
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
    </div>
  );
}
