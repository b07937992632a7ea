import 'server-only';
import type { SessionUser } from '@/lib/auth/current-user';
import { customerInvoiceTotals, findInvoicePage, getInvoiceDetail, type InvoiceCursor, type InvoiceDetail, type InvoiceSummary } from './queries';

// The customer area's view of invoices: always scoped by the signed-in contact's own customer id,
// so a foreign or made-up id finds nothing rather than someone else's invoice.

function scopeOf(user: SessionUser): { customerId: string } | null {
  return user.role === 'customer' && user.customerId ? { customerId: user.customerId } : null;
}

/** A page of the contact's own company's invoices, newest first (see findInvoicePage). */
export async function findPortalInvoices(user: SessionUser, before: InvoiceCursor | null = null): Promise<{ invoices: InvoiceSummary[]; next: InvoiceCursor | null }> {
  const scope = scopeOf(user);
  return scope ? findInvoicePage(scope.customerId, before) : { invoices: [], next: null };
}

/** What the company owes over all its invoices and the credit it holds. */
export async function portalInvoiceTotals(user: SessionUser): Promise<{ openCents: number; creditCents: number }> {
  const scope = scopeOf(user);
  return scope ? customerInvoiceTotals(scope.customerId) : { openCents: 0, creditCents: 0 };
}

export async function getPortalInvoice(user: SessionUser, invoiceId: string): Promise<InvoiceDetail | null> {
  const scope = scopeOf(user);
  return scope ? getInvoiceDetail(scope, invoiceId) : null;
}

/** What the customer may see of an invoice, for the JSON API: no staff notes on who recorded what. */
export async function portalInvoiceJson(user: SessionUser, invoiceId: string) {
  const d = await getPortalInvoice(user, invoiceId);
  if (!d) return null;
  const s = d.summary;
  return {
    id: s.id,
    number: s.number,
    status: s.status,
    issuedOn: s.issuedOn,
    dueOn: s.dueOn,
    isOverdue: s.isOverdue,
    currency: s.currency,
    subtotalCents: d.invoice.subtotal_cents,
    taxRateBp: d.invoice.tax_rate_bp,
    taxCents: d.invoice.tax_cents,
    totalCents: s.totalCents,
    creditedCents: s.creditedCents,
    paidCents: s.paidCents,
    openCents: s.openCents,
    creditOnAccountCents: s.excessCents,
    lines: d.lines.map((l) => ({ lineNo: l.line_no, description: l.description, quantity: Number(l.quantity), unit: l.unit, unitPriceCents: Number(l.unit_price_cents), amountCents: l.amount_cents })),
    creditNotes: d.creditNotes.map((c) => ({ number: c.number, amountCents: c.amount_cents, reason: c.reason, issuedOn: c.issued_on })),
    payments: d.payments.map((p) => ({ kind: p.kind, method: p.method, amountCents: p.amount_cents, receivedAt: p.received_at })),
  };
}
