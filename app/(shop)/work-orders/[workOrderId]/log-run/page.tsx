import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { familyParams, getFamily } from '@/lib/families';
import { getFamilyData } from '@/lib/families/shop-data-queries';
import { findTanksForFinish, getWorkOrder } from '@/lib/orders/queries';
import { formatStoredQuantity } from '@/lib/plating';
import { RunForm } from './run-form';

export const metadata: Metadata = { title: 'Log a plating run' };

const UUID = /^[0-9a-f-]{36}$/i;

// One task per screen, for a phone at the tank: large targets, the verdict before saving.
export default async function LogRunPage({ params }: { params: Promise<{ workOrderId: string }> }) {
  const { workOrderId } = await params;
  const user = await requirePageUser('runs.log', `/work-orders/${workOrderId}/log-run`);
  const wo = UUID.test(workOrderId) ? await getWorkOrder(workOrderId) : null;
  if (!wo) notFound();
  const tanks = await findTanksForFinish(wo);
  const family = getFamily(wo.family);
  const familyData = await getFamilyData(family.id);
  const open = wo.state === 'received' || wo.state === 'in_process';
  return (
    <div className="mx-auto flex max-w-lg flex-col gap-4">
      <PageHeader
        eyebrow={<Link href={`/work-orders/${wo.id}`}>{wo.number}</Link>}
        title={family.runsWithCurrent ? 'Log a plating run' : `Log a ${family.label.toLowerCase()} run`}
        description={`${wo.part_number} · ${wo.finish_code}${family.makesCoating ? ` · minimum ${formatStoredQuantity(wo.min_thickness_um, 'thickness', user.unitSystem)}` : wo.spec_text ? ` · ${wo.spec_text}` : ''}`}
      />
      <Caution kind={[...new Set([...family.cautions(familyParams(family.id, wo.family_params)), ...(family.runsWithCurrent ? (['hydrogen'] as const) : [])])]} />
      {!open ? (
        <EmptyState title="Runs cannot be logged now" description={wo.state === 'accepted' ? 'Receive the parts first.' : 'Plating is finished on this order.'} action={<Link href={`/work-orders/${wo.id}`}>Back to the order</Link>} />
      ) : tanks.length === 0 ? (
        <EmptyState title="No tank runs this finish" description={`No active ${family.label.toLowerCase()} tank runs this finish${family.usesEfficiency ? ' with a known efficiency' : ''}. A supervisor can activate one.`} />
      ) : (
        <RunForm
          workOrderId={wo.id}
          units={user.unitSystem}
          tanks={tanks.map((t) => ({ id: t.id, code: t.code, name: t.name, efficiency: t.efficiency, rectifierMaxA: t.rectifierMaxA, hasAhMeter: t.hasAhMeter, settings: t.familySettings }))}
          familyData={familyData}
          finish={{
            family: family.id, params: familyParams(family.id, wo.family_params), element: wo.element, ionCharge: wo.ion_charge, distributionRatio: wo.distribution_ratio,
            minThicknessUm: wo.min_thickness_um, areaPerPartDm2: wo.area_dm2, partsPerLoad: Math.min(wo.parts_per_load, wo.quantity_received || wo.quantity_ordered),
          }}
        />
      )}
    </div>
  );
}
