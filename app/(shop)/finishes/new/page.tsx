import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { finishFormDefaults } from '@/lib/finishes/form-defaults';
import { findLineOptions } from '@/lib/finishes/queries';
import { FinishForm } from '../finish-form';

export const metadata: Metadata = { title: 'New finish' };

export default async function NewFinishPage() {
  const user = await requirePageUser('quotes.write', '/finishes/new');
  const lines = await findLineOptions();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader eyebrow={<Link href="/finishes">← Finishes</Link>} title="New finish" />
      <Card>
        <FinishForm defaults={finishFormDefaults(null, user.unitSystem)} lines={lines} readOnly={false} units={user.unitSystem} />
      </Card>
    </div>
  );
}
