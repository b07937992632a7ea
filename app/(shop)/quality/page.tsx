import type { Metadata } from 'next';
import Link from 'next/link';
import { Countdown } from '@/components/countdown/countdown';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { StatusBadge } from '@/components/ui/status-badge';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { STATE_LABELS } from '@/lib/orders/states';
import { findOpenBakeWindows } from '@/lib/quality/bake/alerts';
import { findLotsAwaitingCertificate, findLotsAwaitingInspection } from '@/lib/quality/queries';
import { formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';

export const metadata: Metadata = { title: 'Quality' };

export default async function QualityPage() {
  await requirePageUser('quality.read', '/quality');
  const [lots, toCertify, windows] = await Promise.all([findLotsAwaitingInspection(), findLotsAwaitingCertificate(), findOpenBakeWindows()]);
  const tz = shopTimeZone();
  const now = new Date().toISOString();
  const deadlines = new Map(windows.map((w) => [w.workOrderId, w.deadlineAt]));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Quality" description="Plated lots waiting for their thickness, bake and certificate records, oldest plating first." />
      <Card title="Lots awaiting inspection" padding="none">
        {lots.length === 0 ? (
          <EmptyState className="m-4" title="Nothing waiting" description="Lots appear here once a plating run is logged on their work order." />
        ) : (
          <Table caption="Lots awaiting inspection" captionHidden>
            <THead>
              <tr>
                <Th>Work order</Th>
                <Th>Customer · part</Th>
                <Th>Stage</Th>
                <Th>Plated</Th>
                <Th>Thickness</Th>
                <Th>Bake</Th>
                <Th>Nonconformance</Th>
              </tr>
            </THead>
            <TBody>
              {lots.map((l) => {
                const deadline = deadlines.get(l.id);
                return (
                  <Tr key={l.id}>
                    <Td>
                      <Link className="font-mono" href={`/quality/orders/${l.id}`}>
                        {l.number}
                      </Link>
                    </Td>
                    <Td>
                      {l.customer_name}
                      <div className="text-xs text-ink-muted">
                        {l.part_number} · {l.finish_code}
                      </div>
                    </Td>
                    <Td>
                      <Badge tone="action">{STATE_LABELS[l.state]}</Badge>
                    </Td>
                    <Td className="text-xs">{l.plated_at ? formatShopTime(l.plated_at, tz) : '—'}</Td>
                    <Td>
                      {l.failing > 0 ? (
                        <StatusBadge status="out" label={`${l.failing} failing`} size="sm" />
                      ) : (
                        <StatusBadge status={l.parts_measured > 0 ? 'ok' : 'none'} label={`${l.parts_measured} parts measured`} size="sm" />
                      )}
                    </Td>
                    <Td>
                      {!l.bake_required ? (
                        <span className="text-xs text-ink-muted">not required</span>
                      ) : l.bake_verdict ? (
                        <StatusBadge status={l.bake_verdict === 'pass' ? 'ok' : 'out'} label={l.bake_verdict === 'pass' ? 'Recorded' : 'Failed'} size="sm" />
                      ) : deadline ? (
                        <Countdown deadline={deadline.toISOString()} now={now} />
                      ) : (
                        <StatusBadge status="none" label="Not recorded" size="sm" />
                      )}
                    </Td>
                    <Td>{l.open_ncs > 0 ? <StatusBadge status="out" label={`${l.open_ncs} open`} size="sm" /> : <span className="text-xs text-ink-muted">none open</span>}</Td>
                  </Tr>
                );
              })}
            </TBody>
          </Table>
        )}
      </Card>
      <Card title="Inspected, waiting for a certificate" padding="none">
        {toCertify.length === 0 ? (
          <p className="p-4 text-sm text-ink-muted">Every inspected lot has its certificate.</p>
        ) : (
          <ul className="divide-y divide-surface-line">
            {toCertify.map((o) => (
              <li key={o.id} className="flex flex-wrap items-center gap-3 px-4 py-2 text-sm">
                <Link className="font-mono" href={`/quality/orders/${o.id}`}>
                  {o.number}
                </Link>
                <span>{o.customer_name}</span>
                <span className="text-ink-muted">{o.part_number}</span>
                <Badge>{STATE_LABELS[o.state]}</Badge>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
