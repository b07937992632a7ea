import { Money } from '@/components/money';
import { SimpleTable } from '@/components/ui/simple-table';
import { Td, Tr } from '@/components/ui/table';
import { formatNumber, formatStoredQuantity, type UnitSystem } from '@/lib/plating';
import { BASIS_LABELS } from '@/lib/quotes/basis';
import { componentFigures } from '@/lib/quotes/display';
import { formatUnitPrice } from '@/lib/quotes/format';
import type { LinePrice } from '@/lib/quotes/pricing';
import { FamilyFigures } from '@/components/family-figures/family-figures';
import { getFamily } from '@/lib/families';

/** The line's cost, cost by cost, then margin, charges and the price: what the estimator checks. */
export function CostBuildUp({ price, units, caption, quantity }: { price: LinePrice; units: UnitSystem; caption: string; quantity: number }) {
  const j = price.job;
  // A load smaller than the rectifier allows is only "limited" when the lot needs more than one load.
  const perLoad = Math.min(j.partsPerLoad, quantity);
  // Lines priced before families existed are electroplating.
  const plating = (price.family ?? 'electroplating') === 'electroplating';
  return (
    <div className="flex flex-col gap-3">
      <SimpleTable
        dense
        caption={caption}
        rows={price.components.map((c) => ({ ...c, figures: componentFigures(c, units) }))}
        rowKey={(c) => c.key}
        columns={[
          { header: 'Cost', cell: (c) => c.label },
          { header: 'Quantity', numeric: true, cell: (c) => c.figures.quantity },
          { header: 'Rate', numeric: true, cell: (c) => c.figures.rate },
          { header: 'Amount', numeric: true, cell: (c) => <Money cents={c.cents} /> },
        ]}
        extraRows={
          <>
            <Tr>
              <Td className="font-medium">Subtotal (cost)</Td>
              <Td />
              <Td />
              <Td numeric className="font-medium">
                <Money cents={price.subtotalCents} />
              </Td>
            </Tr>
            <Tr>
              <Td>Margin</Td>
              <Td />
              <Td numeric>{price.marginPct} %</Td>
              <Td numeric>
                <Money cents={price.marginCents} />
              </Td>
            </Tr>
            <Tr>
              <Td>Lot charge</Td>
              <Td />
              <Td />
              <Td numeric>
                <Money cents={price.lotChargeCents} />
              </Td>
            </Tr>
            <Tr>
              <Td>Minimum charge</Td>
              <Td />
              <Td numeric>
                <Money cents={price.minimumChargeCents} />
              </Td>
              <Td numeric>{price.minimumApplied ? <>raised to <Money cents={price.minimumChargeCents} /></> : 'not reached'}</Td>
            </Tr>
            {price.rushMultiplierPct !== 100 ? (
              <Tr>
                <Td>Rush</Td>
                <Td />
                <Td numeric>× {price.rushMultiplierPct} %</Td>
                <Td numeric>
                  <Money cents={price.rushCents} />
                </Td>
              </Tr>
            ) : null}
          </>
        }
        footer={
          <tr>
            <Td>Computed line total</Td>
            <Td numeric>{formatUnitPrice(price.perPieceCents)} per piece</Td>
            <Td numeric>{price.basis === 'piece' ? '' : `${formatUnitPrice(price.unitPriceCents)} ${BASIS_LABELS[price.basis]}`}</Td>
            <Td numeric>
              <Money cents={price.totalCents} />
            </Td>
          </tr>
        }
      />
      {price.figures?.length ? <FamilyFigures figures={price.figures} units={units} label={`${getFamily(price.family).label} figures`} /> : null}
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-xs text-ink-muted sm:grid-cols-4">
        <div>
          <dt>Loads</dt>
          <dd className="tabular text-ink">
            {j.loads} × {perLoad} pc{j.loadLimitedBy === 'rectifier' && quantity > j.partsPerLoad ? ' (rectifier-limited)' : ''}
          </dd>
        </div>
        {plating ? (
        <div>
          <dt>Average / minimum thickness</dt>
          <dd className="tabular text-ink">
            {formatStoredQuantity(j.averageThicknessUm, 'thickness', units)} / {formatStoredQuantity(j.minimumThicknessUm, 'thickness', units)}
          </dd>
        </div>
        ) : null}
        {j.ampHours > 0 ? (
        <div>
          <dt>Charge</dt>
          <dd className="tabular text-ink">{formatNumber(j.ampHours, 4)} A·h</dd>
        </div>
        ) : null}
        <div>
          <dt>Time per load / tank time</dt>
          <dd className="tabular text-ink">
            {formatNumber(j.minutesPerLoad, 3)} min / {formatNumber(j.tankHours, 3)} h
          </dd>
        </div>
        <div>
          <dt>{plating ? 'Plated area' : 'Area treated'}</dt>
          <dd className="tabular text-ink">{formatStoredQuantity(j.areaPerLotDm2, 'area', units)}</dd>
        </div>
        {plating ? (
        <div>
          <dt>Distribution ratio</dt>
          <dd className="tabular text-ink">{formatNumber(j.distributionRatio, 3)} (minimum ÷ average)</dd>
        </div>
        ) : null}
        <div>
          <dt>Bake</dt>
          <dd className="text-ink">{price.bake.applies ? price.bake.reason : 'Not required'}</dd>
        </div>
      </dl>
    </div>
  );
}
