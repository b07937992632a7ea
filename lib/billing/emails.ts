import 'server-only';
import { formatMoney } from '@/components/money';
import { db } from '@/db';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { formatDay } from '@/lib/quotes/format';
import { markInvoiceEmailed } from './mutations';
import { invoicePdfData, invoicePdfFilename, renderInvoicePdf } from './pdf/render';
import { payLine } from './email-texts';
import { getInvoiceDetail, shopDetails } from './queries';

// The invoice, the receipt and the overdue reminder, as e-mails to the customer's billing address.
// Each send is logged by the mailer; none of these throws, so a mail outage never undoes a payment.

export type SendResult = { ok: boolean; to: string | null; message: string };

export async function sendInvoiceEmail(invoiceId: string): Promise<SendResult> {
  const detail = await getInvoiceDetail('staff', invoiceId);
  if (!detail) return { ok: false, to: null, message: 'That invoice does not exist.' };
  const { invoice, summary } = detail;
  const to = invoice.billing_email;
  if (!to) return { ok: false, to: null, message: `${invoice.bill_to_name} has no billing e-mail address on record; add one to the customer and send again.` };
  const shop = await shopDetails();
  const pdf = await renderInvoicePdf(invoicePdfData(detail, shop));
  const sent = await sendEmail({
    to,
    template: 'invoice',
    subject: `Invoice ${invoice.number} from ${shop.name}: ${formatMoney(summary.openCents)} due ${formatDay(summary.dueOn)}`,
    text: [
      `Hello,`,
      ``,
      `Please find attached invoice ${invoice.number} for ${formatMoney(invoice.total_cents)}, dated ${formatDay(summary.issuedOn)}.`,
      `Payment is due by ${formatDay(summary.dueOn)}.`,
      ``,
      payLine(detail),
      ``,
      `Thank you for your business.`,
      shop.name,
    ].join('\n'),
    attachments: [{ filename: invoicePdfFilename(invoice.number), content: pdf, contentType: 'application/pdf' }],
  });
  if (!sent.ok) return { ok: false, to, message: `The invoice could not be e-mailed to ${to}. It is issued; try sending it again.` };
  await markInvoiceEmailed(invoice.id);
  return { ok: true, to, message: `Invoice ${invoice.number} e-mailed to ${to}.` };
}

export async function sendReceiptEmail(paymentId: string): Promise<SendResult> {
  const payment = await db.selectFrom('payments').selectAll().where('id', '=', paymentId).executeTakeFirst();
  if (!payment) return { ok: false, to: null, message: 'That payment does not exist.' };
  const detail = await getInvoiceDetail('staff', payment.invoice_id);
  if (!detail?.invoice.billing_email) return { ok: false, to: null, message: 'No billing e-mail address on record.' };
  const { invoice, summary } = detail;
  const shop = await shopDetails();
  const remaining =
    summary.openCents > 0
      ? `${formatMoney(summary.openCents)} remains open on this invoice, due ${formatDay(summary.dueOn)}.`
      : 'This invoice is now paid in full.';
  const sent = await sendEmail({
    to: invoice.billing_email!,
    template: 'payment-receipt',
    subject: `Receipt: ${formatMoney(payment.amount_cents)} received for invoice ${invoice.number}`,
    text: [
      `Hello,`,
      ``,
      `We received your payment of ${formatMoney(payment.amount_cents)} for invoice ${invoice.number} on ${formatDay(payment.received_at.toISOString().slice(0, 10))}.`,
      remaining,
      ``,
      `Payment history and the invoice: ${appUrl(`/portal/invoices/${invoice.id}`)}`,
      ``,
      `Thank you,`,
      shop.name,
    ].join('\n'),
  });
  return sent.ok
    ? { ok: true, to: invoice.billing_email, message: 'Receipt sent.' }
    : { ok: false, to: invoice.billing_email, message: 'The receipt could not be e-mailed.' };
}
