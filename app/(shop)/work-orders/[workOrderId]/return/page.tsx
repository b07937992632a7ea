import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { db } from '@/db';
import { requirePageUser } from '@/lib/auth/current-user';
import { findReworkOrders } from '@/lib/dock/queries';
import { getWorkOrder } from '@/lib/orders/queries';
import { ReturnForm } from './return-form';

export const metadata: Metadata = { title: 'Return for rework' };

const UUID = /^[0-9a-f-]{36}$/i;

export default async function ReturnPage({ params }: { params: Promise<{ workOrderId: string }> }) {
  const { workOrderId } = await params;
  await requirePageUser('dock.receive', `/work-orders/${workOrderId}/return`);
  const wo = UUID.test(workOrderId) ? await getWorkOrder(workOrderId) : null;
  if (!wo) notFound();
  const [ncs, rework] = await Promise.all([
    db.selectFrom('nonconformances').select(['id', 'description', 'opened_at']).where('work_order_id', '=', wo.id).orderBy('opened_at', 'desc').execute(),
    findReworkOrders(wo.id),
  ]);
  const left = wo.quantity_shipped - rework.reduce((s, r) => s + r.quantity_ordered, 0);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <PageHeader eyebrow={<Link href={`/work-orders/${wo.id}`}>{wo.number}</Link>} title="Return for rework" description={`${wo.customer_name} · PO ${wo.po_number} · ${wo.part_number} · ${wo.quantity_shipped.toLocaleString('en-US')} shipped`} />
      {left > 0 ? (
        <Card title="Parts back at the dock">
          <p className="mb-3 text-sm text-ink-muted">They come in on a new work order at no charge, linked to this lot and its nonconformance.</p>
          <ReturnForm workOrderId={wo.id} left={left} nonconformances={ncs.map((n) => ({ value: n.id, label: n.description.slice(0, 80) }))} />
        </Card>
      ) : (
        <EmptyState title="Nothing can come back" description={wo.quantity_shipped ? 'Every shipped part is already on a rework order.' : 'Nothing has shipped on this order yet.'} action={<Link href={`/work-orders/${wo.id}`}>Back to the order</Link>} />
      )}
    </div>
  );
}
