// Customer isolation over HTTP against `next start`, generated from the code: for every page, route
// handler and server action a customer contact can use with a record id, contact A asks for
// company B's record and for an id that exists nowhere. Both answers must be the same (status,
// headers, body once per-request noise is taken out), B's rows must not change, and nothing of B's
// (number, name, amount, id) may show. A's lists never show B's records. Runs both ways between the
// two demo companies; a customer route whose id names no known kind of record fails the test.
import { randomBytes, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatMoney } from '@/components/money';
import { db, pool } from '@/db';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { issueInvoice } from '@/lib/billing/mutations';
import { issueCertificate } from '@/lib/quality/certificate';
import { recordReadings } from '@/lib/quality/thickness';
import { markQuoteSent } from '@/lib/quotes/lifecycle';
import { addQuoteLine, createQuote } from '@/lib/quotes/mutations';
import { quoteLabel } from '@/lib/quotes/status';
import { actionRequest } from '../helpers/actions';
import { APP_URL } from '../helpers/browser';
import { discoverActions, discoverApiRoutes, discoverPages, type Guard, guardAllows } from '../helpers/routes';
import { makeOrder } from '../integration/billing/fixtures';
import { actorFor, createLot, inspect, passingReadings, PLATER, SUPERVISOR } from '../integration/quality/fixtures';
import { finishId, staff, suffix } from '../integration/quotes/fixtures';

// The two demo companies, each with a contact who signs in, and what its fresh quote is for.
const COMPANIES = {
  NGF: { userId: 'demo-customer-buyer', part: 'NGF-HX-0816', finish: 'ZN-B633-SC2', invoicedPieces: 1000 },
  HVI: { userId: 'demo-customer-quality', part: 'HV-STEM-220', finish: 'NI-B689-25', invoicedPieces: 1200 },
} as const;
type Code = keyof typeof COMPANIES;
const DIRECTIONS: [Code, Code][] = [
  ['NGF', 'HVI'],
  ['HVI', 'NGF'],
];

type Kind = 'quote' | 'workOrder' | 'invoice' | 'certificate' | 'file' | 'part' | 'customer' | 'checkout';
// Route parameters that name a customer's record. A customer route with any other parameter fails
// the coverage test below until it is given a kind here.
const PARAM_KIND: Record<string, Kind> = {
  quoteId: 'quote',
  workOrderId: 'workOrder',
  invoiceId: 'invoice',
  certificateId: 'certificate',
  fileId: 'file',
  partId: 'part',
  customerId: 'customer',
};

// The rows that would change if a request acted on the record (compared before and after).
const ROWS: Record<Kind, [table: string, where: string][]> = {
  quote: [
    ['quotes', 'id::text = $1'],
    ['quote_lines', 'quote_id::text = $1'],
    ['work_orders', 'quote_line_id in (select id from quote_lines where quote_id::text = $1)'],
    ['audit_log', 'entity_id = $1'],
  ],
  workOrder: [
    ['work_orders', 'id::text = $1'],
    ['work_order_events', 'work_order_id::text = $1'],
    ['plating_runs', 'work_order_id::text = $1'],
    ['audit_log', 'entity_id = $1'],
  ],
  invoice: [
    ['invoices', 'id::text = $1'],
    ['invoice_lines', 'invoice_id::text = $1'],
    ['payments', 'invoice_id::text = $1'],
    ['credit_notes', 'invoice_id::text = $1'],
    ['invoice_checkouts', 'invoice_id::text = $1'],
    ['audit_log', 'entity_id = $1'],
  ],
  certificate: [['certificates', 'id::text = $1']],
  file: [['files', 'id::text = $1']],
  part: [['parts', 'id::text = $1']],
  customer: [
    ['customers', 'id::text = $1'],
    ['users', 'customer_id::text = $1'],
  ],
  checkout: [
    ['invoice_checkouts', 'id = $1'],
    ['payments', 'invoice_id = (select invoice_id from invoice_checkouts where id = $1)'],
  ],
};

