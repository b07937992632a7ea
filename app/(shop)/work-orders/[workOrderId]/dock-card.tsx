import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { LinkButton } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { StatusBadge } from '@/components/ui/status-badge';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { countsOf, inShop, isBalanced, MOVE_LABELS } from '@/lib/dock/counts';
import { formatWeight } from '@/lib/dock/packing-slip-pdf';
import type { findCountMoves, findReceipts, findReworkOrders, findShipments } from '@/lib/dock/queries';
import { RECEIVABLE_STATES } from '@/lib/dock/receiving';
import { DISCREPANCY_SHORT } from '@/lib/dock/schemas';
import type { WorkOrderDetail } from '@/lib/orders/queries';
import { formatDateTime } from '@/lib/quotes/format';
import { CountMoveForm, ResendButton } from './dock-forms';

type Props = {
  wo: WorkOrderDetail;
  receipts: Awaited<ReturnType<typeof findReceipts>>;
  shipments: Awaited<ReturnType<typeof findShipments>>;
  moves: Awaited<ReturnType<typeof findCountMoves>>;
  rework: Awaited<ReturnType<typeof findReworkOrders>>;
  may: { receive: boolean; ship: boolean; move: boolean };
};

const n = (v: number) => v.toLocaleString('en-US');

/** Everything between the docks: receipts, what was set aside, shipments, and the count that must add up. */
export function DockCard({ wo, receipts, shipments, moves, rework, may }: Props) {
  const c = countsOf(wo);
  const free = inShop(c);
  const receivable = (RECEIVABLE_STATES as readonly string[]).includes(wo.state);
  return (
    <Card
      title="Dock"
      padding="none"
      actions={
        <div className="flex gap-2">
          {may.receive && receivable ? <LinkButton href={`/work-orders/${wo.id}/receive`} size="sm">Receive parts</LinkButton> : null}
          {may.ship && wo.state === 'inspected' && free > 0 ? <LinkButton href={`/work-orders/${wo.id}/ship`} size="sm">Ship parts</LinkButton> : null}
          {may.receive && wo.quantity_shipped > 0 ? <LinkButton href={`/work-orders/${wo.id}/return`} variant="secondary" size="sm">Return for rework</LinkButton> : null}
        </div>
      }
    >
      <div className="flex flex-wrap items-center gap-x-6 gap-y-2 border-b border-surface-line p-4 text-sm tabular" aria-label="Counts">
        <span>Received <strong>{n(c.received)}</strong></span>
        <span>Shipped <strong>{n(c.shipped)}</strong></span>
        <span>Scrapped <strong>{n(c.scrapped)}</strong></span>
        <span>Held <strong>{n(c.held)}</strong></span>
        <span>In the shop <strong>{n(free)}</strong></span>
        {c.received === 0 ? null : isBalanced(c) ? <StatusBadge status="ok" label="Every part accounted for" size="sm" /> : <StatusBadge status="near" label={`${n(free)} still to ship, scrap or hold`} size="sm" />}
        {wo.rework_of_id ? <Badge tone="copper">Rework, no charge</Badge> : null}
      </div>
      {receipts.length ? (
        <>
        <h3 className="border-t border-surface-line px-4 pt-3 pb-1 text-sm font-semibold">Receipts</h3>
        <Table dense caption="Receipts" captionHidden>
          <THead>
            <tr>
              <Th>Receipt</Th>
              <Th>Received</Th>
              <Th numeric>Parts</Th>
              <Th numeric>Containers</Th>
              <Th>Weight</Th>
              <Th>Their part / lot</Th>
              <Th>Discrepancy</Th>
              <Th>Labels</Th>
            </tr>
          </THead>
          <TBody>
            {receipts.map((r) => (
              <Tr key={r.id}>
                <Td className="font-mono">{r.number}{r.is_return ? <Badge tone="copper" className="ml-1">Return</Badge> : null}</Td>
                <Td>{formatDateTime(r.received_at)}<div className="text-xs text-ink-muted">{r.received_by_name ?? ''}</div></Td>
                <Td numeric>{n(r.quantity)}</Td>
                <Td numeric>{r.containers}</Td>
                <Td>{formatWeight(r.weight_kg)}</Td>
                <Td>{[r.customer_part_number, r.customer_lot && `lot ${r.customer_lot}`].filter(Boolean).join(' · ') || '—'}</Td>
                <Td>
                  {r.discrepancy === 'none' ? (
                    '—'
                  ) : (
                    <div className="flex flex-col gap-1">
                      <StatusBadge status="near" label={DISCREPANCY_SHORT[r.discrepancy]} size="sm" />
                      <span className="text-xs">{r.discrepancy_note}</span>
                      <span className="text-xs text-ink-muted">{r.discrepancy_emailed_at ? `E-mailed ${formatDateTime(r.discrepancy_emailed_at)}` : 'Not e-mailed yet'}</span>
                      {may.receive ? <ResendButton kind="discrepancy" id={r.id} workOrderId={wo.id} label={r.discrepancy_emailed_at ? 'E-mail again' : 'E-mail the customer'} /> : null}
                    </div>
                  )}
                  {r.photo_ids.length ? (
                    <div className="mt-1 flex gap-2 text-xs">
                      {r.photo_ids.map((id, i) => (
                        <a key={id} href={`/api/files/${id}`} target="_blank" rel="noopener">
                          Photo {i + 1}
                        </a>
                      ))}
                    </div>
                  ) : null}
                </Td>
                <Td>
                  <a href={`/api/receipts/${r.id}/labels`} target="_blank" rel="noopener">
                    {r.containers} label{r.containers === 1 ? '' : 's'}
                  </a>
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
        </>
      ) : (
        <p className="p-4 text-sm text-ink-muted">No parts received yet.</p>
      )}
      {moves.length ? (
        <>
        <h3 className="border-t border-surface-line px-4 pt-3 pb-1 text-sm font-semibold">Scrap and holds</h3>
        <Table dense caption="Scrap and holds" captionHidden>
          <THead>
            <tr>
              <Th>When</Th>
              <Th>Move</Th>
              <Th numeric>Parts</Th>
              <Th>Reason</Th>
              <Th>By</Th>
            </tr>
          </THead>
          <TBody>
            {moves.map((m) => (
              <Tr key={m.id}>
                <Td>{formatDateTime(m.created_at)}</Td>
                <Td>{MOVE_LABELS[m.kind]}</Td>
                <Td numeric>{n(m.quantity)}</Td>
                <Td>{m.reason}</Td>
                <Td>{m.actor_name ?? '—'}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
        </>
      ) : null}
      {shipments.length ? (
        <>
        <h3 className="border-t border-surface-line px-4 pt-3 pb-1 text-sm font-semibold">Shipments</h3>
        <Table dense caption="Shipments" captionHidden>
          <THead>
            <tr>
              <Th>Shipment</Th>
              <Th>Shipped</Th>
              <Th numeric>Parts</Th>
              <Th numeric>Containers</Th>
              <Th>Carrier</Th>
              <Th>Documents</Th>
              <Th>Customer told</Th>
            </tr>
          </THead>
          <TBody>
            {shipments.map((s) => (
              <Tr key={s.id}>
                <Td className="font-mono">{s.number}</Td>
                <Td>{formatDateTime(s.shipped_at)}</Td>
                <Td numeric>{n(s.quantity)}</Td>
                <Td numeric>{s.containers}</Td>
                <Td>{s.carrier}{s.tracking_number ? <div className="font-mono text-xs">{s.tracking_number}</div> : null}</Td>
                <Td>
                  <a href={`/api/files/${s.slip_file_id}`} target="_blank" rel="noopener">Packing slip</a>
                  {s.certificate_number ? <div className="text-xs">Certificate {s.certificate_number}</div> : null}
                </Td>
                <Td>
                  <span className="text-xs">{s.emailed_at ? `E-mailed ${formatDateTime(s.emailed_at)}` : 'Not e-mailed'}</span>
                  {may.ship ? <div className="mt-1"><ResendButton kind="shipment" id={s.id} workOrderId={wo.id} label={s.emailed_at ? 'E-mail again' : 'E-mail the customer'} /></div> : null}
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
        </>
      ) : null}
      {rework.length ? (
        <p className="border-t border-surface-line p-4 text-sm">
          Came back for rework:{' '}
          {rework.map((r, i) => (
            <span key={r.id}>
              {i ? ', ' : ''}
              <Link href={`/work-orders/${r.id}`} className="font-mono">{r.number}</Link> ({n(r.quantity_ordered)} pc)
            </span>
          ))}
        </p>
      ) : null}
      {may.move && c.received > 0 && wo.state !== 'shipped' && wo.state !== 'invoiced' ? (
        <div className="border-t border-surface-line p-4">
          <CountMoveForm workOrderId={wo.id} held={c.held} />
        </div>
      ) : null}
    </Card>
  );
}
