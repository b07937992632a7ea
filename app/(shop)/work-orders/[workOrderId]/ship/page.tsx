import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { countsOf, inShop } from '@/lib/dock/counts';
import { getWorkOrder } from '@/lib/orders/queries';
import { STATE_LABELS } from '@/lib/orders/states';
import { ShipForm } from './ship-form';

export const metadata: Metadata = { title: 'Ship parts' };

const UUID = /^[0-9a-f-]{36}$/i;

export default async function ShipPage({ params }: { params: Promise<{ workOrderId: string }> }) {
  const { workOrderId } = await params;
  await requirePageUser('dock.ship', `/work-orders/${workOrderId}/ship`);
  const wo = UUID.test(workOrderId) ? await getWorkOrder(workOrderId) : null;
  if (!wo) notFound();
  const c = countsOf(wo);
  const free = inShop(c);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <PageHeader
        eyebrow={<Link href={`/work-orders/${wo.id}`}>{wo.number}</Link>}
        title="Ship parts"
        description={`${wo.customer_name} · PO ${wo.po_number} · ${wo.part_number} · ${wo.finish_code}`}
      />
      {wo.state === 'inspected' && free > 0 ? (
        <Card title={`Received ${c.received.toLocaleString('en-US')} · shipped ${c.shipped.toLocaleString('en-US')} · scrapped ${c.scrapped.toLocaleString('en-US')} · held ${c.held.toLocaleString('en-US')}`}>
          <ShipForm workOrderId={wo.id} available={free} />
        </Card>
      ) : wo.state === 'shipped' || wo.state === 'invoiced' ? (
        <EmptyState
          title="Every part is accounted for: the order is shipped."
          description={`Shipped ${c.shipped.toLocaleString('en-US')}, scrapped ${c.scrapped.toLocaleString('en-US')}, held ${c.held.toLocaleString('en-US')} of ${c.received.toLocaleString('en-US')} received. The packing slips are on the order.`}
          action={<Link href={`/work-orders/${wo.id}`}>Back to the order</Link>}
        />
      ) : (
        <EmptyState
          title={wo.state === 'inspected' ? 'Nothing left to ship' : 'Not ready to ship'}
          description={wo.state === 'inspected' ? 'Every received part is shipped, scrapped or held.' : `The order is ${STATE_LABELS[wo.state].toLowerCase()}; parts ship once inspected.`}
          action={<Link href={`/work-orders/${wo.id}`}>Back to the order</Link>}
        />
      )}
    </div>
  );
}
