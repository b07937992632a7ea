import type { Metadata } from 'next';
import { ControlChart } from '@/components/control-chart/control-chart';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { individualsChart } from '@/lib/bath/spc';
import { formatStoredQuantity } from '@/lib/plating';
import { findEfficiencySeries } from '@/lib/quality/queries';
import { shopTimeZone } from '@/lib/quality/shop-time';

export const metadata: Metadata = { title: 'Current efficiency' };

const pct = (x: number) => Math.round(x * 1000) / 10;

export default async function EfficiencyPage() {
  const user = await requirePageUser('quality.read', '/quality/efficiency');
  const { series, skipped } = await findEfficiencySeries();
  const tz = shopTimeZone();
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title="Current efficiency, measured"
        description="For each tank and finish: the measured mean thickness of each inspected lot against what its amp-hours would deposit at 100 %, so the share of the current that became metal. Compare it with the efficiency used for quoting."
      />
      {skipped ? <p className="text-sm text-ink-muted">{skipped} lots with readings are left out: plated in more than one tank, or without a run in a tank of the finish&apos;s metal.</p> : null}
      {series.length === 0 ? (
        <EmptyState title="No measured lots yet" description="Record thickness readings on a plated lot; its measured efficiency appears here under its tank and finish." />
      ) : (
        series.map((s) => {
          const values = s.points.map((p) => pct(p.efficiency));
          let chart: ReturnType<typeof individualsChart> | null = null;
          try {
            chart = values.length >= 2 ? individualsChart(values) : null;
          } catch {
            chart = null; // every value equal: no spread to draw limits from
          }
          return (
            <Card
              key={`${s.tankId}${s.finishCode}`}
              title={`${s.tankCode} ${s.tankName} · ${s.finishCode}`}
              description={`${s.finishName}. ${s.points.length} ${s.points.length === 1 ? 'lot' : 'lots'}. Efficiency used for quoting: ${s.assumedEfficiency === null ? 'not set' : `${pct(s.assumedEfficiency)} %`}.${chart ? ` Mean measured ${chart.centre.toFixed(1)} %.` : ''}`}
            >
              {chart ? (
                <ControlChart
                  points={s.points.map((p, i) => ({ t: p.t, value: values[i]!, rules: chart!.points[i]!.rules }))}
                  cl={chart.centre}
                  ucl={chart.ucl}
                  lcl={chart.lcl}
                  unit="%"
                  label="Current efficiency"
                  digits={1}
                  height={260}
                  timeZone={tz}
                />
              ) : (
                <ul className="text-sm">
                  {s.points.map((p) => (
                    <li key={p.workOrderNumber} className="tabular">
                      {p.workOrderNumber}: {pct(p.efficiency)} % (measured mean {formatStoredQuantity(p.measuredMeanUm, 'thickness', user.unitSystem)})
                    </li>
                  ))}
                  <li className="text-ink-muted">A chart needs two lots with different results.</li>
                </ul>
              )}
            </Card>
          );
        })
      )}
    </div>
  );
}
