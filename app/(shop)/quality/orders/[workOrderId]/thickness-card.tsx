import { Card } from '@/components/ui/card';
import { StatusBadge } from '@/components/ui/status-badge';
import type { UnitSystem } from '@/db/types';
import { displayUnit, formatStoredQuantity, unitInfo } from '@/lib/plating';
import { lotEfficiency } from '@/lib/quality/efficiency';
import type { ThicknessState } from '@/lib/quality/lot-checks';
import type { LotRecord } from '@/lib/quality/lot-types';
import { CsvForm } from './csv-form';
import { lotFamily } from '@/lib/quality/lot-checks';
import { ReadingsForm } from './readings-form';
import { ReadingsTable } from './readings-table';

type Props = { lot: LotRecord; t: ThicknessState; units: UnitSystem; tz: string; canRecord: boolean; canVoid: boolean; open: boolean };

const pct = (x: number) => `${(x * 100).toFixed(1)} %`;
/** Up to this many readings show open; a longer list folds away, its failing readings shown apart. */
const SHOW_OPEN = 20;

export function ThicknessCard({ lot, t, units, tz, canRecord, canVoid, open }: Props) {
  const q = (um: number | null | undefined) => (um === null || um === undefined ? '—' : formatStoredQuantity(um, 'thickness', units));
  const f = lot.finish;
  const s = t.summary;
  // Cathode efficiency is electroplating's alone (Faraday's law); other families have none to measure.
  const eff = s && lotFamily(lot).family.usesEfficiency ? lotEfficiency({ element: f.element, ionCharge: f.ionCharge, partAreaDm2: lot.part.areaDm2, measuredMeanUm: s.mean, runs: lot.runs }) : null;
  const tank = eff?.ok ? lot.runs.find((r) => r.tankId === eff.tankId) : undefined;
  const unit = unitInfo(displayUnit('thickness', units)).symbol;
  const remaining = Math.max(t.sample.sampleSize - t.partsMeasured, 1);
  const firstPart = lot.readings.reduce((m, r) => Math.max(m, r.partNo), 0) + 1;
  const table = (readings: LotRecord['readings']) => <ReadingsTable readings={readings} q={q} tz={tz} workOrderId={lot.order.id} canVoid={canVoid && open} />;
  return (
    <Card
      title="Thickness"
      description={`${f.specText || f.name}: minimum ${q(f.minThicknessUm)} on significant surfaces${f.maxThicknessUm ? `, maximum ${q(f.maxThicknessUm)}` : ''}.`}
    >
      <div className="flex flex-col gap-4">
        <p className="text-sm">
          <strong className="text-lg tabular">Measure {t.sample.sampleSize} parts</strong>{' '}
          {t.sample.inspectAll ? `(every part of the lot of ${t.sample.lotSize.toLocaleString('en-US')})` : `from the lot of ${t.sample.lotSize.toLocaleString('en-US')} (code letter ${t.sample.codeLetter})`} ·{' '}
          <span className="text-ink-muted">
            {t.sample.planName} — {t.sample.source}
          </span>
        </p>
        <div className="flex flex-wrap gap-2">
          <StatusBadge status={t.count.ok ? 'ok' : 'none'} label={`${t.partsMeasured} of ${t.sample.sampleSize} parts measured`} />
          {lot.readings.length ? <StatusBadge status={t.pass.ok ? 'ok' : 'out'} label={t.pass.ok ? 'Readings conform' : `${t.unresolved.length} failing`} /> : null}
        </div>
        {s ? (
          <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-5">
            {[
              ['Readings', String(s.count)],
              ['Mean', q(s.mean)],
              ['Minimum', q(s.min)],
              ['Maximum', q(s.max)],
              ['Std deviation', s.stdDev === null ? '— (one reading)' : q(s.stdDev)],
            ].map(([k, v]) => (
              <div key={k}>
                <dt className="text-ink-muted">{k}</dt>
                <dd className="text-base font-semibold tabular">{v}</dd>
              </div>
            ))}
          </dl>
        ) : null}
        {eff?.ok ? (
          <p className="text-sm">
            Predicted from {eff.ampHours.toFixed(1)} A·h over {formatStoredQuantity(eff.areaDm2, 'area', units)}: average {q(eff.predictedUm)}; measured mean{' '}
            {eff.ratioToPredicted !== null ? `${(eff.ratioToPredicted * 100).toFixed(0)} % of that` : q(s?.mean)}. Current efficiency measured in {tank?.tankCode}:{' '}
            <strong>{pct(eff.efficiency)}</strong>. Readings on the thinnest surfaces make this a low estimate.
          </p>
        ) : eff ? (
          <p className="text-sm text-ink-muted">Current efficiency not computed: {eff.reason}</p>
        ) : null}
        {lot.readings.length > SHOW_OPEN ? (
          <details className="rounded-md border border-surface-line p-3">
            <summary className="cursor-pointer font-medium">
              All {lot.readings.length} readings{t.failing.length ? ` (${t.failing.length} failing, listed below)` : ''}
            </summary>
            <div className="pt-2">{table(lot.readings)}</div>
          </details>
        ) : null}
        {lot.readings.length > SHOW_OPEN && t.failing.length ? table(t.failing) : null}
        {lot.readings.length && lot.readings.length <= SHOW_OPEN ? table(lot.readings) : null}
        {lot.voidedReadingCount ? <p className="text-xs text-ink-muted">{lot.voidedReadingCount} void readings are kept on record and not counted.</p> : null}
        {canRecord && open ? (
          <>
            {/* Not folded away: the save message must stay in view after the page refreshes. */}
            <section aria-label="Enter readings by hand" className="rounded-md border border-surface-line p-3">
              <h3 className="font-medium">Enter readings by hand</h3>
              <div className="pt-3">
                <ReadingsForm workOrderId={lot.order.id} firstPartNo={firstPart} rows={remaining} unit={unit} minimumText={q(f.minThicknessUm)} defaultMethod={lotFamily(lot).family.thicknessMethod ?? 'B499'} />
              </div>
            </section>
            <details className="rounded-md border border-surface-line p-3">
              <summary className="cursor-pointer font-medium">Upload an instrument's CSV</summary>
              <div className="pt-3">
                <CsvForm workOrderId={lot.order.id} />
              </div>
            </details>
          </>
        ) : null}
      </div>
    </Card>
  );
}
