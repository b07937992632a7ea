import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { finishFormDefaults } from '@/lib/finishes/form-defaults';
import { findLineOptions, getFinish } from '@/lib/finishes/queries';
import { FinishForm } from '../finish-form';

export const metadata: Metadata = { title: 'Finish' };

export default async function FinishPage({ params }: { params: Promise<{ finishId: string }> }) {
  const { finishId } = await params;
  const user = await requirePageUser('quotes.read', `/finishes/${finishId}`);
  const finish = await getFinish(finishId);
  if (!finish) notFound();
  const lines = await findLineOptions();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader eyebrow={<Link href="/finishes">← Finishes</Link>} title={finish.name} meta={<Badge tone="outline">{finish.code}</Badge>} description={finish.spec_text || undefined} />
      <Card>
        <FinishForm defaults={finishFormDefaults(finish, user.unitSystem)} lines={lines} readOnly={!can(user, 'quotes.write')} units={user.unitSystem} />
      </Card>
    </div>
  );
}
