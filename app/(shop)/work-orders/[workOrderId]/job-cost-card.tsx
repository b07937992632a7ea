import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { Table, TBody, TFoot, Td, Th, THead, Tr } from '@/components/ui/table';
import type { CostComparison } from '@/lib/orders/costing';

/** Quoted cost beside the cost of the runs actually logged, and the margin that leaves. */
export function JobCostCard({ c, hasRuns }: { c: CostComparison; hasRuns: boolean }) {
  return (
    <Card
      title="Job cost"
      description={hasRuns ? 'Actual cost from the plating runs (amp-hours, tank time, loads) at the rates the quote used; masking and bake follow the received quantity and loads.' : 'No runs logged yet: the actual column fills in as runs are logged.'}
      padding="none"
    >
      <Table dense caption="Quoted and actual cost" captionHidden>
        <THead>
          <tr>
            <Th>Cost</Th>
            <Th numeric>Quoted</Th>
            <Th numeric>Actual</Th>
            <Th numeric>Difference</Th>
          </tr>
        </THead>
        <TBody>
          {c.rows.map((r) => (
            <Tr key={r.key}>
              <Td>{r.label}</Td>
              <Td numeric>
                <Money cents={r.quotedCents} />
              </Td>
              <Td numeric>
                <Money cents={r.actualCents} />
              </Td>
              <Td numeric>
                <Money cents={r.actualCents - r.quotedCents} accounting />
              </Td>
            </Tr>
          ))}
        </TBody>
        <TFoot>
          <tr>
            <Td>Cost</Td>
            <Td numeric>
              <Money cents={c.quotedCostCents} />
            </Td>
            <Td numeric>
              <Money cents={c.actualCostCents} />
            </Td>
            <Td numeric>
              <Money cents={c.varianceCents} accounting />
            </Td>
          </tr>
          <tr>
            <Td>Margin on the price of <Money cents={c.priceCents} /></Td>
            <Td numeric>
              <Money cents={c.quotedMarginCents} accounting />
            </Td>
            <Td numeric>
              <Money cents={c.realisedMarginCents} accounting />
            </Td>
            <Td numeric>{c.realisedMarginPct === null ? '—' : `${c.realisedMarginPct} % realised`}</Td>
          </tr>
        </TFoot>
      </Table>
    </Card>
  );
}
