import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { formatMoney } from '@/components/money';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { confirmCheckoutReturn } from '@/lib/billing/checkout';
import { getPortalInvoice } from '@/lib/billing/portal';
import {
  InvoiceFacts,
  InvoiceLines,
  InvoiceStatusBadge,
  LINK,
  PaymentHistory,
  RoundingNote,
} from '../../../../(shop)/invoices/_components/invoice-view';
import { PayForm } from './pay-form';

export const metadata: Metadata = { title: 'Invoice' };

type Props = { params: Promise<{ invoiceId: string }>; searchParams: Promise<{ payment?: string; session?: string }> };

function returnMessage(payment: string | undefined, openCents: number, paidCents: number) {
  if (payment === 'cancelled') return { tone: 'info' as const, text: 'The payment was cancelled. Nothing was charged.' };
  if (payment !== 'done') return null;
  if (openCents <= 0 && paidCents > 0) return { tone: 'success' as const, text: 'Thank you: your payment was received and a receipt is on its way by e-mail.' };
  if (paidCents > 0) return { tone: 'success' as const, text: `Thank you: your payment was received. ${formatMoney(openCents)} remains open.` };
  return { tone: 'info' as const, text: 'Your payment is being confirmed. Reload this page in a moment to see it.' };
}

export default async function PortalInvoicePage({ params, searchParams }: Props) {
  const { invoiceId } = await params;
  const user = await requirePageUser('portal.use', `/portal/invoices/${invoiceId}`);
  const { payment, session } = await searchParams;
  if (payment === 'done' && session) await confirmCheckoutReturn(user, invoiceId, session);
  const detail = await getPortalInvoice(user, invoiceId);
  if (!detail) notFound();
  const { invoice, summary } = detail;
  const message = returnMessage(payment, summary.openCents, summary.paidCents);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/portal/invoices" className={LINK}>Invoices</Link>}
        title={`Invoice ${invoice.number}`}
        meta={<InvoiceStatusBadge summary={summary} />}
        actions={
          <a className={buttonClasses({ variant: 'secondary' })} href={`/portal/invoices/${invoice.id}/pdf`}>
            PDF
          </a>
        }
      />
      {message ? <FormMessage tone={message.tone} message={message.text} /> : null}
      <div className="grid gap-4 md:grid-cols-[1fr_18rem]">
        <Card title="Details">
          <InvoiceFacts detail={detail} />
        </Card>
        <Card title={summary.openCents > 0 ? 'Pay online' : summary.excessCents > 0 ? 'Credit on account' : 'Nothing to pay'}>
          {summary.openCents > 0 ? (
            <div className="flex flex-col gap-3 text-sm">
              <p>
                Pay the open balance of <strong>{formatMoney(summary.openCents)}</strong> by card. You will be taken to a secure payment page
                and brought back here.
              </p>
              <PayForm invoiceId={invoice.id} label={`Pay ${formatMoney(summary.openCents)}`} />
            </div>
          ) : summary.excessCents > 0 ? (
            <p className="text-sm">
              You paid <strong>{formatMoney(summary.excessCents)}</strong> more than this invoice asked. It is your credit on account: we will refund it or
              apply it to another invoice, and tell you which.
            </p>
          ) : (
            <p className="text-sm">This invoice is settled. Thank you.</p>
          )}
        </Card>
      </div>
      <Card title="Lines" padding="none">
        <InvoiceLines detail={detail} />
      </Card>
      <Card title="Payment history">
        <PaymentHistory detail={detail} />
      </Card>
      <RoundingNote rule={invoice.rounding_rule} />
    </div>
  );
}
