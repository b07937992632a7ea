import type { Metadata } from 'next';
import Link from 'next/link';
import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { formatDay } from '@/lib/quotes/format';
import { findPortalQuotes } from '@/lib/quotes/queries';
import { quoteLabel } from '@/lib/quotes/status';
import { PortalQuoteStatus } from './status-badge';

export const metadata: Metadata = { title: 'Quotes' };

export default async function PortalQuotesPage() {
  const user = await requirePageUser('portal.use', '/portal/quotes');
  // Scoped by the signed-in contact's own company, never by anything in the request.
  const quotes = user.customerId ? await findPortalQuotes(user.customerId) : [];
  const open = quotes.filter((q) => q.status === 'sent');
  const past = quotes.filter((q) => q.status !== 'sent');
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Quotes" description="Quotes we have sent you. Open one to accept it with your purchase-order number, or to decline it." />
      {open.length === 0 ? (
        <EmptyState title="No open quotes" description="When we send you a quote it appears here, and you receive it by e-mail as well." />
      ) : (
        <QuoteTable caption="Open quotes" rows={open} />
      )}
      {past.length ? <QuoteTable caption="Earlier quotes" rows={past} /> : null}
    </div>
  );
}

function QuoteTable({ caption, rows }: { caption: string; rows: Awaited<ReturnType<typeof findPortalQuotes>> }) {
  return (
    <Card title={caption} padding="none">
      <Table caption={caption} captionHidden>
        <THead>
          <tr>
            <Th>Quote</Th>
            <Th>Status</Th>
            <Th numeric>Lines</Th>
            <Th numeric>Total</Th>
            <Th>Sent</Th>
            <Th>Valid until</Th>
            <Th>Your PO</Th>
          </tr>
        </THead>
        <TBody>
          {rows.map((q) => (
            <Tr key={q.id}>
              <Td>
                <Link href={`/portal/quotes/${q.id}`} className="font-mono">
                  {quoteLabel(q)}
                </Link>
              </Td>
              <Td>
                <PortalQuoteStatus status={q.status} />
              </Td>
              <Td numeric>{q.line_count}</Td>
              <Td numeric>
                <Money cents={q.total_cents} />
              </Td>
              <Td>{formatDay(q.sent_at)}</Td>
              <Td>{formatDay(q.expires_at)}</Td>
              <Td>{q.po_number ?? ''}</Td>
            </Tr>
          ))}
        </TBody>
      </Table>
    </Card>
  );
}
