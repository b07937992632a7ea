import 'server-only';
import { sql, type Kysely, type SqlBool } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, ProcessStep, QuoteStatus } from '@/db/types';
import type { GridColumns, GridOptions } from '@/lib/grid/server';
import type { StoredCalculation } from './mutations';
import type { LinePrice } from './pricing';

type Db = Kysely<Database>;

// A sent quote past its date reads as expired here, before anything rewrites its row.
const effectiveStatus = sql<QuoteStatus>`case when q.status = 'sent' and q.expires_at <= now() then 'expired' else q.status end`;

export function quoteGridSelect(conn: Db = defaultDb) {
  return conn
    .selectFrom('quotes as q')
    .innerJoin('customers as c', 'c.id', 'q.customer_id')
    .leftJoin('users as u', 'u.id', 'q.created_by')
    .select([
      'q.id as id',
      'q.number as number',
      'q.revision as revision',
      'c.name as customer',
      effectiveStatus.as('status'),
      'q.total_cents as total_cents',
      'q.created_at as created_at',
      'q.expires_at as expires_at',
      'u.name as estimator',
    ]);
}

export const QUOTE_GRID_COLUMNS: GridColumns = {
  number: { expr: 'q.number', type: 'text', searchable: true, header: 'Quote' },
  revision: { expr: 'q.revision', type: 'text', sortable: false, header: 'Revision' },
  customer: { expr: 'c.name', type: 'text', searchable: true, header: 'Customer' },
  status: {
    expr: effectiveStatus,
    type: 'text',
    searchable: true,
    header: 'Status',
    // Filters compare the stored status (indexed, with statistics) rather than the computed one.
    choices: {
      values: ['draft', 'sent', 'accepted', 'declined', 'expired', 'superseded'] satisfies QuoteStatus[],
      match: (v) =>
        v === 'expired'
          ? sql<SqlBool>`(q.status = 'expired' or (q.status = 'sent' and q.expires_at <= now()))`
          : v === 'sent'
            ? sql<SqlBool>`(q.status = 'sent' and (q.expires_at is null or q.expires_at > now()))`
            : sql<SqlBool>`q.status = ${v}`,
    },
  },
  total_cents: { expr: 'q.total_cents', type: 'number', header: 'Total (cents)' },
  created_at: { expr: 'q.created_at', type: 'date', header: 'Created' },
  expires_at: { expr: 'q.expires_at', type: 'date', header: 'Valid until' },
  estimator: { expr: 'u.name', type: 'text', searchable: true, header: 'Estimator' },
};

/** GET /api/quotes: the same list for every office reader, so its answers are kept (lib/grid/list-cache.ts). */
export const QUOTE_GRID = {
  columns: QUOTE_GRID_COLUMNS,
  key: 'q.id',
  defaultSort: { colId: 'number', dir: 'desc' },
  fileName: 'quotes',
  // A sent quote turns "expired" when its date passes; the next such instant is part of the key.
  cache: { name: 'quotes', clock: sql`(select min(expires_at) from quotes where status = 'sent' and expires_at > now())` },
} as const satisfies Omit<GridOptions<never>, 'mapRow' | 'db'>;

export type QuoteLineView = {
  id: string;
  lineNo: number;
  quantity: number;
  basis: Database['quote_lines']['pricing_basis'];
  partNumber: string;
  partRevision: string;
  partDescription: string;
  finishId: string;
  finishCode: string;
  finishName: string;
  specText: string;
  processRoute: ProcessStep[];
  computedTotalCents: number;
  totalCents: number;
  unitPriceCents: number;
  override: { cents: number; reason: string; by: string | null; at: Date | null } | null;
  cost: LinePrice;
  calculation: StoredCalculation;
};

async function linesOf(conn: Db, quoteId: string): Promise<QuoteLineView[]> {
  const rows = await conn
    .selectFrom('quote_lines as l')
    .innerJoin('parts as p', 'p.id', 'l.part_id')
    .innerJoin('finishes as f', 'f.id', 'l.finish_id')
    .leftJoin('users as o', 'o.id', 'l.override_by')
    .select([
      'l.id', 'l.line_no', 'l.quantity', 'l.pricing_basis', 'l.computed_total_cents', 'l.total_cents', 'l.unit_price_cents',
      'l.override_total_cents', 'l.override_reason', 'l.override_at', 'l.cost', 'l.calculation',
      'p.part_number', 'p.revision as part_revision', 'p.description as part_description',
      'l.finish_id', 'f.code as finish_code', 'f.name as finish_name', 'f.spec_text', 'f.process_route', 'o.name as override_by_name',
    ])
    .where('l.quote_id', '=', quoteId)
    .orderBy('l.line_no')
    .execute();
  return rows.map((r) => ({
    id: r.id,
    lineNo: r.line_no,
    quantity: r.quantity,
    basis: r.pricing_basis,
    partNumber: r.part_number,
    partRevision: r.part_revision,
    partDescription: r.part_description,
    finishId: r.finish_id,
    finishCode: r.finish_code,
    finishName: r.finish_name,
    specText: r.spec_text,
    processRoute: r.process_route,
    computedTotalCents: r.computed_total_cents,
    totalCents: r.total_cents,
    unitPriceCents: r.unit_price_cents,
    override:
      r.override_total_cents === null
        ? null
        : { cents: r.override_total_cents, reason: r.override_reason ?? '', by: r.override_by_name, at: r.override_at },
    cost: r.cost as LinePrice,
    calculation: r.calculation as StoredCalculation,
  }));
}

