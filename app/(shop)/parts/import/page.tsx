import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { PART_IMPORT_COLUMNS } from '@/lib/imports/parts';
import { ColumnsCard } from '../../customers/import/columns-card';
import { CsvImport } from '../../customers/import/csv-import';

export const metadata: Metadata = { title: 'Import parts' };

export default async function ImportPartsPage() {
  await requirePageUser('customers.write', '/parts/import');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={<Link href="/parts">← Parts</Link>}
        title="Import parts"
        description="Every row is checked first. If any row has a problem, nothing is imported and each problem is listed by row and column."
      />
      <Card>
        <CsvImport kind="parts" listHref="/parts" />
      </Card>
      <ColumnsCard kind="parts" columns={PART_IMPORT_COLUMNS} />
    </div>
  );
}
