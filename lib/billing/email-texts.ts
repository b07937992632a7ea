import 'server-only';
import { formatMoney } from '@/components/money';
import { appUrl } from '@/lib/email/mailer';
import { formatDay } from '@/lib/quotes/format';
import type { InvoiceDetail } from './queries';

// Wording of billing e-mails that carry no attachment. Kept apart from the PDF renderer so the
// background worker (run by tsx) can send reminders without loading it.

export function payLine(detail: InvoiceDetail): string {
  return `View and pay online: ${appUrl(`/portal/invoices/${detail.invoice.id}`)}`;
}

export function reminderText(detail: InvoiceDetail, daysPastDue: number, shopName: string): { subject: string; text: string } {
  const { invoice, summary } = detail;
  return {
    subject: `Reminder: invoice ${invoice.number} is ${daysPastDue} day${daysPastDue === 1 ? '' : 's'} past due (${formatMoney(summary.openCents)} open)`,
    text: [
      `Hello,`,
      ``,
      `Our records show ${formatMoney(summary.openCents)} still open on invoice ${invoice.number}, which was due on ${formatDay(summary.dueOn)}.`,
      `If you have already paid, thank you, and please disregard this reminder.`,
      ``,
      payLine(detail),
      ``,
      shopName,
    ].join('\n'),
  };
}