function quoteHeader(conn: Db) {
  return conn
    .selectFrom('quotes as q')
    .innerJoin('customers as c', 'c.id', 'q.customer_id')
    .innerJoin('rate_sets as r', 'r.id', 'q.rate_set_id')
    .leftJoin('users as contact', 'contact.id', 'q.contact_user_id')
    .leftJoin('users as creator', 'creator.id', 'q.created_by')
    .leftJoin('users as decider', 'decider.id', 'q.decided_by')
    .select([
      'q.id', 'q.number', 'q.revision', 'q.customer_id', 'q.contact_user_id', 'q.status', 'q.valid_days', 'q.is_rush', 'q.notes',
      'q.total_cents', 'q.previous_revision_id', sql<Date>`q.created_at`.as('created_at'), 'q.sent_at', 'q.expires_at', 'q.decided_at', 'q.po_number',
      'q.decline_reason', 'q.created_by', 'q.turnaround_days',
      effectiveStatus.as('effective_status'),
      'c.name as customer_name', 'c.code as customer_code', 'c.billing_address', 'c.shipping_address', 'c.payment_terms_days',
      'r.effective_from as rates_from',
      'contact.name as contact_name', 'contact.email as contact_email',
      'creator.name as creator_name', 'creator.email as creator_email',
      'decider.name as decider_name',
    ]);
}

export type QuoteDetail = NonNullable<Awaited<ReturnType<typeof getQuote>>>;

export async function getQuote(quoteId: string, conn: Db = defaultDb) {
  const q = await quoteHeader(conn).where('q.id', '=', quoteId).executeTakeFirst();
  if (!q) return null;
  const [lines, revisions] = await Promise.all([
    linesOf(conn, q.id),
    conn.selectFrom('quotes').select(['id', 'revision', 'status']).where('number', '=', q.number).orderBy('revision').execute(),
  ]);
  return { ...q, lines, revisions };
}

/** A customer contact's view: their own company's quotes only, never drafts or old revisions. */
export async function getPortalQuote(customerId: string, quoteId: string, conn: Db = defaultDb) {
  const q = await quoteHeader(conn)
    .where('q.id', '=', quoteId)
    .where('q.customer_id', '=', customerId)
    .where('q.status', 'not in', ['draft', 'superseded'])
    .executeTakeFirst();
  if (!q) return null;
  const [lines, workOrders] = await Promise.all([
    linesOf(conn, q.id),
    conn
      .selectFrom('work_orders as w')
      .innerJoin('quote_lines as l', 'l.id', 'w.quote_line_id')
      .select(['w.id', 'w.number'])
      .where('l.quote_id', '=', q.id)
      .where('w.customer_id', '=', customerId)
      .orderBy('w.number')
      .execute(),
  ]);
  return { ...q, lines, workOrders };
}

export async function findPortalQuotes(customerId: string, conn: Db = defaultDb) {
  return conn
    .selectFrom('quotes as q')
    .select(['q.id', 'q.number', 'q.revision', 'q.total_cents', 'q.sent_at', 'q.expires_at', 'q.po_number', 'q.decided_at', effectiveStatus.as('status')])
    .select((eb) => eb.selectFrom('quote_lines').select(sql<number>`count(*)::int`.as('n')).whereRef('quote_id', '=', 'q.id').as('line_count'))
    .where('q.customer_id', '=', customerId)
    .where('q.status', 'not in', ['draft', 'superseded'])
    .orderBy('q.sent_at', 'desc')
    .limit(200)
    .execute();
}

export async function findQuoteChoices(customerId: string, conn: Db = defaultDb) {
  const [parts, finishes, contacts] = await Promise.all([
    conn
      .selectFrom('parts')
      .select(['id', 'part_number', 'revision', 'description', 'area_dm2', 'weight_g'])
      .where('customer_id', '=', customerId)
      .orderBy('part_number')
      .execute(),
    conn.selectFrom('finishes').select(['id', 'code', 'name', 'spec_text', 'method']).where('is_active', '=', true).orderBy('code').execute(),
    conn
      .selectFrom('users')
      .select(['id', 'name', 'email'])
      .where('role', '=', 'customer')
      .where('customer_id', '=', customerId)
      .where('is_active', '=', true)
      .orderBy('name')
      .execute(),
  ]);
  return { parts, finishes, contacts };
}

export async function findCustomersForQuote(conn: Db = defaultDb) {
  return conn.selectFrom('customers').select(['id', 'code', 'name']).orderBy('name').execute();
}
