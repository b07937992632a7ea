import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { findCustomerCertificates } from '@/lib/quality/certificates';
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
      {certificates.length === 0 ? (
        <EmptyState title="No certificates yet" description="When a lot of yours has passed inspection and its certificate is signed, it appears here to download." />
      ) : (
        <Card padding="none">
          <Table caption="Certificates" captionHidden>
            <THead>
              <tr>
                <Th>Certificate</Th>
                <Th>Your PO</Th>
                <Th>Part</Th>
                <Th>Work order</Th>
                <Th>Signed</Th>
                <Th>PDF</Th>
              </tr>
            </THead>
            <TBody>
              {certificates.map((c) => (
                <Tr key={c.id}>
                  <Td>
                    <Link className="font-mono" href={`/portal/certificates/${c.id}`}>
                      {c.number}
                    </Link>
                  </Td>
                  <Td>{c.po_number}</Td>
                  <Td>
                    <span className="font-mono">{c.part_number}</span>
                    {c.revision ? ` rev ${c.revision}` : ''}
                  </Td>
                  <Td className="font-mono">{c.work_order_number}</Td>
                  <Td>
                    {formatShopDate(c.signed_at, tz)} · {c.signed_by_name}
                  </Td>
                  <Td>
                    <a href={`/api/portal/certificates/${c.id}?download=1`} aria-label={`Download ${c.number} as PDF`}>
                      Download
                    </a>
                  </Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        </Card>
      )}
    </div>
  );
}
