import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/current-user';
import { PART_IMPORT_COLUMNS } from '@/lib/imports/parts';
import { ImportView } from '../../customers/import/import-view';

export const metadata: Metadata = { title: 'Import parts' };

export default async function ImportPartsPage() {
  await requirePageUser('customers.write', '/parts/import');
  return <ImportView kind="parts" title="Import parts" listHref="/parts" listLabel="Parts" columns={PART_IMPORT_COLUMNS} />;
}
