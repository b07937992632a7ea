import 'server-only';
import { createElement } from 'react';
import { renderToBuffer } from '@react-pdf/renderer';
import { appUrl } from '@/lib/email/mailer';
import { isoDate } from '../dates';
import { shopDetails, type InvoiceDetail } from '../queries';
import { InvoiceDocument, type InvoicePdfData } from './invoice-document';

export function invoicePdfData(detail: InvoiceDetail, shop: InvoicePdfData['shop']): InvoicePdfData {
  const { invoice, summary } = detail;
  return {
    shop,
    number: invoice.number,
    issuedOn: isoDate(invoice.issued_on),
    dueOn: isoDate(invoice.due_on),
    paymentTermsDays: invoice.payment_terms_days,
    billTo: { name: invoice.bill_to_name, address: invoice.bill_to_address, email: invoice.billing_email },
    lines: detail.lines.map((l) => ({
      lineNo: l.line_no,
      description: l.description,
      quantity: Number(l.quantity),
      unit: l.unit,
      unitPriceCents: Number(l.unit_price_cents),
      amountCents: l.amount_cents,
    })),
    subtotalCents: invoice.subtotal_cents,
    taxRateBp: invoice.tax_rate_bp,
    taxCents: invoice.tax_cents,
    totalCents: invoice.total_cents,
    creditedCents: invoice.credited_cents,
    paidCents: invoice.paid_cents,
    openCents: summary.openCents,
    creditNotes: detail.creditNotes.map((c) => ({ number: c.number, amountCents: c.amount_cents, reason: c.reason })),
    roundingRule: invoice.rounding_rule,
    notes: invoice.notes,
    payUrl: appUrl(`/portal/invoices/${invoice.id}`),
  };
}

export async function renderInvoicePdf(data: InvoicePdfData): Promise<Buffer> {
  return renderToBuffer(createElement(InvoiceDocument, { d: data }) as Parameters<typeof renderToBuffer>[0]);
}

export function invoicePdfFilename(number: string): string {
  return `invoice-${number}.pdf`;
}

export async function invoicePdfFor(detail: InvoiceDetail): Promise<Buffer> {
  return renderInvoicePdf(invoicePdfData(detail, await shopDetails()));
}

/** The PDF as an HTTP response, shown in the browser rather than saved straight away. */
export async function invoicePdfResponse(detail: InvoiceDetail): Promise<Response> {
  const pdf = await invoicePdfFor(detail);
  return new Response(new Uint8Array(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `inline; filename="${invoicePdfFilename(detail.invoice.number)}"`,
      'cache-control': 'private, no-store',
    },
  });
}