type Company = {
  code: Code;
  cookie: string;
  contactName: string;
  ids: Record<Kind, string>;
  /** The record's number as the customer reads it, where it has one. */
  numbers: Partial<Record<Kind, string>>;
  amounts: Partial<Record<Kind, number>>;
  /** Everything of the company's that another company must never read: names, numbers, ids. */
  strings: string[];
  allIds: string[];
};
const companies = {} as Record<Code, Company>;
const sessionIds: string[] = [];

// --- what a customer can reach, from the code and the build -------------------------------------

const DIST = process.env.NEXT_DIST_DIR ?? '.next-test';
const customerMay = (g: Guard) => guardAllows(g, (p) => roleCan('customer', p as Permission));
const SEGMENT = /\[\[?(?:\.\.\.)?([A-Za-z]+)\]?\]/g; // [id], [...id], [[...id]]
const paramsOf = (pattern: string) => [...pattern.matchAll(SEGMENT)].map((m) => m[1]!);
const fill = (pattern: string, values: Record<string, string>) => pattern.replace(SEGMENT, (_m, name: string) => values[name] ?? `[${name}]`);
const ownParams = (self: Company) => Object.fromEntries(Object.entries(PARAM_KIND).map(([p, k]) => [p, self.ids[k]]));

type Route = { method: string; pattern: string; guard: Guard; file: string };
const routes: Route[] = [...discoverPages().map((p) => ({ ...p, method: 'GET' })), ...discoverApiRoutes()];
const isCustomerRoute = (r: Route) => customerMay(r.guard) || /^\/(api\/)?portal(\/|$)/.test(r.pattern);
const customerRoutes = routes.filter(isCustomerRoute);
const actions = discoverActions(DIST);

type Sent = { url: string; init?: RequestInit };
type Case = {
  name: string;
  kind: Kind;
  /** A asking for its own record: proves the route answers for real records (200) or refuses customers alike (403). */
  ownStatus?: number;
  /** Text the refusal carries (else a 403 or 404), so a form that never reached the lookup cannot pass. */
  refusal?: RegExp;
  send: (id: string, self: Company, other: Company) => Sent;
};

function routeCases(r: Route): Case[] {
  const init: RequestInit | undefined = r.method === 'GET' ? undefined : { method: r.method, body: '{}', headers: { 'content-type': 'application/json', origin: APP_URL } };
  const params = paramsOf(r.pattern);
  return params.map((p) => ({
    name: `${r.method} ${r.pattern}${params.length > 1 ? ` (${p})` : ''}`,
    kind: PARAM_KIND[p]!,
    // A write's own case runs once in beforeAll (opening a payment), not per direction.
    ownStatus: !customerMay(r.guard) ? 403 : r.method === 'GET' ? 200 : undefined,
    send: (id, self) => ({ url: fill(r.pattern, { ...ownParams(self), [p]: id }), init }),
  }));
}

// Customer routes with an id, and staff routes whose ids name customers' records (customers are
// refused there: the refusal must not depend on whether the record exists).
const withIds = routes.filter((r) => paramsOf(r.pattern).length > 0);
const uncovered = withIds.filter((r) => isCustomerRoute(r) && paramsOf(r.pattern).some((p) => !PARAM_KIND[p]));
const staffRoutes = withIds.filter((r) => !isCustomerRoute(r) && r.guard.kind === 'permission' && paramsOf(r.pattern).every((p) => PARAM_KIND[p]));

// The same routes with the query strings they act on.
const VARIANTS: Case[] = [
  { name: 'GET /api/portal/certificates/[certificateId]?download=1', kind: 'certificate', ownStatus: 200, send: (id) => ({ url: `/api/portal/certificates/${id}?download=1` }) },
  { name: 'GET /api/files/[fileId]?inline=1', kind: 'file', ownStatus: 200, send: (id) => ({ url: `/api/files/${id}?inline=1` }) },
  { name: 'GET /portal/quotes/[quoteId]?done=accepted', kind: 'quote', ownStatus: 200, send: (id) => ({ url: `/portal/quotes/${id}?done=accepted` }) },
  { name: 'GET /portal/invoices/[invoiceId]?payment=cancelled', kind: 'invoice', ownStatus: 200, send: (id) => ({ url: `/portal/invoices/${id}?payment=cancelled` }) },
  {
    name: "GET /portal/invoices/[invoiceId]?payment=done&session=<that company's checkout>",
    kind: 'invoice',
    ownStatus: 200,
    send: (id, _self, other) => ({ url: `/portal/invoices/${id}?payment=done&session=${other.ids.checkout}` }),
  },
  {
    name: "GET /portal/invoices/<own invoice>?payment=done&session=[the other company's checkout]",
    kind: 'checkout',
    ownStatus: 200,
    // The contact's own page, as for a made-up session: the other company's payment is not looked at.
    refusal: /Your payment is being confirmed/,
    send: (id, self) => ({ url: `/portal/invoices/${self.ids.invoice}?payment=done&session=${id}` }),
  },
];

