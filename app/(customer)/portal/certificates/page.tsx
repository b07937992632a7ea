import type { Metadata } from 'next';
import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { SimpleTable } from '@/components/ui/simple-table';
import { requirePageUser } from '@/lib/auth/current-user';
import { findCustomerCertificates } from '@/lib/quality/certificate';
import { formatShopDate, shopTimeZone } from '@/lib/quality/shop-time';

export const metadata: Metadata = { title: 'Certificates' };

export default async function PortalCertificatesPage() {
  const user = await requirePageUser('portal.use', '/portal/certificates');
  // Scoped by the signed-in contact's own company inside the query.
  const certificates = await findCustomerCertificates(user);
  const tz = shopTimeZone();
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Certificates" description="Certificates of conformance for your lots, as signed and issued. Open one to see its summary or download the PDF." />
      <SimpleTable
        framed
        caption="Certificates"
        rows={certificates}
        rowKey={(c) => c.id}
        empty={<EmptyState title="No certificates yet" description="When a lot of yours has passed inspection and its certificate is signed, it appears here to download." />}
        columns={[
          {
            header: 'Certificate',
            cell: (c) => (
              <Link className="font-mono" href={`/portal/certificates/${c.id}`}>
                {c.number}
              </Link>
            ),
          },
          { header: 'Your PO', cell: (c) => c.po_number },
          {
            header: 'Part',
            cell: (c) => (
              <>
                <span className="font-mono">{c.part_number}</span>
                {c.revision ? ` rev ${c.revision}` : ''}
              </>
            ),
          },
          { header: 'Work order', className: 'font-mono', cell: (c) => c.work_order_number },
          { header: 'Signed', cell: (c) => `${formatShopDate(c.signed_at, tz)} · ${c.signed_by_name}` },
          {
            header: 'PDF',
            cell: (c) => (
              <a href={`/api/portal/certificates/${c.id}?download=1`} aria-label={`Download ${c.number} as PDF`}>
                Download
              </a>
            ),
          },
        ]}
      />
    </div>
  );
}
