import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { LAB_COLUMNS } from '@/lib/bath/lab-csv';
import { UploadForm } from './upload-form';

export const metadata: Metadata = { title: 'Upload lab results' };

const EXAMPLE = `${LAB_COLUMNS.join(',')}\nN-NI1,nickel,74.2,g/L,2026-11-30 08:15\nZ-ZN1,zinc,1.02,oz/gal,2026-11-30T08:40:00Z`;

export default async function LabUploadPage() {
  await requirePageUser('bath.log', '/baths/upload');
  return (
    <div className="flex max-w-3xl flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/baths" className="text-action underline">Baths</Link>}
        title="Upload lab results"
        description="Results from an outside laboratory. Every row is checked first; nothing is saved unless every row is right. The same file uploaded twice is saved once."
      />
      <Card title="The file">
        <div className="flex flex-col gap-3 text-sm">
          <p>
            A header row with the columns <code>{LAB_COLUMNS.join(', ')}</code>. The tank code and analyte key are as on the tank&apos;s page;
            the unit is the analyte&apos;s own or one that converts to it (g/L or oz/gal, °C or °F); the time is YYYY-MM-DD HH:MM in UTC, or ISO 8601 with a zone.
          </p>
          <pre className="overflow-x-auto rounded-md bg-surface-muted p-3 text-xs">{EXAMPLE}</pre>
        </div>
      </Card>
      <Card title="Upload">
        <UploadForm />
      </Card>
    </div>
  );
}
