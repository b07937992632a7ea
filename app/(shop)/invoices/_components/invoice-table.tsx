import Link from 'next/link';
import { Money } from '@/components/money';
import { OpenBalance } from '@/components/open-balance';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import type { InvoiceSummary } from '@/lib/billing/queries';
import { formatDay } from '@/lib/quotes/format';
import { InvoiceStatusBadge, LINK } from './invoice-view';

// The list of invoices, for staff (with the customer) and for a customer (with the PDF link).
export function InvoiceTable({ invoices, basePath, audience }: { invoices: InvoiceSummary[]; basePath: '/invoices' | '/portal/invoices'; audience: 'staff' | 'customer' }) {
  return (
    <Table caption="Invoices" captionHidden>
      <THead>
        <tr>
          <Th>Invoice</Th>
          {audience === 'staff' ? <Th>Customer</Th> : null}
          <Th>Date</Th>
          <Th>Due</Th>
          <Th>Status</Th>
          <Th numeric>Total</Th>
          <Th numeric>Open</Th>
          <Th>PDF</Th>
        </tr>
      </THead>
      <TBody>
        {invoices.map((i) => (
          <Tr key={i.id}>
            <Td>
              <Link href={`${basePath}/${i.id}`} className={LINK}>
                {i.number}
              </Link>
            </Td>
            {audience === 'staff' ? <Td>{i.customerName}</Td> : null}
            <Td>{formatDay(i.issuedOn)}</Td>
            <Td>{formatDay(i.dueOn)}</Td>
            <Td>
              <InvoiceStatusBadge summary={i} />
            </Td>
            <Td numeric>
              <Money cents={i.totalCents} />
            </Td>
            <Td numeric>
              <OpenBalance openCents={i.openCents} currency={i.currency} />
            </Td>
            <Td>
              <a className={LINK} href={`${basePath}/${i.id}/pdf`} aria-label={`PDF of invoice ${i.number}`}>
                PDF
              </a>
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
