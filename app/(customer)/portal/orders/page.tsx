import type { Metadata } from 'next';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { findPortalOrders } from '@/lib/orders/queries';
import { STATE_LABELS } from '@/lib/orders/states';
import { formatDay } from '@/lib/quotes/format';

export const metadata: Metadata = { title: 'Orders' };

export default async function PortalOrdersPage() {
  const user = await requirePageUser('portal.use', '/portal/orders');
  // Scoped by the signed-in contact's own company.
  const orders = user.customerId ? await findPortalOrders(user.customerId) : [];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Orders" description="Your parts in our shop and where they stand." />
      {orders.length === 0 ? (
        <EmptyState title="No orders yet" description="When you accept a quote, its work orders appear here with their progress and due date." />
      ) : (
        <Card padding="none">
          <Table caption="Orders" captionHidden>
            <THead>
              <tr>
                <Th>Order</Th>
                <Th>Your PO</Th>
                <Th>Part</Th>
                <Th>Finish</Th>
                <Th numeric>Quantity</Th>
                <Th>Where it stands</Th>
                <Th>Due</Th>
              </tr>
            </THead>
            <TBody>
              {orders.map((o) => (
                <Tr key={o.id}>
                  <Td className="font-mono">{o.number}</Td>
                  <Td>{o.po_number}</Td>
                  <Td>
                    <span className="font-mono">{o.part_number}</span>
                    {o.part_revision ? ` rev ${o.part_revision}` : ''}
                  </Td>
                  <Td>{o.finish_name}</Td>
                  <Td numeric>
                    {o.quantity_ordered.toLocaleString('en-US')}
                    {o.quantity_received ? <div className="text-xs text-ink-muted">{o.quantity_received.toLocaleString('en-US')} received</div> : null}
                  </Td>
                  <Td>{STATE_LABELS[o.state]}</Td>
                  <Td>{formatDay(o.due_date)}</Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        </Card>
      )}
    </div>
  );
}
