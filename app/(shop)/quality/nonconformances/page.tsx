import type { Metadata } from 'next';
import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { SimpleTable } from '@/components/ui/simple-table';
import { StatusBadge } from '@/components/ui/status-badge';
import { requirePageUser } from '@/lib/auth/current-user';
import { DISPOSITION_LABELS } from '@/lib/quality/lot-types';
import { findNonconformances } from '@/lib/quality/queries';
import { formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';

export const metadata: Metadata = { title: 'Nonconformances' };

export default async function NonconformancesPage() {
  await requirePageUser('quality.read', '/quality/nonconformances');
  const rows = await findNonconformances();
  const tz = shopTimeZone();
  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Nonconformances" description="Open ones first. An order with an open nonconformance is not inspected, certified or invoiced until a supervisor dispositions it." />
      <SimpleTable
        framed
        caption="Nonconformances"
        rows={rows}
        rowKey={(n) => n.id}
        empty={<EmptyState title="No nonconformances" description="A failing thickness reading opens one automatically; anyone recording quality can open one from the lot's page." />}
        columns={[
          { header: 'Status', cell: (n) => (n.disposition ? <StatusBadge status="ok" label="Closed" size="sm" /> : <StatusBadge status="out" label="Open" size="sm" />) },
          {
            header: 'Work order',
            cell: (n) => (
              <>
                <Link className="font-mono" href={`/quality/orders/${n.work_order_id}`}>
                  {n.work_order_number}
                </Link>
                <div className="text-xs text-ink-muted">{n.customer_name}</div>
              </>
            ),
          },
          { header: 'What', className: 'max-w-md', cell: (n) => n.description },
          { header: 'Opened', className: 'text-xs', cell: (n) => formatShopTime(n.opened_at, tz) },
          {
            header: 'Disposition',
            className: 'text-xs',
            cell: (n) =>
              n.disposition ? (
                <>
                  {DISPOSITION_LABELS[n.disposition]}
                  {n.customer_approval_ref ? ` · ${n.customer_approval_ref}` : ''}
                  <div className="text-ink-muted">{n.dispositioned_by_name}</div>
                </>
              ) : (
                '—'
              ),
          },
        ]}
      />
    </div>
  );
}
