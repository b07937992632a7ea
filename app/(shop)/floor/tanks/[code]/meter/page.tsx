import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { doseRows } from '@/lib/bath/dose-rows';
import { getFloorTank } from '@/lib/bath/floor-queries';
import { findAdditiveDoses } from '@/lib/bath/history';
import { OutboxPanel } from '../../../_ui/outbox-panel';
import { MeterEntry } from './meter-entry';

export const metadata: Metadata = { title: 'Amp-hour meter' };

export default async function FloorMeterPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const user = await requirePageUser('bath.log', `/floor/tanks/${code}/meter`);
  const tank = await getFloorTank({ code });
  if (!tank) notFound();
  const { doses, lastReading } = tank.hasAhMeter ? await findAdditiveDoses(tank.id) : { doses: [], lastReading: null };
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-5">
      <PageHeader eyebrow={<Link href={`/floor/tanks/${tank.code}`} className="text-action underline">{tank.code} · {tank.name}</Link>} title="Amp-hour meter" />
      <OutboxPanel />
      <Caution kind="electrical" compact />
      {tank.hasAhMeter ? (
        <MeterEntry
          tank={{ id: tank.id, code: tank.code }}
          lastReading={lastReading ? { at: lastReading.at.toISOString(), ampHours: lastReading.ampHours } : null}
          doses={doseRows(doses, tank.analytes)}
          system={user.unitSystem}
        />
      ) : (
        <EmptyState title="No amp-hour meter on this tank" description="This tank's rectifier has no amp-hour meter recorded." />
      )}
    </div>
  );
}
