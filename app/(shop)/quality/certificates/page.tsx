import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
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
      {rows.length === 0 ? (
        <EmptyState title="None issued yet" description="A supervisor issues a certificate from a lot's quality page once its records are complete and passing." />
      ) : (
        <Card padding="none">
          <Table caption="Certificates" captionHidden>
            <THead>
              <tr>
                <Th>Number</Th>
                <Th>Customer · PO</Th>
                <Th>Part</Th>
                <Th>Work order</Th>
                <Th>Signed</Th>
              </tr>
            </THead>
            <TBody>
              {rows.map((c) => (
                <Tr key={c.id}>
                  <Td>
                    <a className="font-mono" href={`/api/quality/certificates/${c.id}`} target="_blank" rel="noopener">
                      {c.number}
                    </a>
                  </Td>
                  <Td>
                    {c.customer_name}
                    <div className="text-xs text-ink-muted">PO {c.po_number}</div>
                  </Td>
                  <Td className="font-mono">
                    {c.part_number}
                    {c.revision ? ` rev ${c.revision}` : ''}
                  </Td>
                  <Td>
                    <Link className="font-mono" href={`/quality/orders/${c.work_order_id}`}>
                      {c.work_order_number}
                    </Link>
                  </Td>
                  <Td className="text-xs">
                    {formatShopTime(c.signed_at, tz)} · {c.signed_by_name}
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
