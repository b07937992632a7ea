import type { Metadata } from 'next';
import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { SimpleTable } from '@/components/ui/simple-table';
import { requirePageUser } from '@/lib/auth/current-user';
import { KeyPager, readCursor } from '@/components/ui/key-pager';
import { findPortalOrders } from '@/lib/orders/queries';
import { STATE_LABELS } from '@/lib/orders/states';
import { formatDay } from '@/lib/quotes/format';

export const metadata: Metadata = { title: 'Orders' };

export default async function PortalOrdersPage({ searchParams }: { searchParams: Promise<{ before?: string }> }) {
  const user = await requirePageUser('portal.use', '/portal/orders');
  const cursor = readCursor((await searchParams).before, /^\d{4}-\d{2}-\d{2}T[\d:.]+Z$/, /^[0-9a-f-]{36}$/i);
  const before = cursor ? { createdAt: cursor[0], id: cursor[1] } : null;
  // Scoped by the signed-in contact's own company; newest first, 25 a page.
  const { orders, next } = user.customerId ? await findPortalOrders(user.customerId, before) : { orders: [], next: null };
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Orders" description="Your parts in our shop and where they stand." />
      <SimpleTable
        framed
        caption="Orders"
        rows={orders}
        rowKey={(o) => o.id}
        empty={<EmptyState title="No orders yet" description="When you accept a quote, its work orders appear here with their progress and due date." />}
        columns={[
          {
            header: 'Order',
            className: 'font-mono',
            cell: (o) => <Link href={`/portal/orders/${o.id}`}>{o.number}</Link>,
          },
          { header: 'Your PO', cell: (o) => o.po_number },
          {
            header: 'Part',
            cell: (o) => (
              <>
                <span className="font-mono">{o.part_number}</span>
                {o.part_revision ? ` rev ${o.part_revision}` : ''}
              </>
            ),
          },
          { header: 'Finish', cell: (o) => o.finish_name },
          {
            header: 'Quantity',
            numeric: true,
            cell: (o) => (
              <>
                {o.quantity_ordered.toLocaleString('en-US')}
                {o.quantity_received ? <div className="text-xs text-ink-muted">{o.quantity_received.toLocaleString('en-US')} received</div> : null}
                {o.quantity_shipped ? <div className="text-xs text-ink-muted">{o.quantity_shipped.toLocaleString('en-US')} shipped</div> : null}
              </>
            ),
          },
          { header: 'Where it stands', cell: (o) => STATE_LABELS[o.state] },
          { header: 'Due', cell: (o) => formatDay(o.due_date) },
          {
            header: 'Received / shipped',
            cell: (o) => (
              <>
                {o.received_at ? formatDay(o.received_at) : 'Not yet received'}
                <div className="text-xs text-ink-muted">{o.last_shipped_at ? `Shipped ${formatDay(o.last_shipped_at)}` : 'Not shipped'}</div>
              </>
            ),
          },
        ]}
      />
      <KeyPager what="orders" basePath="/portal/orders" onFirstPage={!before} olderHref={next ? `/portal/orders?before=${next.createdAt}~${next.id}` : null} />
    </div>
  );
}
