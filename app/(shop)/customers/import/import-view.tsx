import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import type { ImportColumn } from '@/lib/imports/csv-rows';
import { ColumnsCard } from './columns-card';
import { CsvImport } from './csv-import';

/** The body of an import page: the upload, its problems, and the columns with the template link. */
export function ImportView({ kind, title, listHref, listLabel, columns }: { kind: 'customers' | 'parts'; title: string; listHref: string; listLabel: string; columns: readonly ImportColumn[] }) {
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={<Link href={listHref}>← {listLabel}</Link>}
        title={title}
        description="Every row is checked first. If any row has a problem, nothing is imported and each problem is listed by row and column."
      />
      <Card>
        <CsvImport kind={kind} listHref={listHref} />
      </Card>
      <ColumnsCard kind={kind} columns={columns} />
    </div>
  );
}
