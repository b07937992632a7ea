// Pieces of an invoice shown to staff and, in the customer area, to the customer: the status
// badge, the lines with totals, and the payment history. Server components only.
import { formatMoney, Money } from '@/components/money';
import { Badge } from '@/components/ui/badge';
import { SimpleTable } from '@/components/ui/simple-table';
import { Td } from '@/components/ui/table';
import { formatTaxRate, STATUS_WORDS } from '@/lib/billing/arithmetic';
import type { InvoiceDetail, InvoiceSummary } from '@/lib/billing/queries';
import { formatDateTime, formatDay, formatUnitPrice } from '@/lib/quotes/format';

/** Links inside tables and headers, so they read as links. */
export const LINK = 'font-medium text-action hover:underline';

export function InvoiceStatusBadge({ summary }: { summary: Pick<InvoiceSummary, 'status' | 'isOverdue'> }) {
  const tone = summary.status === 'paid' ? 'neutral' : summary.status === 'credited' ? 'outline' : summary.status === 'overpaid' ? 'copper' : 'action';
  return (
    <span className="inline-flex flex-wrap gap-1">
      <Badge tone={tone}>{STATUS_WORDS[summary.status]}</Badge>
      {summary.isOverdue ? <Badge tone="copper">Overdue</Badge> : null}
    </span>
  );
}

const qty = new Intl.NumberFormat('en-US', { maximumFractionDigits: 4 });

export function InvoiceLines({ detail }: { detail: InvoiceDetail }) {
  const { invoice, summary, lines } = detail;
  return (
    <SimpleTable
      caption="Lines"
      rows={lines}
      rowKey={(l) => l.id}
      columns={[
        { header: '#', cell: (l) => l.line_no },
        { header: 'Description', cell: (l) => l.description },
        { header: 'Quantity', numeric: true, cell: (l) => qty.format(Number(l.quantity)) },
        { header: 'Unit', cell: (l) => l.unit },
        { header: 'Unit price', numeric: true, cell: (l) => formatUnitPrice(Number(l.unit_price_cents)) },
        { header: 'Amount', numeric: true, cell: (l) => <Money cents={l.amount_cents} /> },
      ]}
      footer={
        <>
          <TotalRow label="Subtotal" cents={invoice.subtotal_cents} />
          <TotalRow label={`Tax (${formatTaxRate(invoice.tax_rate_bp)})`} cents={invoice.tax_cents} />
          <TotalRow label="Total" cents={invoice.total_cents} />
          {summary.creditedCents > 0 ? <TotalRow label="Credited" cents={-summary.creditedCents} /> : null}
          {summary.paidCents > 0 ? <TotalRow label="Paid" cents={-summary.paidCents} /> : null}
          <TotalRow label={summary.excessCents > 0 ? 'Credit on account' : 'Balance due'} cents={summary.excessCents > 0 ? summary.excessCents : summary.openCents} strong />
        </>
      }
    />
  );
}

function TotalRow({ label, cents, strong }: { label: string; cents: number; strong?: boolean }) {
  return (
    <tr className={strong ? 'text-base' : 'font-normal'}>
      <Td colSpan={5} numeric>
        {label}
      </Td>
      <Td numeric>
        <Money cents={cents} accounting />
      </Td>
    </tr>
  );
}

const METHOD_WORDS = { card: 'Card', check: 'Check', bank_transfer: 'Bank transfer' } as const;

export function PaymentHistory({ detail }: { detail: InvoiceDetail }) {
  const rows = [
    ...detail.payments.map((p) => ({
      key: p.id,
      at: p.received_at,
      what: p.kind === 'refund' ? `Refund (${METHOD_WORDS[p.method].toLowerCase()})` : `Payment (${METHOD_WORDS[p.method].toLowerCase()})`,
      note: p.reference,
      cents: p.kind === 'refund' ? p.amount_cents : -p.amount_cents,
    })),
    ...detail.creditNotes.map((c) => ({ key: c.id, at: c.created_at, what: `Credit note ${c.number}`, note: c.reason, cents: -c.amount_cents })),
    ...detail.creditMoves.map((m) => {
      const out = m.from_invoice_id === detail.invoice.id;
      return {
        key: m.id,
        at: m.created_at,
        what: out ? `Credit applied to invoice ${m.to_number}` : `Credit from invoice ${m.from_number}`,
        note: m.note,
        cents: out ? m.amount_cents : -m.amount_cents,
      };
    }),
    ...detail.declines.map((d) => ({ key: d.id, at: d.received_at, what: 'Card payment not completed', note: d.outcome.replace(/^declined: /, ''), cents: null })),
  ].sort((a, b) => a.at.getTime() - b.at.getTime());
  return (
    <SimpleTable
      dense
      caption="Payment history"
      rows={rows}
      rowKey={(r) => r.key}
      empty={<p className="text-sm text-ink-muted">No payments yet.</p>}
      columns={[
        { header: 'When', className: 'whitespace-nowrap', cell: (r) => formatDateTime(r.at) },
        { header: 'What', cell: (r) => r.what },
        { header: 'Note', className: 'text-ink-muted', cell: (r) => r.note },
        { header: 'Amount', numeric: true, cell: (r) => (r.cents === null ? '—' : <Money cents={r.cents} accounting />) },
      ]}
    />
  );
}

export function InvoiceFacts({ detail }: { detail: InvoiceDetail }) {
  const { invoice, summary } = detail;
  return (
    <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[9rem_1fr]">
      <dt className="text-ink-muted">Bill to</dt>
      <dd>
        {invoice.bill_to_name}
        {invoice.bill_to_address ? <span className="block text-ink-muted">{invoice.bill_to_address}</span> : null}
      </dd>
      <dt className="text-ink-muted">Invoice date</dt>
      <dd>{formatDay(summary.issuedOn)}</dd>
      <dt className="text-ink-muted">Terms</dt>
      <dd>{invoice.payment_terms_days === 0 ? 'Due on receipt' : `Net ${invoice.payment_terms_days} days`}</dd>
      <dt className="text-ink-muted">Due date</dt>
      <dd>{formatDay(summary.dueOn)}</dd>
      <dt className="text-ink-muted">{summary.excessCents > 0 ? 'Credit on account' : 'Balance due'}</dt>
      <dd className="font-semibold">
        {formatMoney(summary.excessCents > 0 ? summary.excessCents : summary.openCents)}
        {summary.excessCents > 0 ? <span className="block text-xs font-normal text-ink-muted">Paid {formatMoney(summary.excessCents)} more than the invoice asked.</span> : null}
      </dd>
    </dl>
  );
}

export function RoundingNote({ rule }: { rule: string }) {
  return <p className="text-xs text-ink-muted">Rounding: {rule}</p>;
}
