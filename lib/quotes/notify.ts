import 'server-only';
import { formatMoney } from '@/components/money';
import { db } from '@/db';
import { AppError } from '@/lib/errors';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { getShopSettings } from '@/lib/users/queries';
import { formatDay } from './format';
import { getQuote } from './queries';
import { quotePdfFileName, renderQuotePdf } from './quote-pdf';
import { quoteLabel } from './status';

// E-mails about quotes, sent after the change they report has committed. A failed send is logged
// by the mailer and reported back, never rolled into the business change.

export async function emailQuoteToContact(quoteId: string): Promise<{ ok: boolean; to: string | null }> {
  const quote = await getQuote(quoteId);
  if (!quote || !quote.contact_email) return { ok: false, to: null };
  if (quote.effective_status !== 'sent') throw new AppError('CONFLICT', 'Only a sent quote that has not expired can be e-mailed.');
  const [pdf, shop] = await Promise.all([renderQuotePdf(quote), getShopSettings()]);
  const label = quoteLabel(quote);
  const link = appUrl(`/portal/quotes/${quote.id}`);
  const sent = await sendEmail({
    to: quote.contact_email,
    template: 'quote-sent',
    subject: `Quotation ${label} from ${shop?.name ?? 'your plating shop'}`,
    text:
      `Hello ${quote.contact_name ?? ''},\n\n` +
      `Please find our quotation ${label} attached: ${quote.lines.length} line${quote.lines.length === 1 ? '' : 's'}, ` +
      `${formatMoney(quote.total_cents)} in total, valid until ${formatDay(quote.expires_at)}.\n\n` +
      `To accept it with your purchase-order number, or to decline it, open:\n${link}\n\n` +
      `${quote.creator_name ? `${quote.creator_name}\n` : ''}${shop?.name ?? ''}\n`,
    attachments: [{ filename: quotePdfFileName(quote), content: pdf, contentType: 'application/pdf' }],
  });
  return { ok: sent.ok, to: quote.contact_email };
}

async function estimatorEmail(estimatorId: string | null): Promise<string | null> {
  if (!estimatorId) return null;
  const u = await db.selectFrom('users').select(['email', 'is_active']).where('id', '=', estimatorId).executeTakeFirst();
  return u?.is_active ? u.email : null;
}

export async function emailEstimatorAccepted(a: { quoteId: string; label: string; estimatorId: string | null; poNumber: string; customerName: string; workOrders: { id: string; number: string }[] }): Promise<boolean> {
  const to = await estimatorEmail(a.estimatorId);
  if (!to) return false;
  const list = a.workOrders.map((w) => `  ${w.number}  ${appUrl(`/work-orders/${w.id}`)}`).join('\n');
  const r = await sendEmail({
    to,
    template: 'quote-accepted',
    subject: `Quote ${a.label} accepted by ${a.customerName} (PO ${a.poNumber})`,
    text: `${a.customerName} accepted quote ${a.label} with purchase order ${a.poNumber}.\n\nWork orders opened:\n${list}\n\nQuote: ${appUrl(`/quotes/${a.quoteId}`)}\n`,
  });
  return r.ok;
}

export async function emailEstimatorDeclined(d: { quoteId: string; label: string; estimatorId: string | null; reason: string; customerName: string }): Promise<boolean> {
  const to = await estimatorEmail(d.estimatorId);
  if (!to) return false;
  const r = await sendEmail({
    to,
    template: 'quote-declined',
    subject: `Quote ${d.label} declined by ${d.customerName}`,
    text: `${d.customerName} declined quote ${d.label}.\n\nTheir reason: ${d.reason}\n\nQuote: ${appUrl(`/quotes/${d.quoteId}`)}\n`,
  });
  return r.ok;
}
