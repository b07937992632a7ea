import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { StatusBadge } from '@/components/ui/status-badge';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
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
      {rows.length === 0 ? (
        <EmptyState title="No nonconformances" description="A failing thickness reading opens one automatically; anyone recording quality can open one from the lot's page." />
      ) : (
        <Card padding="none">
          <Table caption="Nonconformances" captionHidden>
            <THead>
              <tr>
                <Th>Status</Th>
                <Th>Work order</Th>
                <Th>What</Th>
                <Th>Opened</Th>
                <Th>Disposition</Th>
              </tr>
            </THead>
            <TBody>
              {rows.map((n) => (
                <Tr key={n.id}>
                  <Td>{n.disposition ? <StatusBadge status="ok" label="Closed" size="sm" /> : <StatusBadge status="out" label="Open" size="sm" />}</Td>
                  <Td>
                    <Link className="font-mono" href={`/quality/orders/${n.work_order_id}`}>
                      {n.work_order_number}
                    </Link>
                    <div className="text-xs text-ink-muted">{n.customer_name}</div>
                  </Td>
                  <Td className="max-w-md">{n.description}</Td>
                  <Td className="text-xs">{formatShopTime(n.opened_at, tz)}</Td>
                  <Td className="text-xs">
                    {n.disposition ? (
                      <>
                        {DISPOSITION_LABELS[n.disposition]}
                        {n.customer_approval_ref ? ` · ${n.customer_approval_ref}` : ''}
                        <div className="text-ink-muted">{n.dispositioned_by_name}</div>
                      </>
                    ) : (
                      '—'
                    )}
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
