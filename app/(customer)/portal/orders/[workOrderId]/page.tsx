import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { SimpleTable } from '@/components/ui/simple-table';
import { requirePageUser } from '@/lib/auth/current-user';
import { formatWeight } from '@/lib/dock/packing-slip-pdf';
import { getPortalOrder } from '@/lib/dock/queries';
import { DISCREPANCY_SHORT } from '@/lib/dock/schemas';
import { plannedDatesOf } from '@/lib/schedule/queries';
import { plannedText } from '@/lib/schedule/turnaround';
import { STATE_LABELS } from '@/lib/orders/states';
import { formatDateTime, formatDay } from '@/lib/quotes/format';

export const metadata: Metadata = { title: 'Order' };

// One of the customer's own orders: where it stands, its dates at both docks, and its papers.
export default async function PortalOrderPage({ params }: { params: Promise<{ workOrderId: string }> }) {
  const { workOrderId } = await params;
  const user = await requirePageUser('portal.use', `/portal/orders/${workOrderId}`);
  const o = user.customerId ? await getPortalOrder(user.customerId, workOrderId) : null;
  if (!o) notFound();
  const planned = (await plannedDatesOf([o.id])).get(o.id);
  const firstIn = o.receipts[0]?.received_at ?? null;
  const lastOut = o.shipments.at(-1)?.shipped_at ?? null;
  const n = (v: number) => v.toLocaleString('en-US');
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={<Link href="/portal/orders">Orders</Link>}
        title={<span className="font-mono">{o.number}</span>}
        description={`PO ${o.po_number} · ${o.part_number}${o.revision ? ` rev ${o.revision}` : ''} · ${o.finish_name} · ${STATE_LABELS[o.state]}`}
      />
      <Card title="Dates">
        <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[12rem_1fr]">
          <dt className="text-ink-muted">Ordered</dt>
          <dd>{formatDay(o.created_at)}</dd>
          <dt className="text-ink-muted">Parts received</dt>
          <dd>{firstIn ? formatDateTime(firstIn) : 'Not yet'}</dd>
          <dt className="text-ink-muted">Promised</dt>
          <dd>{formatDay(o.due_date)}</dd>
          <dt className="text-ink-muted">Planned on the line</dt>
          <dd>{plannedText(planned, o.state)}</dd>
          <dt className="text-ink-muted">Shipped</dt>
          <dd>{lastOut ? `${formatDateTime(lastOut)}${o.state === 'shipped' || o.state === 'invoiced' ? '' : ' (part of the order)'}` : 'Not yet'}</dd>
          <dt className="text-ink-muted">Counts</dt>
          <dd className="tabular">
            {n(o.quantity_ordered)} ordered · {n(o.quantity_received)} received · {n(o.quantity_shipped)} shipped
            {o.quantity_scrapped ? ` · ${n(o.quantity_scrapped)} scrapped` : ''}
            {o.quantity_held ? ` · ${n(o.quantity_held)} held` : ''}
          </dd>
          <dt className="text-ink-muted">Certificate</dt>
          <dd>{o.certificate_id ? <Link href={`/portal/certificates/${o.certificate_id}`}>{o.certificate_number}</Link> : 'Not issued yet'}</dd>
        </dl>
      </Card>
      <SimpleTable
        framed
        caption="Received"
        rows={o.receipts}
        rowKey={(r) => r.id}
        empty={<p className="p-4 text-sm text-ink-muted">Your parts have not arrived yet.</p>}
        columns={[
          { header: 'Receipt', className: 'font-mono', cell: (r) => r.number },
          { header: 'When', cell: (r) => formatDateTime(r.received_at) },
          { header: 'Parts', numeric: true, cell: (r) => n(r.quantity) },
          { header: 'Containers', numeric: true, cell: (r) => r.containers },
          { header: 'Weight', cell: (r) => formatWeight(r.weight_kg) },
          { header: 'Your part / lot', cell: (r) => [r.customer_part_number, r.customer_lot && `lot ${r.customer_lot}`].filter(Boolean).join(' · ') || '—' },
          {
            header: 'Discrepancy',
            cell: (r) =>
              r.discrepancy === 'none' ? (
                '—'
              ) : (
                <>
                  <strong>{DISCREPANCY_SHORT[r.discrepancy]}</strong>: {r.discrepancy_note}
                  {r.photo_ids.length ? (
                    <div className="flex gap-2 text-xs">
                      {r.photo_ids.map((id, i) => (
                        <a key={id} href={`/api/files/${id}`} target="_blank" rel="noopener">
                          Photo {i + 1}
                        </a>
                      ))}
                    </div>
                  ) : null}
                </>
              ),
          },
        ]}
      />
      <SimpleTable
        framed
        caption="Shipped"
        rows={o.shipments}
        rowKey={(s) => s.id}
        empty={<p className="p-4 text-sm text-ink-muted">Nothing has shipped yet.</p>}
        columns={[
          { header: 'Shipment', className: 'font-mono', cell: (s) => s.number },
          { header: 'When', cell: (s) => formatDateTime(s.shipped_at) },
          { header: 'Parts', numeric: true, cell: (s) => n(s.quantity) },
          { header: 'Carrier', cell: (s) => (s.tracking_number ? `${s.carrier} · ${s.tracking_number}` : s.carrier) },
          {
            header: 'Papers',
            cell: (s) => (
              <>
                <a href={`/api/files/${s.slip_file_id}`} target="_blank" rel="noopener">
                  Packing slip
                </a>
                {s.certificate_id ? (
                  <>
                    {' · '}
                    <Link href={`/portal/certificates/${s.certificate_id}`}>Certificate {s.certificate_number}</Link>
                  </>
                ) : null}
              </>
            ),
          },
        ]}
      />
    </div>
  );
}
