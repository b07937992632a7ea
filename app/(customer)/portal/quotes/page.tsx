import type { Metadata } from 'next';
import Link from 'next/link';
import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { SimpleTable } from '@/components/ui/simple-table';
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
      <SimpleTable
        caption={caption}
        rows={rows}
        rowKey={(q) => q.id}
        columns={[
          {
            header: 'Quote',
            cell: (q) => (
              <Link href={`/portal/quotes/${q.id}`} className="font-mono">
                {quoteLabel(q)}
              </Link>
            ),
          },
          { header: 'Status', cell: (q) => <PortalQuoteStatus status={q.status} /> },
          { header: 'Lines', numeric: true, cell: (q) => q.line_count },
          { header: 'Total', numeric: true, cell: (q) => <Money cents={q.total_cents} /> },
          { header: 'Sent', cell: (q) => formatDay(q.sent_at) },
          { header: 'Valid until', cell: (q) => formatDay(q.expires_at) },
          { header: 'Your PO', cell: (q) => q.po_number ?? '' },
        ]}
      />
    </Card>
  );
}
