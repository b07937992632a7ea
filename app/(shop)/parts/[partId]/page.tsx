import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { Caution } from '@/components/ui/caution';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { findCustomerOptions } from '@/lib/customers/queries';
import { formatArea, formatWeight } from '@/lib/parts/display';
import { mayNeedReliefBake, RELIEF_BAKE_CAUTION } from '@/lib/parts/embrittlement';
import { partFormDefaults } from '@/lib/parts/form-defaults';
import { getPart } from '@/lib/parts/queries';
import { SUBSTRATES, type SubstrateId } from '@/lib/plating';
import { PartForm } from '../part-form';

export const metadata: Metadata = { title: 'Part' };

export default async function PartPage({ params, searchParams }: { params: Promise<{ partId: string }>; searchParams: Promise<{ saved?: string }> }) {
  const { partId } = await params;
  const user = await requirePageUser('customers.read', `/parts/${partId}`);
  const part = await getPart(partId);
  if (!part) notFound();
  const { saved } = await searchParams;
  const mayWrite = can(user, 'customers.write');
  const customers = mayWrite ? await findCustomerOptions() : [];
  const bake = mayNeedReliefBake({ hardnessHrc: part.hardness_hrc, tensileMpa: part.tensile_mpa });
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <>
            <Link href="/parts">← Parts</Link> · <Link href={`/customers/${part.customer_id}`}>{part.customer_name}</Link>
          </>
        }
        title={`${part.part_number}${part.revision ? ` rev ${part.revision}` : ''}`}
        meta={<Badge tone="outline">{SUBSTRATES[part.substrate as SubstrateId]?.name ?? part.substrate}</Badge>}
        description={part.description || undefined}
      />
      {saved ? <FormMessage tone="success" message="Part added." /> : null}
      {bake && !mayWrite ? <Caution kind="high-strength-steel-bake">{RELIEF_BAKE_CAUTION}</Caution> : null}
      <Card title="Summary">
        <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[12rem_1fr]">
          <dt className="text-ink-muted">Area per part</dt>
          <dd className="tabular font-semibold" data-testid="part-area">{formatArea(part.area_dm2, user.unitSystem)}</dd>
          <dt className="text-ink-muted">Weight per part</dt>
          <dd className="tabular">{part.weight_g ? formatWeight(part.weight_g, user.unitSystem) : '—'}</dd>
          <dt className="text-ink-muted">Hardness / tensile</dt>
          <dd className="tabular">
            {part.hardness_hrc ?? '—'} HRC / {part.tensile_mpa ?? '—'} MPa
          </dd>
          <dt className="text-ink-muted">Drawing</dt>
          <dd>{part.drawing_file_id ? <a href={`/api/files/${part.drawing_file_id}?inline=1`}>{part.drawing_name}</a> : '—'}</dd>
          <dt className="text-ink-muted">STL model</dt>
          <dd>{part.stl_file_id ? <a href={`/api/files/${part.stl_file_id}`}>{part.stl_name}</a> : '—'}</dd>
        </dl>
      </Card>
      {mayWrite ? (
        <Card title="Edit">
          <PartForm defaults={partFormDefaults(part, user.unitSystem)} customers={customers} unitSystem={user.unitSystem} />
        </Card>
      ) : null}
    </div>
  );
}
