import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { BathCaution } from '@/components/bath/bath-caution';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { doseRows } from '@/lib/bath/dose-rows';
import { getFloorTank } from '@/lib/bath/floor-queries';
import { findAdditiveDoses } from '@/lib/bath/history';
import { supplyMaterial } from '@/lib/bath/templates/supplies';
import { OutboxPanel } from '../../../_ui/outbox-panel';
import { AdditionPage } from './addition-page';

export const metadata: Metadata = { title: 'Record an addition' };

export default async function FloorAdditionPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const user = await requirePageUser('bath.log', `/floor/tanks/${code}/addition`);
  const tank = await getFloorTank({ code });
  if (!tank) notFound();
  const { doses } = await findAdditiveDoses(tank.id);
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-5">
      <PageHeader eyebrow={<Link href={`/floor/tanks/${tank.code}`} className="text-action underline">{tank.code} · {tank.name}</Link>} title="Record an addition" />
      <OutboxPanel />
      <BathCaution hazards={tank.hazards} compact />
      <AdditionPage
        tank={{ id: tank.id, code: tank.code }}
        analytes={tank.analytes.map((a) => ({ id: a.id, name: a.name, material: a.supply ? supplyMaterial(a.supply) : null }))}
        doses={doseRows(doses, tank.analytes)}
        system={user.unitSystem}
      />
    </div>
  );
}
