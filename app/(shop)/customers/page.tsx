import type { Metadata } from 'next';
import { ImportNewActions } from '@/components/ui/import-new-actions';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { CustomerGrid } from './customer-grid';

export const metadata: Metadata = { title: 'Customers' };

export default async function CustomersPage() {
  const user = await requirePageUser('customers.read', '/customers');
  const mayWrite = can(user, 'customers.write');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Customers"
        description="Companies the shop plates for, with their billing details and contacts."
        actions={mayWrite ? <ImportNewActions base="/customers" newLabel="New customer" /> : null}
      />
      <CustomerGrid />
    </div>
  );
}
