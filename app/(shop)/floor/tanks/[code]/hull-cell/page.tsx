import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { randomUUID } from 'node:crypto';
import { BathCaution } from '@/components/bath/bath-caution';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { getFloorTank } from '@/lib/bath/floor-queries';
import { HullCellForm } from './hull-cell-form';

export const metadata: Metadata = { title: 'Hull cell panel' };

export default async function FloorHullCellPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  await requirePageUser('bath.log', `/floor/tanks/${code}/hull-cell`);
  const tank = await getFloorTank({ code });
  if (!tank) notFound();
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-5">
      <PageHeader eyebrow={<Link href={`/floor/tanks/${tank.code}`} className="text-action underline">{tank.code} · {tank.name}</Link>} title="Hull cell panel" />
      <BathCaution hazards={tank.hazards} compact />
      <HullCellForm tankId={tank.id} tankCode={tank.code} entryKey={`hull-${randomUUID()}`} />
    </div>
  );
}
