import { Card } from '@/components/ui/card';
import { StatusBadge } from '@/components/ui/status-badge';
import type { LotCheck } from '@/lib/quality/lot-checks';
import type { LotRecord } from '@/lib/quality/lot-types';
import { describeRecord, PROCESS_RECORD_LABELS } from '@/lib/quality/process/rules';
import { formatShopTime } from '@/lib/quality/shop-time';
import { ProcessRecordForm, VoidProcessRecordForm, type RecordKindForForm } from './process-record-forms';

/** The records this lot's family needs besides thickness and bake, each with its form. */
export function ProcessRecordsCard({
  lot,
  kinds,
  checks,
  tz,
  canRecord,
  canVoid,
  phosphorusRange,
  saltSprayHours,
}: {
  lot: LotRecord;
  kinds: RecordKindForForm[];
  checks: LotCheck[];
  tz: string;
  canRecord: boolean;
  canVoid: boolean;
  phosphorusRange: { min: number; max: number } | null;
  saltSprayHours: number | null;
}) {
  const records = lot.processRecords ?? [];
  const closed = lot.certificate !== null || lot.order.state === 'shipped' || lot.order.state === 'invoiced';
  return (
    <Card title="Process tests" description="What this finish's process asks of each lot before inspection and the certificate.">
      <div className="flex flex-col gap-4">
        {kinds.map((kind) => {
          const check = checks.find((c) => c.key === kind);
          const mine = records.filter((r) => r.kind === kind);
          return (
            <section key={kind} className="flex flex-col gap-2 rounded-md border border-surface-line p-3" aria-label={PROCESS_RECORD_LABELS[kind]}>
              <header className="flex flex-wrap items-center gap-2">
                <h3 className="text-sm font-semibold">{PROCESS_RECORD_LABELS[kind]}</h3>
                {check ? <StatusBadge status={check.ok ? 'ok' : 'out'} label={check.ok ? 'Passes' : mine.length ? 'Fails' : 'Missing'} size="sm" /> : null}
              </header>
              {mine.length ? (
                <ul className="flex flex-col gap-1 text-sm">
                  {mine.map((r) => (
                    <li key={r.id} className="flex flex-wrap items-center gap-2">
                      <StatusBadge status={r.verdict === 'pass' ? 'ok' : 'out'} label={r.verdict === 'pass' ? 'Pass' : 'Fail'} size="sm" />
                      <span>{describeRecord(r)}</span>
                      <span className="text-xs text-ink-muted">
                        {formatShopTime(r.recordedAt, tz)}
                        {r.recordedByName ? ` by ${r.recordedByName}` : ''}
                      </span>
                      {canVoid && !closed ? <VoidProcessRecordForm workOrderId={lot.order.id} recordId={r.id} /> : null}
                    </li>
                  ))}
                </ul>
              ) : (
                <p className="text-sm text-ink-muted">Not recorded yet.</p>
              )}
              {canRecord && !closed ? (
                <ProcessRecordForm workOrderId={lot.order.id} kind={kind} phosphorusRange={phosphorusRange} saltSprayHours={saltSprayHours} />
              ) : null}
            </section>
          );
        })}
      </div>
    </Card>
  );
}
