// A customer contact sees only their own company's invoices: another customer's invoice id is
// "not found" by page query, JSON API, PDF route and pay action alike, and nothing is created.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { SessionUser } from '@/lib/auth/current-user';

let current: SessionUser | null = null;

// Stands in for the session cookie: the wrappers ask this module who is signed in.
vi.mock('@/lib/auth/current-user', async (importOriginal) => {
  const real = await importOriginal<typeof import('@/lib/auth/current-user')>();
  const { AppError } = await import('@/lib/errors');
  const { roleCan } = await import('@/lib/auth/roles');
  return {
    ...real,
    getCurrentUser: async () => current,
    requirePermission: async (permission: Parameters<typeof roleCan>[1]) => {
      if (!current) throw new AppError('UNAUTHENTICATED', 'Please sign in.');
      if (!roleCan(current.role, permission)) throw new AppError('FORBIDDEN', 'You are not allowed to do this.');
      return current;
    },
  };
});

const { db } = await import('@/db');
const { issueInvoice } = await import('@/lib/billing/mutations');
const { findPortalInvoices, getPortalInvoice } = await import('@/lib/billing/portal');
const { GET: apiGet } = await import('@/app/api/portal/invoices/[invoiceId]/route');
const { POST: apiCheckout } = await import('@/app/api/portal/invoices/[invoiceId]/checkout/route');
const { GET: portalPdf } = await import('@/app/(customer)/portal/invoices/[invoiceId]/pdf/route');
const { GET: staffPdf } = await import('@/app/(shop)/invoices/[invoiceId]/pdf/route');
const { payInvoiceAction } = await import('@/app/(customer)/portal/invoices/[invoiceId]/actions');
const { customerId, HVI_QUALITY, makeOrder, NGF_BUYER, OWNER, sessionUser } = await import('./fixtures');

let ngfInvoice: { id: string; number: string };
let ngf: SessionUser;
let hvi: SessionUser;
let owner: SessionUser;

beforeAll(async () => {
  [ngf, hvi, owner] = await Promise.all([sessionUser(NGF_BUYER), sessionUser(HVI_QUALITY), sessionUser(OWNER)]);
  const o = await makeOrder({ customer: 'NGF' });
  ngfInvoice = await issueInvoice(owner.id, { customerId: await customerId('NGF'), orderIds: [o.id], extras: [] });
});
afterAll(() => db.destroy());

const ctx = (invoiceId: string) => ({ params: Promise.resolve({ invoiceId }) });
const req = (method = 'GET') => new Request('http://127.0.0.1:3100/x', { method, headers: { 'content-type': 'application/json' }, body: method === 'POST' ? '{"amountCents":1}' : undefined });

describe('another customer', () => {
  it('finds nothing through the customer-area queries', async () => {
    expect(await getPortalInvoice(hvi, ngfInvoice.id)).toBeNull();
    expect((await findPortalInvoices(hvi)).invoices.map((i) => i.id)).not.toContain(ngfInvoice.id);
    expect(await getPortalInvoice(hvi, "' or 1=1 --")).toBeNull();
  });

  it('gets 404 and no data from the JSON API and the PDF route', async () => {
    current = hvi;
    const r = await apiGet(req(), ctx(ngfInvoice.id));
    expect(r.status).toBe(404);
    const text = await r.text();
    expect(text).not.toContain(ngfInvoice.number);
    expect(JSON.parse(text)).toEqual({ error: { code: 'NOT_FOUND', message: 'That invoice was not found.' } });
    expect((await portalPdf(req(), ctx(ngfInvoice.id))).status).toBe(404);
  });

  it('cannot open a payment for it, by API or by form action, and nothing is created', async () => {
    current = hvi;
    expect((await apiCheckout(req('POST'), ctx(ngfInvoice.id))).status).toBe(404);
    const form = new FormData();
    form.set('invoiceId', ngfInvoice.id);
    expect(await payInvoiceAction({}, form)).toMatchObject({ ok: false, message: 'That invoice was not found.' });
    const opened = await db.selectFrom('invoice_checkouts').select('id').where('invoice_id', '=', ngfInvoice.id).execute();
    expect(opened).toEqual([]);
  });

  it('is refused the staff PDF route outright', async () => {
    current = hvi;
    expect((await staffPdf(req(), ctx(ngfInvoice.id))).status).toBe(403);
  });
});

describe('the invoice’s own customer', () => {
  it('reads it through the API and downloads its PDF', async () => {
    current = ngf;
    const r = await apiGet(req(), ctx(ngfInvoice.id));
    expect(r.status).toBe(200);
    const body = (await r.json()) as { invoice: { number: string; openCents: number; lines: unknown[] } };
    expect(body.invoice.number).toBe(ngfInvoice.number);
    expect(body.invoice.lines).toHaveLength(1);
    const pdf = await portalPdf(req(), ctx(ngfInvoice.id));
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await pdf.arrayBuffer()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });
});

describe('staff', () => {
  it('are refused the customer-area API (it is scoped to a customer account)', async () => {
    current = owner;
    expect((await apiGet(req(), ctx(ngfInvoice.id))).status).toBe(403);
  });
  it('read any invoice PDF on the staff route', async () => {
    current = owner;
    expect((await staffPdf(req(), ctx(ngfInvoice.id))).status).toBe(200);
  });
});
