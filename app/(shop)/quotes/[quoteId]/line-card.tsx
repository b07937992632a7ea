import type { ReactNode } from 'react';
import { Money } from '@/components/money';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import type { UnitSystem } from '@/lib/plating';
import { BASIS_LABELS } from '@/lib/quotes/basis';
import { formatDateTime, formatUnitPrice } from '@/lib/quotes/format';
import type { QuoteLineView } from '@/lib/quotes/queries';
import { CostBuildUp } from './cost-build-up';
import { OverrideForm } from './override-form';

type Props = { line: QuoteLineView; units: UnitSystem; actions: ReactNode; overrideQuoteId: string | null };

export function QuoteLineCard({ line, units, actions, overrideQuoteId }: Props) {
  return (
    <Card
      headingLevel={2}
      title={
        <span>
          Line {line.lineNo}: <span className="font-mono">{line.partNumber}</span>
          {line.partRevision ? ` rev ${line.partRevision}` : ''} × {line.quantity.toLocaleString('en-US')} · {line.finishCode}
        </span>
      }
      description={`${line.partDescription} · ${line.finishName}${line.specText ? ` · ${line.specText}` : ''} · tank ${line.calculation.tankCode}`}
      actions={
        <div className="text-right">
          <Money cents={line.totalCents} className="text-lg font-semibold" />
          <div className="text-xs text-ink-muted">
            {formatUnitPrice(line.unitPriceCents)} {BASIS_LABELS[line.basis]}
          </div>
        </div>
      }
    >
      <div className="flex flex-col gap-3">
        {line.override ? (
          <p className="flex flex-wrap items-center gap-2 rounded-md bg-copper-soft px-3 py-2 text-sm">
            <Badge tone="copper">Price overridden</Badge>
            <span>
              Computed <Money cents={line.computedTotalCents} />, set to <Money cents={line.override.cents} /> by {line.override.by ?? '—'} on{' '}
              {formatDateTime(line.override.at)}: “{line.override.reason}”
            </span>
          </p>
        ) : null}
        <CostBuildUp price={line.cost} units={units} quantity={line.quantity} caption={`Cost build-up of line ${line.lineNo}`} />
        {overrideQuoteId || actions ? (
          <div className="flex flex-wrap items-start gap-2 border-t border-surface-line pt-3">
            {overrideQuoteId ? <OverrideForm quoteId={overrideQuoteId} lineId={line.id} lineNo={line.lineNo} /> : null}
            {actions}
          </div>
        ) : null}
      </div>
    </Card>
  );
}
