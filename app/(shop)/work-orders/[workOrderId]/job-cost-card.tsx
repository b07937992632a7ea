import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { SimpleTable } from '@/components/ui/simple-table';
import { Td } from '@/components/ui/table';
import type { CostComparison } from '@/lib/orders/costing';

/** Quoted cost beside the cost of the runs actually logged, and the margin that leaves. */
export function JobCostCard({ c, hasRuns }: { c: CostComparison; hasRuns: boolean }) {
  return (
    <Card
      title="Job cost"
      description={hasRuns ? 'Actual cost from the plating runs (amp-hours, tank time, loads) at the rates the quote used; masking and bake follow the received quantity and loads.' : 'No runs logged yet: the actual column fills in as runs are logged.'}
      padding="none"
    >
      <SimpleTable
        dense
        caption="Quoted and actual cost"
        rows={c.rows}
        rowKey={(r) => r.key}
        columns={[
          { header: 'Cost', cell: (r) => r.label },
          { header: 'Quoted', numeric: true, cell: (r) => <Money cents={r.quotedCents} /> },
          { header: 'Actual', numeric: true, cell: (r) => <Money cents={r.actualCents} /> },
          { header: 'Difference', numeric: true, cell: (r) => <Money cents={r.actualCents - r.quotedCents} accounting /> },
        ]}
        footer={
          <>
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
          </>
        }
      />
    </Card>
  );
}
