import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { CUSTOMER_IMPORT_COLUMNS } from '@/lib/imports/customers';
import { ColumnsCard } from './columns-card';
import { CsvImport } from './csv-import';

export const metadata: Metadata = { title: 'Import customers' };

export default async function ImportCustomersPage() {
  await requirePageUser('customers.write', '/customers/import');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={<Link href="/customers">← Customers</Link>}
        title="Import customers"
        description="Every row is checked first. If any row has a problem, nothing is imported and each problem is listed by row and column."
      />
      <Card>
        <CsvImport kind="customers" listHref="/customers" />
      </Card>
      <ColumnsCard kind="customers" columns={CUSTOMER_IMPORT_COLUMNS} />
    </div>
  );
}
