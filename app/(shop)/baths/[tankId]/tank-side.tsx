import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import type { DoseRow } from '@/lib/bath/dose-rows';
import type { findHullCellPanels } from '@/lib/bath/history';
import type { findLimitChanges } from '@/lib/bath/limits';
import { formatWhen } from '@/lib/bath/display';
import type { UnitSystem } from '@/lib/plating/units';
import { AdditiveDoses } from '../../floor/_ui/additive-doses';


type Props = {
  system: UnitSystem;
  doses: DoseRow[];
  lastReading: { at: Date; ampHours: number } | null;
  panels: Awaited<ReturnType<typeof findHullCellPanels>>;
  changes: Awaited<ReturnType<typeof findLimitChanges>>;
  analyteNames: Map<string, string>;
};

const LIMIT_LABEL: Record<string, string> = {
  target: 'target',
  lower_control: 'LCL',
  upper_control: 'UCL',
  lower_spec: 'LSL',
  upper_spec: 'USL',
  frequency_hours: 'every (h)',
};

function diff(before: Record<string, number | null>, after: Record<string, number | null>): string {
  return Object.keys(LIMIT_LABEL)
    .filter((k) => before[k] !== after[k])
    .map((k) => `${LIMIT_LABEL[k]} ${before[k] ?? '—'} → ${after[k] ?? '—'}`)
    .join(', ');
}

/** Amp-hours and additive doses, Hull cell panels, and who changed which limits, when and why. */
export function TankSide({ system, doses, lastReading, panels, changes, analyteNames }: Props) {
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <Card title="Amp-hours and additives" padding="sm">
        <p className="mb-2 text-sm text-ink-muted">
          {lastReading ? `Meter ${lastReading.ampHours.toLocaleString('en-US')} A·h at ${formatWhen(lastReading.at)}.` : 'No meter readings yet.'}
        </p>
        {doses.length ? <AdditiveDoses doses={doses} system={system} /> : <p className="text-sm text-ink-muted">No additive on this tank is dosed by amp-hours.</p>}
      </Card>
      <Card title="Hull cell panels" padding="sm">
        {panels.length === 0 ? (
          <EmptyState title="No panels yet" description="Record one from the Floor screen, with a photo." />
        ) : (
          <ul className="flex flex-col gap-3">
            {panels.map((p) => (
              <li key={p.id} className="flex gap-3 text-sm">
                {p.file_id ? (
                  <a href={`/api/files/${p.file_id}?inline=1`} className="shrink-0">
                    {/* eslint-disable-next-line @next/next/no-img-element -- bytes come from our own file route */}
                    <img src={`/api/files/${p.file_id}?inline=1`} alt={`Hull cell panel of ${formatWhen(p.made_at)}`} className="h-20 w-28 rounded border border-surface-line object-cover" />
                  </a>
                ) : null}
                <div>
                  <p className="font-medium">
                    {formatWhen(p.made_at)} · {p.current_a} A for {p.minutes} min
                  </p>
                  <p className="text-ink-muted">{p.notes || 'No notes.'}</p>
                  <p className="text-xs text-ink-muted">by {p.made_by_name}</p>
                </div>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <Card title="Limit changes" padding="sm" className="lg:col-span-2">
        {changes.length === 0 ? (
          <p className="text-sm text-ink-muted">The limits are as copied from the bath template.</p>
        ) : (
          <ul className="flex flex-col gap-2 text-sm">
            {changes.map((c) => (
              <li key={c.id}>
                <span className="font-medium">{analyteNames.get(c.analyte_id) ?? 'Analyte'}</span>: {diff(c.before, c.after)}
                <span className="block text-ink-muted">
                  {c.changed_by_name}, {formatWhen(c.created_at)} — “{c.reason}”
                </span>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
