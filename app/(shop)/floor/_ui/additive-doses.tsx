'use client';

import { Button } from '@/components/ui/button';
import { roundForDisplay, toDisplay } from '@/lib/bath/display';
import type { UnitSystem } from '@/lib/plating/units';

export type { DoseRow } from '@/lib/bath/dose-rows';
import type { DoseRow } from '@/lib/bath/dose-rows';

/** kA·h since each additive was last added and the dose its rate per kA·h calls for. */
export function AdditiveDoses({ doses, system, onRecord }: { doses: DoseRow[]; system: UnitSystem; onRecord?: (d: DoseRow) => void }) {
  if (doses.length === 0) return null;
  return (
    <section aria-label="Additives due by amp-hours" className="flex flex-col gap-2">
      <h2 className="text-lg font-semibold text-ink">Additives by amp-hours</h2>
      <ul className="flex flex-col gap-2">
        {doses.map((d) => {
          const dose = toDisplay(d.doseL, 'L', system);
          return (
            <li key={d.analyteId} className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-surface-line bg-surface px-3 py-2" data-testid="additive-dose">
              <div className="flex flex-col">
                <span className="text-base font-semibold text-ink">{d.material}</span>
                <span className="text-sm text-ink-muted tabular">
                  {roundForDisplay(d.kiloAmpHours, 3)} kA·h since the last addition × {d.rateMlPerKAh} mL/kA·h
                  {d.complete ? '' : ' (no meter reading before the last addition: at least this much)'}
                </span>
                <span className="text-lg font-semibold tabular text-ink">
                  Add {roundForDisplay(dose.value, 3)} {dose.unit}
                </span>
              </div>
              {onRecord && d.doseL > 0 ? (
                <Button size="lg" variant="secondary" onClick={() => onRecord(d)}>
                  Record this dose
                </Button>
              ) : null}
            </li>
          );
        })}
      </ul>
      <p className="text-sm text-ink-muted">Rates are typical; the additive supplier&apos;s data sheet governs.</p>
    </section>
  );
}
