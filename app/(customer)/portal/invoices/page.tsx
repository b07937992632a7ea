import type { Metadata } from 'next';
import Link from 'next/link';
import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { findPortalInvoices } from '@/lib/billing/portal';
import { formatDay } from '@/lib/quotes/format';
import { InvoiceStatusBadge, LINK } from '../../../(shop)/invoices/_components/invoice-view';

export const metadata: Metadata = { title: 'Invoices' };

export default async function PortalInvoicesPage() {
  const user = await requirePageUser('portal.use', '/portal/invoices');
  const invoices = await findPortalInvoices(user);
  const open = invoices.reduce((s, i) => s + Math.max(0, i.openCents), 0);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Invoices"
        description="Your company's invoices: open ones can be paid online by card. Each invoice has its PDF and payment history."
        meta={invoices.length ? <span className="text-sm text-ink-muted">Open: <Money cents={open} /></span> : null}
      />
      {invoices.length === 0 ? (
        <EmptyState title="No invoices yet" description="Invoices appear here when we bill shipped orders." />
      ) : (
        <Card padding="none">
          <Table caption="Invoices" captionHidden>
            <THead>
              <tr>
                <Th>Invoice</Th>
                <Th>Date</Th>
                <Th>Due</Th>
                <Th>Status</Th>
                <Th numeric>Total</Th>
                <Th numeric>Open</Th>
                <Th>PDF</Th>
              </tr>
            </THead>
            <TBody>
              {invoices.map((i) => (
                <Tr key={i.id}>
                  <Td>
                    <Link href={`/portal/invoices/${i.id}`} className={LINK}>{i.number}</Link>
                  </Td>
                  <Td>{formatDay(i.issuedOn)}</Td>
                  <Td>{formatDay(i.dueOn)}</Td>
                  <Td>
                    <InvoiceStatusBadge summary={i} />
                  </Td>
                  <Td numeric>
                    <Money cents={i.totalCents} />
                  </Td>
                  <Td numeric>
                    <Money cents={Math.max(0, i.openCents)} />
                  </Td>
                  <Td>
                    <a className={LINK} href={`/portal/invoices/${i.id}/pdf`} aria-label={`PDF of invoice ${i.number}`}>
                      PDF
                    </a>
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
