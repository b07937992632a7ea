import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { STATE_LABELS } from '@/lib/orders/states';
import { WorkOrdersGrid } from './work-orders-grid';

export const metadata: Metadata = { title: 'Work orders' };

export default async function WorkOrdersPage() {
  await requirePageUser('orders.read', '/work-orders');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Work orders" description="One order for each accepted quote line, followed through the shop. State filters take the stored words: accepted, received, in_process, plated, baked, inspected, shipped, invoiced." />
      <WorkOrdersGrid stateLabels={STATE_LABELS} />
    </div>
  );
}
