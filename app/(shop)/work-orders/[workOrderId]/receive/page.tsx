import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { RECEIVABLE_STATES } from '@/lib/dock/receiving';
import { getWorkOrder } from '@/lib/orders/queries';
import { formatDay } from '@/lib/quotes/format';
import { ReceiptForm } from './receipt-form';

export const metadata: Metadata = { title: 'Receive parts' };

const UUID = /^[0-9a-f-]{36}$/i;

export default async function ReceivePage({ params }: { params: Promise<{ workOrderId: string }> }) {
  const { workOrderId } = await params;
  await requirePageUser('dock.receive', `/work-orders/${workOrderId}/receive`);
  const wo = UUID.test(workOrderId) ? await getWorkOrder(workOrderId) : null;
  if (!wo) notFound();
  const open = (RECEIVABLE_STATES as readonly string[]).includes(wo.state);
  const expected = Math.max(wo.quantity_ordered - wo.quantity_received, 1);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <PageHeader
        eyebrow={<Link href={`/work-orders/${wo.id}`}>{wo.number}</Link>}
        title="Receive parts"
        description={`${wo.customer_name} · PO ${wo.po_number} · ${wo.part_number}${wo.part_revision ? ` rev ${wo.part_revision}` : ''} · due ${formatDay(wo.due_date)}`}
      />
      {open ? (
        <Card title={wo.quantity_received ? `${wo.quantity_received.toLocaleString('en-US')} of ${wo.quantity_ordered.toLocaleString('en-US')} received so far` : `${wo.quantity_ordered.toLocaleString('en-US')} ordered`}>
          <ReceiptForm workOrderId={wo.id} expected={expected} />
        </Card>
      ) : (
        <EmptyState
          title="This order is past receiving"
          description="Its runs are logged. Parts sent back after shipping come in as a return for rework."
          action={<Link href={`/work-orders/${wo.id}/return`}>Receive a return for rework</Link>}
        />
      )}
    </div>
  );
}