// What each server action a customer may call takes as a record id, and the rest of a valid form.
// `coveredBy`: a record id of a kind these two companies' fixtures do not make, proven elsewhere.
const ACTION_FORMS: Record<string, { kind: Kind; field: string; fields: Record<string, string>; refusal: RegExp } | 'takes no record id' | { coveredBy: string }> = {
  acceptQuoteAction: { kind: 'quote', field: 'quoteId', fields: { poNumber: 'ISO-PROBE-1', neededBy: '' }, refusal: /That quote does not exist\./ },
  declineQuoteAction: { kind: 'quote', field: 'quoteId', fields: { reason: 'Probing another company' }, refusal: /That quote does not exist\./ },
  payInvoiceAction: { kind: 'invoice', field: 'invoiceId', fields: {}, refusal: /That invoice was not found\./ },
  changePasswordAction: 'takes no record id',
  setUnitSystemAction: 'takes no record id',
  newRecoveryCodesAction: 'takes no record id',
  turnOffSecondFactorAction: 'takes no record id',
  createTokenAction: 'takes no record id',
  // Another company's token reads as not found: tests/integration/api/tokens.test.ts ('who a token is').
  revokeTokenAction: { coveredBy: 'tests/integration/api/tokens.test.ts' },
};
const customerActions = actions.filter((a) => customerMay(a.guard));

const actionCases: Case[] = customerActions.flatMap((a) => {
  const form = ACTION_FORMS[a.name];
  if (!form || form === 'takes no record id' || 'coveredBy' in form) return [];
  return [
    {
      name: `action ${a.name} (posted from the contact's own ${a.pagePattern})`,
      kind: form.kind,
      refusal: form.refusal,
      send: (id: string, self: Company) => ({ url: fill(a.pagePattern, ownParams(self)), init: actionRequest(a.id, { ...form.fields, [form.field]: id }, APP_URL) }),
    },
  ];
});

const CASES: Case[] = [...customerRoutes.filter((r) => !uncovered.includes(r)).flatMap(routeCases), ...VARIANTS, ...actionCases, ...staffRoutes.flatMap(routeCases)];

// List pages: every customer page without an id, and what each must show of the contact's own.
const LIST_KIND: Record<string, Kind> = { quotes: 'quote', orders: 'workOrder', certificates: 'certificate', invoices: 'invoice' };
const lists = customerRoutes.filter((r) => r.method === 'GET' && paramsOf(r.pattern).length === 0);

// --- answers and their comparison ----------------------------------------------------------------

type Answer = { status: number; headers: Record<string, string>; body: string };
// Differ per request whatever was asked (a refreshed session cookie carries a new expiry).
const PER_REQUEST_HEADERS = new Set(['date', 'set-cookie']);
const ISO_TIME = /\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(?:\.\d+)?Z/g;

async function ask(self: Company, sent: Sent, asked: Record<string, string>): Promise<Answer> {
  const headers = new Headers(sent.init?.headers);
  headers.set('cookie', self.cookie);
  const res = await fetch(`${APP_URL}${sent.url}`, { ...sent.init, headers, redirect: 'manual' });
  const body = await res.text();
  const nonce = res.headers.get('content-security-policy')?.match(/'nonce-([^']+)'/)?.[1];
  // What the caller sent comes back in the page (the address, a form's values): named, not compared.
  const clean = (s: string) => {
    let out = nonce ? s.replaceAll(nonce, '{NONCE}') : s;
    for (const [name, value] of Object.entries(asked)) out = out.replaceAll(value, `{${name}}`);
    return out.replace(ISO_TIME, '{TIME}');
  };
  return {
    status: res.status,
    headers: Object.fromEntries([...res.headers].filter(([k]) => !PER_REQUEST_HEADERS.has(k)).map(([k, v]) => [k, clean(v)])),
    body: clean(body),
  };
}

