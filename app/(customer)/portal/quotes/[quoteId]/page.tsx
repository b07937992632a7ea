import type { Metadata } from 'next';
import { turnaroundText } from '@/lib/schedule/turnaround';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Money } from '@/components/money';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Caution } from '@/components/ui/caution';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, TFoot, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { BASIS_LABELS } from '@/lib/quotes/basis';
import { formatDateTime, formatDay, formatUnitPrice } from '@/lib/quotes/format';
import { getPortalQuote } from '@/lib/quotes/queries';
import { quoteLabel } from '@/lib/quotes/status';
import { PortalQuoteStatus } from '../status-badge';
import { AcceptForm, DeclineForm } from './decision-forms';

export const metadata: Metadata = { title: 'Quote' };

const UUID = /^[0-9a-f-]{36}$/i;

export default async function PortalQuotePage({ params, searchParams }: { params: Promise<{ quoteId: string }>; searchParams: Promise<{ done?: string }> }) {
  const [{ quoteId }, { done }] = await Promise.all([params, searchParams]);
  const user = await requirePageUser('portal.use', `/portal/quotes/${quoteId}`);
  // Another company's quote id finds nothing: the WHERE holds the contact's own company.
  const quote = UUID.test(quoteId) && user.customerId ? await getPortalQuote(user.customerId, quoteId) : null;
  if (!quote) notFound();
  const status = quote.effective_status;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/portal/quotes">Quotes</Link>}
        title={<span className="font-mono">{quoteLabel(quote)}</span>}
        meta={<PortalQuoteStatus status={status} />}
        description={[quote.expires_at ? `Valid until ${formatDay(quote.expires_at)}` : null, turnaroundText(quote.turnaround_days)].filter(Boolean).join(' · ') || undefined}
        actions={
          <a className={buttonClasses({ variant: 'secondary' })} href={`/api/portal/quotes/${quote.id}/pdf`} target="_blank" rel="noopener">
            Download PDF
          </a>
        }
      />
      {done === 'accepted' && status === 'accepted' ? (
        <FormMessage
          tone="success"
          message={`Thank you. Quote ${quoteLabel(quote)} is accepted with PO ${quote.po_number}; our order${quote.workOrders.length === 1 ? '' : 's'} ${quote.workOrders.map((w) => w.number).join(', ')} ${quote.workOrders.length === 1 ? 'is' : 'are'} open.`}
        />
      ) : null}
      {done === 'declined' && status === 'declined' ? <FormMessage tone="success" message={`Quote ${quoteLabel(quote)} is declined. Thank you for letting us know.`} /> : null}
      <Card padding="none">
        <Table caption="Quote lines" captionHidden>
          <THead>
            <tr>
              <Th>#</Th>
              <Th>Part</Th>
              <Th>Finish and specification</Th>
              <Th numeric>Quantity</Th>
              <Th numeric>Unit price</Th>
              <Th numeric>Line total</Th>
            </tr>
          </THead>
          <TBody>
            {quote.lines.map((l) => (
              <Tr key={l.id}>
                <Td>{l.lineNo}</Td>
                <Td>
                  <span className="font-mono">{l.partNumber}</span>
                  {l.partRevision ? ` rev ${l.partRevision}` : ''}
                  <div className="text-xs text-ink-muted">{l.partDescription}</div>
                </Td>
                <Td>
                  {l.finishName}
                  {l.specText ? <div className="text-xs text-ink-muted">{l.specText}</div> : null}
                </Td>
                <Td numeric>{l.quantity.toLocaleString('en-US')}</Td>
                <Td numeric>
                  {formatUnitPrice(l.unitPriceCents)}
                  <div className="text-xs text-ink-muted">{BASIS_LABELS[l.basis]}</div>
                </Td>
                <Td numeric>
                  <Money cents={l.totalCents} />
                </Td>
              </Tr>
            ))}
          </TBody>
          <TFoot>
            <tr>
              <Td colSpan={5}>Total (taxes, where they apply, are added on the invoice)</Td>
              <Td numeric>
                <Money cents={quote.total_cents} />
              </Td>
            </tr>
          </TFoot>
        </Table>
      </Card>
      {quote.notes ? <Card title="Notes">{quote.notes}</Card> : null}
      {quote.lines.some((l) => l.cost.bake.applies) ? <Caution kind="high-strength-steel-bake" /> : null}
      {status === 'sent' ? (
        <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
          <Card title="Accept" description="One work order opens for each line as soon as you accept.">
            <AcceptForm quoteId={quote.id} />
          </Card>
          <Card title="Decline" description="A short reason helps us quote better next time.">
            <DeclineForm quoteId={quote.id} />
          </Card>
        </div>
      ) : status === 'accepted' ? (
        <Card title="Accepted">
          Accepted on {formatDateTime(quote.decided_at)} with PO {quote.po_number}: order{quote.workOrders.length === 1 ? '' : 's'}{' '}
          {quote.workOrders.map((w) => w.number).join(', ')}. Follow the parts under <Link href="/portal/orders">Orders</Link>.
        </Card>
      ) : status === 'declined' ? (
        <Card title="Declined">Declined on {formatDateTime(quote.decided_at)}: {quote.decline_reason}</Card>
      ) : status === 'expired' ? (
        <Card title="Expired">This quote expired on {formatDay(quote.expires_at)} and can no longer be accepted. Contact us for a new revision.</Card>
      ) : null}
    </div>
  );
}
