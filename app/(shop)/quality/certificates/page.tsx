import type { Metadata } from 'next';
import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { SimpleTable } from '@/components/ui/simple-table';
import { requirePageUser } from '@/lib/auth/current-user';
import { findIssuedCertificates } from '@/lib/quality/queries';
import { formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';

export const metadata: Metadata = { title: 'Certificates' };

export default async function CertificatesPage() {
  await requirePageUser('quality.read', '/quality/certificates');
  const rows = await findIssuedCertificates();
  const tz = shopTimeZone();
  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Certificates of conformance" description="Every certificate issued, newest first. Each is frozen as signed; its PDF is the one the customer downloads." />
      <SimpleTable
        framed
        caption="Certificates"
        rows={rows}
        rowKey={(c) => c.id}
        empty={<EmptyState title="None issued yet" description="A supervisor issues a certificate from a lot's quality page once its records are complete and passing." />}
        columns={[
          {
            header: 'Number',
            cell: (c) => (
              <a className="font-mono" href={`/api/quality/certificates/${c.id}`} target="_blank" rel="noopener">
                {c.number}
              </a>
            ),
          },
          {
            header: 'Customer · PO',
            cell: (c) => (
              <>
                {c.customer_name}
                <div className="text-xs text-ink-muted">PO {c.po_number}</div>
              </>
            ),
          },
          { header: 'Part', className: 'font-mono', cell: (c) => `${c.part_number}${c.revision ? ` rev ${c.revision}` : ''}` },
          {
            header: 'Work order',
            cell: (c) => (
              <Link className="font-mono" href={`/quality/orders/${c.work_order_id}`}>
                {c.work_order_number}
              </Link>
            ),
          },
          { header: 'Signed', className: 'text-xs', cell: (c) => `${formatShopTime(c.signed_at, tz)} · ${c.signed_by_name}` },
        ]}
      />
    </div>
  );
}
