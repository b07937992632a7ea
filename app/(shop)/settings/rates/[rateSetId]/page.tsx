import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { rateFormDefaults } from '@/lib/rates/form-defaults';
import { databaseToday, findRateSets } from '@/lib/rates/queries';
import { RateForm } from '../rate-form';

export const metadata: Metadata = { title: 'Rate set' };

export default async function RateSetPage({ params, searchParams }: { params: Promise<{ rateSetId: string }>; searchParams: Promise<{ saved?: string }> }) {
  const { rateSetId } = await params;
  await requirePageUser('rates.manage', `/settings/rates/${rateSetId}`);
  const today = await databaseToday();
  const set = (await findRateSets(today)).find((s) => s.id === rateSetId);
  if (!set) notFound();
  const { saved } = await searchParams;
  const editable = set.status === 'scheduled';
  return (
    <div className="flex flex-col gap-4">
      <PageHeader eyebrow={<Link href="/settings/rates">← Rates</Link>} title={`Rates from ${set.effective_day}`} meta={<Badge tone={editable ? 'copper' : 'outline'}>{set.status}</Badge>} />
      {saved ? <FormMessage tone="success" message="Rate set added." /> : null}
      {editable ? null : <FormMessage tone="info" message="This set has taken effect, so it is read-only: quotes were priced with it. To change rates, add a new set from a later date." />}
      <Card>
        <RateForm defaults={rateFormDefaults(set)} readOnly={!editable} submitLabel="Save rate set" />
      </Card>
    </div>
  );
}
