import { Countdown } from '@/components/countdown/countdown';
import { Card } from '@/components/ui/card';
import { Caution } from '@/components/ui/caution';
import { StatusBadge } from '@/components/ui/status-badge';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import type { UnitSystem } from '@/db/types';
import { displayUnit, formatStoredQuantity, fromStorage, unitInfo } from '@/lib/plating';
import type { LotBakeRequirement } from '@/lib/quality/bake/rules';
import type { LotRecord } from '@/lib/quality/lot-types';
import { formatShopTime, toLocalInputValue } from '@/lib/quality/shop-time';
import { BakeForm } from './bake-form';
import { BakeDispositionForm } from './small-forms';

type Props = { lot: LotRecord; req: LotBakeRequirement; units: UnitSystem; tz: string; canRecord: boolean; canDisposition: boolean; now: Date };

export function BakeCard({ lot, req, units, tz, canRecord, canDisposition, now }: Props) {
  const temp = (c: number) => formatStoredQuantity(c, 'temperature', units);
  const tempUnit = displayUnit('temperature', units);
  const platingEnd = lot.runs.reduce<Date | null>((m, r) => (!m || r.endedAt > m ? r.endedAt : m), null);
  const deadline = platingEnd ? new Date(platingEnd.getTime() + req.windowHours * 3_600_000) : null;
  const latest = lot.bakes.at(-1) ?? null;
  const mayRecord = canRecord && (lot.order.state === 'in_process' || lot.order.state === 'plated');
  return (
    <Card title="Embrittlement-relief bake" description={req.reason ?? undefined}>
      <div className="flex flex-col gap-4">
        <Caution kind="high-strength-steel-bake">
          Defer to the customer&apos;s specification for temperature, time and start window; the values below come from the finish record and the
          ASTM B850 table.
        </Caution>
        <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[12rem_1fr]">
          <dt className="text-ink-muted">Start within</dt>
          <dd>{req.windowHours} h of plating end</dd>
          <dt className="text-ink-muted">Part temperature</dt>
          <dd>
            {temp(req.minTempC)} to {temp(req.maxTempC)}
            {req.setPointC !== null ? ` (set point ${temp(req.setPointC)})` : ''}
          </dd>
          <dt className="text-ink-muted">Time at temperature</dt>
          <dd>{req.minHours === null ? "per the customer's specification" : `at least ${req.minHours} h`}</dd>
          {req.notes.length ? (
            <>
              <dt className="text-ink-muted">Notes</dt>
              <dd>
                <ul className="list-disc pl-4">
                  {req.notes.map((n) => (
                    <li key={n}>{n}</li>
                  ))}
                </ul>
              </dd>
            </>
          ) : null}
        </dl>
        {!latest && deadline ? (
          <div className="rounded-md border border-surface-line bg-surface-muted p-3">
            <p className="text-sm text-ink-muted">
              Plating ended {formatShopTime(platingEnd!, tz)}; start the bake by {formatShopTime(deadline, tz)}.
            </p>
            <Countdown deadline={deadline.toISOString()} now={now.toISOString()} label="Bake window" size="lg" />
          </div>
        ) : null}
        {lot.bakes.length ? (
          <Table dense caption="Bake records" captionHidden>
            <THead>
              <tr>
                <Th>Oven</Th>
                <Th>Plating ended → bake started</Th>
                <Th numeric>Temperature</Th>
                <Th numeric>Time</Th>
                <Th>Verdict</Th>
                <Th>Recorded</Th>
              </tr>
            </THead>
            <TBody>
              {lot.bakes.map((b) => (
                <Tr key={b.id}>
                  <Td>
                    {b.oven}
                    {b.chartFileId ? (
                      <a className="ml-2 text-xs" href={`/api/files/${b.chartFileId}`} target="_blank" rel="noopener">
                        chart
                      </a>
                    ) : null}
                  </Td>
                  <Td className="text-xs">
                    {formatShopTime(b.platingEndedAt, tz)} → {formatShopTime(b.bakeStartedAt, tz)}
                    <div className="text-ink-muted">start by {formatShopTime(b.deadlineAt, tz)}</div>
                  </Td>
                  <Td numeric>{b.tempMinC === b.tempMaxC ? temp(b.tempMinC) : `${temp(b.tempMinC)}–${temp(b.tempMaxC)}`}</Td>
                  <Td numeric>{b.durationH} h</Td>
                  <Td>
                    {b.verdict === 'pass' ? (
                      <StatusBadge status="ok" label="Meets the requirement" size="sm" />
                    ) : b.dispositionAt ? (
                      <StatusBadge status="near" label="Accepted by disposition" size="sm" />
                    ) : (
                      <StatusBadge status="out" label="Does not meet it" size="sm" />
                    )}
                    {b.reasons.length ? <div className="mt-1 text-xs">{b.reasons.map((r) => r.message).join(' ')}</div> : null}
                    {b.dispositionReason ? (
                      <div className="mt-1 text-xs text-ink-muted">
                        {b.dispositionByName}: {b.dispositionReason}
                      </div>
                    ) : null}
                  </Td>
                  <Td className="text-xs text-ink-muted">
                    {formatShopTime(b.recordedAt, tz)} · {b.recordedByName ?? '—'}
                  </Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        ) : null}
        {latest && latest.verdict === 'fail' && !latest.dispositionAt && canDisposition ? <BakeDispositionForm workOrderId={lot.order.id} bakeId={latest.id} /> : null}
        {mayRecord ? (
          <details open={!latest} className="rounded-md border border-surface-line p-3">
            <summary className="cursor-pointer font-medium">{latest ? 'Record another bake' : 'Record the bake'}</summary>
            <div className="pt-3">
              <BakeForm
                workOrderId={lot.order.id}
                platingEndedDefault={platingEnd ? toLocalInputValue(platingEnd, tz) : ''}
                nowDefault={toLocalInputValue(now, tz)}
                timeZone={tz}
                tempUnit={unitInfo(tempUnit).symbol}
                tempDefault={lot.finish.bakeTempC !== null ? String(Math.round(fromStorage(lot.finish.bakeTempC, tempUnit))) : ''}
                hoursDefault={req.minHours !== null ? String(req.minHours) : ''}
              />
            </div>
          </details>
        ) : null}
      </div>
    </Card>
  );
}
