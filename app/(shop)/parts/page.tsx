import type { Metadata } from 'next';
import { ImportNewActions } from '@/components/ui/import-new-actions';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { PartGrid } from './part-grid';

export const metadata: Metadata = { title: 'Parts' };

export default async function PartsPage() {
  const user = await requirePageUser('customers.read', '/parts');
  const mayWrite = can(user, 'customers.write');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Parts"
        description="Customers’ parts with their substrate, strength and plating area."
        actions={mayWrite ? <ImportNewActions base="/parts" newLabel="New part" /> : null}
      />
      <PartGrid unitSystem={user.unitSystem} />
    </div>
  );
}
