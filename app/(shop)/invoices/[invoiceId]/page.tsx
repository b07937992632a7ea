import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { formatMoney } from '@/components/money';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { todayIso } from '@/lib/billing/dates';
import { findInvoices, findReminders, getInvoiceDetail } from '@/lib/billing/queries';
import { formatDateTime } from '@/lib/quotes/format';
import { InvoiceFacts, InvoiceLines, InvoiceStatusBadge, LINK, PaymentHistory, RoundingNote } from '../_components/invoice-view';
import { ApplyCreditForm, CreditNoteForm, ManualPaymentForm, RefundExcessForm, ResendForm } from './office-forms';

export const metadata: Metadata = { title: 'Invoice' };

type Props = { params: Promise<{ invoiceId: string }>; searchParams: Promise<{ issued?: string; mailed?: string; notice?: string }> };

const NOTICES: Record<string, string> = {
  'credit-applied': 'Credit applied. The other invoice shows it in its payment history.',
  refunded: 'Refund recorded. It shows in the payment history below.',
};

export default async function InvoicePage({ params, searchParams }: Props) {
  const { invoiceId } = await params;
  const user = await requirePageUser('invoices.read', `/invoices/${invoiceId}`);
  const detail = await getInvoiceDetail('staff', invoiceId);
  if (!detail) notFound();
  const { invoice, summary, customer } = detail;
  const { issued, mailed, notice } = await searchParams;
  const reminders = await findReminders(invoice.id);
  const mayIssue = can(user, 'invoices.issue');
  const open = summary.openCents > 0;
  const hasExcess = summary.excessCents > 0;
  const targets = mayIssue && hasExcess
    ? (await findInvoices('staff', { customerId: invoice.customer_id, status: 'open' }))
        .filter((i) => i.id !== invoice.id && i.currency === invoice.currency)
        .map((i) => ({ id: i.id, label: `${i.number}: ${formatMoney(i.openCents)} open` }))
    : [];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/invoices" className={LINK}>Invoices</Link>}
        title={`Invoice ${invoice.number}`}
        meta={<InvoiceStatusBadge summary={summary} />}
        description={customer.name}
        actions={
          <a className={buttonClasses({ variant: 'secondary' })} href={`/invoices/${invoice.id}/pdf`}>
            PDF
          </a>
        }
      />
      {notice && NOTICES[notice] ? <FormMessage tone="success" message={NOTICES[notice]} /> : null}
      {issued ? (
        <FormMessage
          tone={mailed === '1' ? 'success' : 'error'}
          message={
            mailed === '1'
              ? `Invoice ${invoice.number} issued and e-mailed to ${invoice.billing_email}.`
              : `Invoice ${invoice.number} is issued, but it was not e-mailed${invoice.billing_email ? '' : ' (no billing e-mail on record)'}. Use "Send again" below.`
          }
        />
      ) : null}
      <div className="grid gap-4 lg:grid-cols-[1fr_20rem]">
        <Card title="Details">
          <InvoiceFacts detail={detail} />
        </Card>
        <Card title="E-mail">
          <div className="flex flex-col gap-2 text-sm">
            <p>
              {invoice.billing_email ? `To ${invoice.billing_email}. ` : 'No billing e-mail on record. '}
              {invoice.emailed_at ? `Last sent ${formatDateTime(invoice.emailed_at)}.` : 'Not sent yet.'}
            </p>
            {reminders.length ? (
              <p className="text-ink-muted">Reminders sent: {reminders.map((r) => `${r.stage.replace('overdue_', '')} day${r.stage === 'overdue_1' ? '' : 's'} overdue (${formatDateTime(r.sent_at)})`).join('; ')}</p>
            ) : null}
            {mayIssue && invoice.billing_email ? <ResendForm invoiceId={invoice.id} label={invoice.emailed_at ? 'Send again' : 'Send'} /> : null}
          </div>
        </Card>
      </div>
      <Card title="Lines" padding="none">
        <InvoiceLines detail={detail} />
      </Card>
      <Card title="Payments and credit notes">
        <PaymentHistory detail={detail} />
      </Card>
      {mayIssue && hasExcess ? (
        <div className="grid gap-4 md:grid-cols-2">
          <Card title={`Credit on account: ${formatMoney(summary.excessCents)}`} description="Paid beyond this invoice. Give it back to the customer, or apply it to another of their open invoices.">
            <RefundExcessForm invoiceId={invoice.id} maxText={formatMoney(summary.excessCents)} hasCard={detail.payments.some((p) => p.kind === 'payment' && p.method === 'card')} />
          </Card>
          <Card title="Apply the credit to another invoice">
            <ApplyCreditForm fromInvoiceId={invoice.id} targets={targets} />
          </Card>
        </div>
      ) : null}
      {mayIssue ? (
        <div className="grid gap-4 md:grid-cols-2">
          <Card title="Record a payment" description="A check or bank transfer received. Card payments online are recorded automatically.">
            <ManualPaymentForm invoiceId={invoice.id} today={todayIso()} />
          </Card>
          {open ? (
            <Card title="Credit note" description="Corrects the invoice by reducing what is owed. It gets its own number and is shown to the customer.">
              <CreditNoteForm invoiceId={invoice.id} maxText={formatMoney(summary.openCents)} />
            </Card>
          ) : null}
        </div>
      ) : null}
      <RoundingNote rule={invoice.rounding_rule} />
    </div>
  );
}
