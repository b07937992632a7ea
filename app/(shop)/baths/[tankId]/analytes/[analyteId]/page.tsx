import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { formatBathValue } from '@/components/bath/bath-value';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findAnalyteStatus, getTank, isUuid } from '@/lib/bath/queries';
import { ChartView } from './chart-view';

export const metadata: Metadata = { title: 'Control chart' };

export default async function AnalyteChartPage({ params }: { params: Promise<{ tankId: string; analyteId: string }> }) {
  const { tankId, analyteId } = await params;
  const user = await requirePageUser('bath.read', `/baths/${tankId}/analytes/${analyteId}`);
  const tank = isUuid(analyteId) ? await getTank({ id: tankId }) : null;
  const analyte = tank ? (await findAnalyteStatus([tank.id])).find((a) => a.id === analyteId) : undefined;
  if (!tank || !analyte) notFound();
  const fmt = (v: number | null) => formatBathValue(v, analyte.unit, user.unitSystem);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href={`/baths/${tank.id}`} className="text-action underline">{tank.code} · {tank.name}</Link>}
        title={`${analyte.name}: control chart`}
        description={`Bath sheet: target ${fmt(analyte.target)}, control ${fmt(analyte.lower_control)} – ${fmt(analyte.upper_control)}${analyte.lower_spec !== null || analyte.upper_spec !== null ? `, specification ${fmt(analyte.lower_spec)} – ${fmt(analyte.upper_spec)}` : ''}.`}
      />
      <Card padding="md">
        <ChartView tankId={tank.id} analyteId={analyte.id} />
      </Card>
    </div>
  );
}
