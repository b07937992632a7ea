import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/current-user';
import { CUSTOMER_IMPORT_COLUMNS } from '@/lib/imports/customers';
import { ImportView } from './import-view';

export const metadata: Metadata = { title: 'Import customers' };

export default async function ImportCustomersPage() {
  await requirePageUser('customers.write', '/customers/import');
  return <ImportView kind="customers" title="Import customers" listHref="/customers" listLabel="Customers" columns={CUSTOMER_IMPORT_COLUMNS} />;
}
