import { Card } from '@/components/ui/card';
import { StatusBadge } from '@/components/ui/status-badge';
import { DISPOSITION_LABELS, type LotRecord } from '@/lib/quality/lot-types';
import { formatShopTime } from '@/lib/quality/shop-time';
import { DispositionForm, OpenNonconformanceForm } from './small-forms';

const SOURCE: Record<string, string> = { thickness: 'Thickness', bake: 'Relief bake', bath: 'Bath outside specification', other: 'Other' };

export function NonconformanceCard({ lot, tz, canOpen, canDisposition }: { lot: LotRecord; tz: string; canOpen: boolean; canDisposition: boolean }) {
  const open = lot.nonconformances.filter((n) => n.disposition === null).length;
  return (
    <Card
      title="Nonconformances"
      description={open ? 'An open nonconformance holds the order from inspection, certification and invoicing until a supervisor dispositions it.' : undefined}
    >
      <div className="flex flex-col gap-4">
        {lot.nonconformances.length === 0 ? <p className="text-sm text-ink-muted">None on this lot.</p> : null}
        {lot.nonconformances.map((n) => (
          <article key={n.id} className="rounded-md border border-surface-line p-3">
            <header className="flex flex-wrap items-center gap-2">
              {n.disposition ? (
                <StatusBadge status="ok" label={`Closed · ${DISPOSITION_LABELS[n.disposition]}`} size="sm" />
              ) : (
                <StatusBadge status="out" label="Open" size="sm" />
              )}
              <span className="text-sm font-medium">{SOURCE[n.source]}</span>
              <span className="text-xs text-ink-muted">
                opened {formatShopTime(n.openedAt, tz)}
                {n.openedByName ? ` by ${n.openedByName}` : ''}
              </span>
            </header>
            <p className="mt-1 text-sm">{n.description}</p>
            {n.disposition ? (
              <p className="mt-1 text-xs text-ink-muted">
                {n.dispositionedByName ?? 'A supervisor'} on {formatShopTime(n.dispositionedAt!, tz)}
                {n.customerApprovalRef ? ` · customer approval ${n.customerApprovalRef}` : ''}
                {n.dispositionNote ? ` · ${n.dispositionNote}` : ''}
              </p>
            ) : canDisposition ? (
              <div className="mt-3 border-t border-surface-line pt-3">
                <DispositionForm workOrderId={lot.order.id} nonconformanceId={n.id} />
              </div>
            ) : null}
          </article>
        ))}
        {canOpen && lot.order.state !== 'invoiced' ? (
          <details className="rounded-md border border-surface-line p-3">
            <summary className="cursor-pointer font-medium">Open a nonconformance</summary>
            <div className="pt-3">
              <OpenNonconformanceForm workOrderId={lot.order.id} />
            </div>
          </details>
        ) : null}
      </div>
    </Card>
  );
}
