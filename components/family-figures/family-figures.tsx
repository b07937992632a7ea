import { formatNumber, formatStoredQuantity, type UnitSystem } from '@/lib/plating';
import type { FamilyFigure } from '@/lib/quotes/pricing';

/** One figure in the reader's units: a quantity converted, a counted unit as it is, or words. */
export function figureText(f: FamilyFigure, units: UnitSystem): string {
  if (typeof f.value === 'string') return f.value;
  if (f.quantity) return `${formatStoredQuantity(f.value, f.quantity, units)}${f.perHour ? '/h' : ''}`;
  const n = f.digits === undefined ? formatNumber(f.value, 4) : f.value.toLocaleString('en-US', { maximumFractionDigits: f.digits, minimumFractionDigits: f.digits });
  return `${n}${f.unit ? ` ${f.unit}` : ''}`;
}

/** A process family's own figures beside a price: the quote line, the workbench, the portal. */
export function FamilyFigures({ figures, units, label }: { figures: readonly FamilyFigure[]; units: UnitSystem; label: string }) {
  if (figures.length === 0) return null;
  return (
    <dl aria-label={label} className="grid grid-cols-1 gap-x-4 gap-y-1 text-xs text-ink-muted sm:grid-cols-2 lg:grid-cols-3">
      {figures.map((f) => (
        <div key={f.key}>
          <dt>{f.label}</dt>
          <dd className="tabular text-ink">
            {figureText(f, units)}
            {f.warning ? (
              <span role="note" className="ml-1 font-medium text-out">
                ▲ {f.warning}
              </span>
            ) : null}
          </dd>
        </div>
      ))}
    </dl>
  );
}
