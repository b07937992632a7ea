import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { findReceivableOrders, RECEIVING_PAGE_SIZE } from '@/lib/dock/queries';
import { STATE_LABELS } from '@/lib/orders/states';
import { formatDay } from '@/lib/quotes/format';

export const metadata: Metadata = { title: 'Receiving' };

// The receiving dock's start: find the order the delivery belongs to by the paperwork in hand.
export default async function ReceivingPage({ searchParams }: { searchParams: Promise<{ q?: string }> }) {
  await requirePageUser('dock.receive', '/receiving');
  const q = String((await searchParams).q ?? '').slice(0, 80);
  const orders = await findReceivableOrders(q);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Receiving" description="Find the order by the customer's PO, our order or quote number, the customer or the part, then count the delivery in." />
      <form className="flex max-w-xl gap-2" role="search">
        <label className="sr-only" htmlFor="receiving-q">
          PO, order, quote, customer or part
        </label>
        <input id="receiving-q" name="q" defaultValue={q} placeholder="PO, order, quote, customer or part" className="h-11 flex-1 rounded border border-surface-line bg-surface px-3" autoFocus />
        <button className="h-11 rounded bg-action px-4 font-medium text-white" type="submit">
          Find
        </button>
      </form>
      <Card title={q ? `Open orders matching “${q}”` : 'Orders waiting for parts, soonest due first'} padding="none">
        {orders.length === 0 ? (
          <p className="p-4 text-sm text-ink-muted">{q ? 'No open order matches. Check the PO on the paperwork, or ask the office to enter the order.' : 'No order is waiting for parts.'}</p>
        ) : (
          <Table dense caption="Orders open to receiving" captionHidden>
            <THead>
              <tr>
                <Th>Order</Th>
                <Th>Customer</Th>
                <Th>PO</Th>
                <Th>Part</Th>
                <Th numeric>Received / ordered</Th>
                <Th>Due</Th>
                <Th>State</Th>
              </tr>
            </THead>
            <TBody>
              {orders.map((o) => (
                <Tr key={o.id}>
                  <Td>
                    <Link href={`/work-orders/${o.id}/receive`} className="font-mono">
                      {o.number}
                    </Link>
                  </Td>
                  <Td>{o.customer_name}</Td>
                  <Td>{o.po_number}{o.quote_number ? <div className="text-xs text-ink-muted">{o.quote_number}</div> : null}</Td>
                  <Td className="font-mono">{o.part_number}</Td>
                  <Td numeric>
                    {o.quantity_received.toLocaleString('en-US')} / {o.quantity_ordered.toLocaleString('en-US')}
                  </Td>
                  <Td>{formatDay(o.due_date)}</Td>
                  <Td>{STATE_LABELS[o.state]}</Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        )}
        {orders.length === RECEIVING_PAGE_SIZE ? <p className="border-t border-surface-line p-3 text-xs text-ink-muted">Showing the first {RECEIVING_PAGE_SIZE}; search to narrow.</p> : null}
      </Card>
    </div>
  );
}