function randomIdLike(kind: Kind, real: string): string {
  if (kind !== 'checkout') return randomUUID();
  return `cs_${randomBytes(real.length).toString('hex')}`.slice(0, real.length);
}

async function snapshot(kind: Kind, id: string): Promise<unknown[]> {
  const out: unknown[] = [];
  for (const [table, where] of ROWS[kind]) {
    const r = await pool.query(`select coalesce(jsonb_agg(to_jsonb(t) - 'bytes' order by to_jsonb(t)::text), '[]'::jsonb) as rows from ${table} t where ${where}`, [id]);
    out.push({ table, rows: r.rows[0].rows });
  }
  return out;
}

const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
/** As text, HTML and JSON write it, standing alone (not the start of a longer number). */
function written(s: string): RegExp {
  const forms = [s, s.replaceAll('&', '&amp;').replaceAll("'", '&#x27;'), s.replaceAll('&', '\\u0026')].map(escapeRe);
  return new RegExp(`(?<![A-Za-z0-9])(?:${[...new Set(forms)].join('|')})(?![0-9A-Za-z])`);
}
// Script and style addresses are build hashes, not data.
const withoutAssets = (body: string) => body.replace(/\/_next\/static\/[^"' )\\]+/g, '');

function leaks(body: string, of: Company, kind: Kind | null, json: boolean): string[] {
  const text = withoutAssets(body);
  const found = [...of.strings, ...of.allIds].filter((s) => written(s).test(text));
  const cents = kind ? of.amounts[kind] : undefined;
  if (cents !== undefined) {
    if (text.includes(formatMoney(cents))) found.push(formatMoney(cents));
    if (json && new RegExp(`(?<![\\w.])${cents}(?![\\w.])`).test(text)) found.push(String(cents));
  }
  return found;
}

// --- the two companies' records --------------------------------------------------------------------

async function one<T>(text: string, values: unknown[]): Promise<T> {
  return (await pool.query(text, values)).rows[0] as T;
}

async function prepare(code: Code): Promise<Company> {
  const spec = COMPANIES[code];
  const contact = await one<{ name: string; email: string; customer_id: string }>('select name, email, customer_id from users where id = $1', [spec.userId]);
  const customerId = contact.customer_id;
  const session = randomBytes(20).toString('hex');
  await pool.query(`insert into sessions (id, user_id, expires_at, second_factor) values ($1, $2, now() + interval '1 hour', true)`, [session, spec.userId]);
  sessionIds.push(session);

  // A quote waiting on the contact and an invoice with an open balance: accepting, declining or
  // paying them would work for their own company, so a slip in the scoping would show as a change.
  const estimator = await staff('estimator');
  const part = await one<{ id: string; part_number: string }>('select id, part_number from parts where customer_id = $1 and part_number = $2', [customerId, spec.part]);
  const quote = await createQuote(estimator, { customerId, isRush: false, notes: `Isolation check ${suffix()}` });
  await addQuoteLine(estimator, { quoteId: quote.id, partId: part.id, finishId: await finishId(spec.finish), quantity: 100, basis: 'piece' });
  await markQuoteSent(estimator, { quoteId: quote.id, contactUserId: spec.userId });
  const quoteRow = await one<{ number: string; revision: string; total_cents: number }>('select number, revision, total_cents from quotes where id = $1', [quote.id]);

  const owner = await staff('owner');
  const order = await makeOrder({ customer: code, quantity: spec.invoicedPieces, poNumber: `ISO-${code}-${suffix()}` });
  const invoice = await issueInvoice(owner.id, { customerId, orderIds: [order.id], extras: [] });
  const invoiceRow = await one<{ total_cents: number }>('select total_cents from invoices where id = $1', [invoice.id]);

  // The demo seed certifies a lot for each company; one is issued the product's way if not.
  let cert = await one<{ id: string; number: string; pdf_file_id: string } | undefined>(
    'select id, number, pdf_file_id from certificates where customer_id = $1 order by signed_at limit 1',
    [customerId],
  );
  if (!cert) {
    const lot = await createLot(db, { customerCode: code, quantity: 20 });
    await recordReadings(await actorFor(db, PLATER), { workOrderId: lot.id, entry: 'manual', readings: passingReadings(5) });
    await inspect(db, lot.id);
    const issued = await issueCertificate(await actorFor(db, SUPERVISOR), lot.id);
    cert = { id: issued.id, number: issued.number, pdf_file_id: issued.pdfFileId };
  }

  const strings = (await pool.query<{ s: string }>(
    `select name as s from customers where id = $1
     union select billing_address from customers where id = $1
     union select shipping_address from customers where id = $1
     union select name from users where customer_id = $1
     union select email from users where customer_id = $1
     union select number from quotes where customer_id = $1
     union select number from work_orders where customer_id = $1
     union select po_number from work_orders where customer_id = $1
     union select number from invoices where customer_id = $1
     union select number from certificates where customer_id = $1
     union select part_number from parts where customer_id = $1`,
    [customerId],
  )).rows
    .flatMap((r) => (r.s ?? '').split(/\r?\n/))
    .map((s) => s.trim())
    .filter((s) => s.length >= 4);
  const allIds = (await pool.query<{ id: string }>(
    `select id::text from quotes where customer_id = $1
     union select id::text from work_orders where customer_id = $1
     union select id::text from invoices where customer_id = $1
     union select id::text from certificates where customer_id = $1
     union select pdf_file_id::text from certificates where customer_id = $1
     union select id::text from parts where customer_id = $1
     union select id from users where customer_id = $1
     union select $1::text`,
    [customerId],
  )).rows.map((r) => r.id);

  return {
    code,
    cookie: `ampwright_session=${session}`,
    contactName: contact.name,
    ids: { quote: quote.id, workOrder: order.id, invoice: invoice.id, certificate: cert.id, file: cert.pdf_file_id, part: part.id, customer: customerId, checkout: '' },
    numbers: { quote: quoteLabel(quoteRow), workOrder: order.number, invoice: invoice.number, certificate: cert.number, part: part.part_number },
    amounts: { quote: quoteRow.total_cents, invoice: invoiceRow.total_cents },
    strings,
    allIds,
  };
}

beforeAll(async () => {
  for (const code of Object.keys(COMPANIES) as Code[]) companies[code] = await prepare(code);
  // Text both companies own (a PO number or part number that happens to be the same) tells
  // neither's secret: only what is one company's alone counts as a leak.
  const [a, b] = Object.values(companies);
  const shared = new Set(a!.strings.filter((x) => b!.strings.includes(x)));
  for (const c of [a!, b!]) c.strings = c.strings.filter((x) => !shared.has(x));
  // Each contact opens a payment for its own invoice through the route under test (its own case),
  // which leaves a checkout session the other company can then try to use.
  for (const c of Object.values(companies)) {
    const res = await fetch(`${APP_URL}/api/portal/invoices/${c.ids.invoice}/checkout`, {
      method: 'POST',
      body: '{}',
      headers: { cookie: c.cookie, 'content-type': 'application/json', origin: APP_URL },
    });
    expect(res.status, `${c.code} opens a payment for its own invoice`).toBe(201);
    expect(((await res.json()) as { url?: string }).url).toMatch(/^http/);
    c.ids.checkout = (await one<{ id: string }>('select id from invoice_checkouts where invoice_id = $1 order by created_at desc limit 1', [c.ids.invoice])).id;
  }
});

afterAll(async () => {
  await pool.query('delete from sessions where id = any($1)', [sessionIds]);
  await db.destroy();
});

// --- the tests ---------------------------------------------------------------------------------------

describe('every record a customer can reach by id has a case', () => {
  it('finds the customer routes and actions in the code and the build', () => {
    expect(customerRoutes.filter((r) => paramsOf(r.pattern).length).length).toBeGreaterThanOrEqual(8);
    expect(customerActions.map((a) => a.name)).toEqual(expect.arrayContaining(['acceptQuoteAction', 'declineQuoteAction', 'payInvoiceAction']));
  });

  it('no customer route has an id this test does not know', () => {
    expect(uncovered.map((r) => `${r.method} ${r.pattern} (${r.file}): give its parameter a kind in PARAM_KIND`)).toEqual([]);
  });

  it('every server action a customer may call is described', () => {
    expect(customerActions.filter((a) => !ACTION_FORMS[a.name]).map((a) => `${a.name} (${a.file}): add it to ACTION_FORMS`)).toEqual([]);
  });
});

describe.each(DIRECTIONS)("[%s contact] asks for %s's records", (selfCode, otherCode) => {
  it.each(CASES.map((c) => [c.name, c] as const))('%s', async (_name, c) => {
    const self = companies[selfCode];
    const other = companies[otherCode];
    const foreignId = other.ids[c.kind];
    const unknownId = randomIdLike(c.kind, foreignId);
    const before = await snapshot(c.kind, foreignId);

    const foreign = await ask(self, c.send(foreignId, self, other), { ID: foreignId });
    const unknown = await ask(self, c.send(unknownId, self, other), { ID: unknownId });

    // Soft, so one run names everything that gave the record away.
    expect.soft(foreign.status, `${c.name}: the status tells whether the record exists`).toBe(unknown.status);
    expect.soft(foreign.headers, `${c.name}: the headers tell whether the record exists`).toEqual(unknown.headers);
    expect.soft(foreign.body, `${c.name}: the body tells whether the record exists`).toBe(unknown.body);
    if (c.refusal) expect.soft(foreign.body, `${c.name}: the refusal`).toMatch(c.refusal);
    else expect.soft([403, 404], `${c.name}: refused`).toContain(foreign.status);
    expect.soft(leaks(foreign.body, other, c.kind, /json|x-component/.test(foreign.headers['content-type'] ?? '')), `${c.name}: ${otherCode}'s data in the answer`).toEqual([]);
    expect.soft(await snapshot(c.kind, foreignId), `${c.name}: ${otherCode}'s record changed`).toEqual(before);

    if (c.ownStatus !== undefined) {
      const own = await ask(self, c.send(self.ids[c.kind], self, other), {});
      expect(own.status, `${c.name} for the contact's own record`).toBe(c.ownStatus);
      // On a page of its own the leak check must find the contact's own record: it can see a leak.
      const number = self.numbers[c.kind];
      if (own.status === 200 && number && own.headers['content-type']?.startsWith('text/html')) expect(leaks(own.body, self, c.kind, false)).toContain(number);
    }
  });

  it.each(lists.map((r) => r.pattern))('list %s shows only its own company', async (pattern) => {
    const self = companies[selfCode];
    const other = companies[otherCode];
    // Also with the other company's ids in the address, as a list filter might read them.
    const planted = { customerId: other.ids.customer, quoteId: other.ids.quote, invoiceId: other.ids.invoice, workOrderId: other.ids.workOrder };
    const asked = Object.fromEntries(Object.entries(planted).map(([k, v]) => [k.toUpperCase(), v]));
    for (const url of [pattern, `${pattern}?${new URLSearchParams(planted).toString()}`]) {
      const answer = await ask(self, { url }, url === pattern ? {} : asked);
      expect(answer.status, url).toBe(200);
      expect(leaks(answer.body, other, null, false), `${url}: ${otherCode}'s records in ${selfCode}'s list`).toEqual([]);
      const kind = LIST_KIND[pattern.split('/').pop()!];
      // A JSON list of the API names the company by its id on each row (a company may have no shipments yet).
      const isApi = pattern.startsWith('/api/v1/');
      if (isApi && (JSON.parse(answer.body) as { data: unknown[] }).data.length === 0) {
        expect(pattern, `${url} is empty for ${selfCode}`).toBe('/api/v1/shipments');
        continue;
      }
      const mine = isApi ? self.ids.customer : kind ? self.numbers[kind]! : self.contactName;
      expect(leaks(answer.body, self, null, false), `${url} shows the contact's own ${kind ?? 'name'}, and the leak check sees it`).toContain(mine);
    }
  });
});
