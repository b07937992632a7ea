import type { Metadata } from 'next';
import Link from 'next/link';
import { Money } from '@/components/money';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { LinkTabs } from '@/components/ui/tabs';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { findCostedOrders } from '@/lib/orders/job-cost';
import { groupVariance, type VarianceGrouping } from '@/lib/orders/variance';
import { formatDay } from '@/lib/quotes/format';
import { VarianceChart } from './variance-chart';

export const metadata: Metadata = { title: 'Job costs' };

const GROUPS: Record<VarianceGrouping, string> = { customer: 'customer', finish: 'finish', month: 'month' };
const DAY = /^\d{4}-\d{2}-\d{2}$/;

export default async function JobCostsPage({ searchParams }: { searchParams: Promise<{ by?: string; from?: string; to?: string }> }) {
  await requirePageUser('reports.read', '/reports/job-costs');
  const sp = await searchParams;
  const by: VarianceGrouping = sp.by === 'finish' || sp.by === 'month' ? sp.by : 'customer';
  const today = new Date();
  const to = sp.to && DAY.test(sp.to) ? sp.to : today.toISOString().slice(0, 10);
  const from = sp.from && DAY.test(sp.from) ? sp.from : new Date(today.getTime() - 365 * 86_400_000).toISOString().slice(0, 10);
  const rows = await findCostedOrders({ from, to });
  const groups = groupVariance(rows, by);
  const q = (b: VarianceGrouping) => `/reports/job-costs?by=${b}&from=${from}&to=${to}`;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title="Job costs"
        description={`Quoted against actual cost of plated work orders whose runs ended between ${formatDay(from)} and ${formatDay(to)}. Actual cost comes from the logged runs at the rates each quote used; variance is actual less quoted cost, so a positive variance cost more than quoted.`}
      />
      <form className="flex flex-wrap items-end gap-3 text-sm" method="get">
        <input type="hidden" name="by" value={by} />
        <label className="flex flex-col gap-1">
          From
          <input type="date" name="from" defaultValue={from} className="min-h-10 rounded-md border border-surface-line px-2" />
        </label>
        <label className="flex flex-col gap-1">
          To
          <input type="date" name="to" defaultValue={to} className="min-h-10 rounded-md border border-surface-line px-2" />
        </label>
        <button type="submit" className="min-h-10 rounded-md border border-surface-line px-4 font-medium">
          Show
        </button>
      </form>
      <LinkTabs label="Group by" items={(Object.keys(GROUPS) as VarianceGrouping[]).map((g) => ({ href: q(g), label: `By ${GROUPS[g]}` }))} currentPath={q(by)} />
      {groups.length === 0 ? (
        <EmptyState title="No costed jobs in this period" description="Work orders appear here once they are plated and their runs are logged." />
      ) : (
        <>
          <Card>
            <VarianceChart groupLabel={GROUPS[by]} data={groups.map((g) => ({ key: g.key, quoted: g.quotedCostCents, actual: g.actualCostCents, price: g.priceCents }))} />
          </Card>
          <Card padding="none" title={`By ${GROUPS[by]}`}>
            <Table caption={`Job-cost variance by ${GROUPS[by]}`} captionHidden>
              <THead>
                <tr>
                  <Th>{GROUPS[by][0]?.toUpperCase() + GROUPS[by].slice(1)}</Th>
                  <Th numeric>Orders</Th>
                  <Th numeric>Price</Th>
                  <Th numeric>Quoted cost</Th>
                  <Th numeric>Actual cost</Th>
                  <Th numeric>Variance</Th>
                  <Th numeric>Realised margin</Th>
                </tr>
              </THead>
              <TBody>
                {groups.map((g) => (
                  <Tr key={g.key}>
                    <Td>{g.key}</Td>
                    <Td numeric>{g.orders}</Td>
                    <Td numeric><Money cents={g.priceCents} /></Td>
                    <Td numeric><Money cents={g.quotedCostCents} /></Td>
                    <Td numeric><Money cents={g.actualCostCents} /></Td>
                    <Td numeric><Money cents={g.varianceCents} accounting /></Td>
                    <Td numeric>
                      <Money cents={g.realisedMarginCents} accounting /> {g.realisedMarginPct === null ? '' : `(${g.realisedMarginPct} %)`}
                    </Td>
                  </Tr>
                ))}
              </TBody>
            </Table>
          </Card>
          <Card padding="none" title="Work orders in this period">
            <Table dense caption="Costed work orders" captionHidden>
              <THead>
                <tr>
                  <Th>Work order</Th>
                  <Th>Customer</Th>
                  <Th>Finish</Th>
                  <Th>Month</Th>
                  <Th numeric>Quoted cost</Th>
                  <Th numeric>Actual cost</Th>
                  <Th numeric>Variance</Th>
                  <Th numeric>Realised margin</Th>
                </tr>
              </THead>
              <TBody>
                {rows.map((r) => (
                  <Tr key={r.workOrderId}>
                    <Td><Link href={`/work-orders/${r.workOrderId}`} className="font-mono">{r.number}</Link></Td>
                    <Td>{r.customer}</Td>
                    <Td>{r.finish}</Td>
                    <Td>{r.month}</Td>
                    <Td numeric><Money cents={r.comparison.quotedCostCents} /></Td>
                    <Td numeric><Money cents={r.comparison.actualCostCents} /></Td>
                    <Td numeric><Money cents={r.comparison.varianceCents} accounting /></Td>
                    <Td numeric>{r.comparison.realisedMarginPct === null ? '—' : `${r.comparison.realisedMarginPct} %`}</Td>
                  </Tr>
                ))}
              </TBody>
            </Table>
          </Card>
        </>
      )}
    </div>
  );
}
