import 'server-only';
import { type Expression, sql, type SqlBool } from 'kysely';
import { db } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { isoDate } from '@/lib/billing/dates';
import { openBalanceCents } from '@/lib/billing/arithmetic';
import { AppError } from '@/lib/errors';
import { plannedDatesOf } from '@/lib/schedule/queries';
import type { PageQuery } from './schemas';
import type { z } from 'zod';
import type * as S from './schemas';

// The records /api/v1 reads, a page at a time by key (never by offset). A customer's caller sees
// only their own company's rows: the scope is in each query's WHERE, from the caller's own
// customer id, never from the request.

type Page<T> = { data: T[]; next: string | null };

function encodeAfter(values: readonly string[]): string {
  return Buffer.from(JSON.stringify(values)).toString('base64url');
}

function decodeAfter(after: string | undefined, arity: number): string[] | null {
  if (after === undefined) return null;
  try {
    const v = JSON.parse(Buffer.from(after, 'base64url').toString('utf8'));
    if (Array.isArray(v) && v.length === arity && v.every((x) => typeof x === 'string' && x.length < 200)) return v;
  } catch {
    // falls through to the message below
  }
  throw new AppError('BAD_INPUT', 'after must be the `next` of an earlier page.', { after: ['Not the `next` of an earlier page.'] });
}

function pageFrom<R, T>(rows: R[], limit: number, key: (r: R) => string[], map: (r: R) => T): Page<T> {
  const more = rows.length > limit;
  const kept = more ? rows.slice(0, limit) : rows;
  return { data: kept.map(map), next: more ? encodeAfter(key(kept[kept.length - 1]!)) : null };
}

/** The caller's customer, or null for staff (who see every customer). */
function customerScope(user: SessionUser): { customerId: string } | null {
  if (user.role !== 'customer') return null;
  if (!user.customerId) throw new AppError('FORBIDDEN', 'This account is not linked to a customer.');
  return { customerId: user.customerId };
}

function scoped(column: Expression<unknown>, user: SessionUser): Expression<SqlBool> {
  const scope = customerScope(user);
  return scope ? sql<SqlBool>`${column} = ${scope.customerId}::uuid` : sql<SqlBool>`true`;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export async function listParts(user: SessionUser, q: PageQuery): Promise<Page<z.infer<typeof S.part>>> {
  const after = decodeAfter(q.after, 2);
  const rows = await db
    .selectFrom('parts as p')
    .select(['p.id', 'p.customer_id', 'p.part_number', 'p.revision', 'p.description', 'p.substrate', 'p.area_dm2', 'p.weight_g'])
    .where(scoped(sql.ref('p.customer_id'), user))
    .$if(after !== null, (b) => b.where(sql<SqlBool>`(p.part_number, p.id) > (${after![0]}, ${after![1]}::uuid)`))
    .orderBy('p.part_number')
    .orderBy('p.id')
    .limit(q.limit + 1)
    .execute();
  return pageFrom(rows, q.limit, (r) => [r.part_number, r.id], (r) => ({
    id: r.id,
    customerId: r.customer_id,
    partNumber: r.part_number,
    revision: r.revision,
    description: r.description,
    substrate: r.substrate,
    areaDm2: Number(r.area_dm2),
    weightG: r.weight_g === null ? null : Number(r.weight_g),
  }));
}

export async function listQuotes(user: SessionUser, q: z.infer<typeof S.quoteListQuery>): Promise<Page<z.infer<typeof S.quote>>> {
  const after = decodeAfter(q.after, 2);
  const isCustomer = customerScope(user) !== null;
  const rows = await db
    .selectFrom('quotes as q')
    .select(['q.id', 'q.number', 'q.revision', 'q.customer_id', 'q.status', 'q.is_rush', 'q.total_cents', 'q.po_number', 'q.turnaround_days', 'q.sent_at', 'q.expires_at', 'q.decided_at'])
    .where(scoped(sql.ref('q.customer_id'), user))
    // A customer never sees drafts or replaced revisions, as in the portal.
    .$if(isCustomer, (b) => b.where('q.status', 'not in', ['draft', 'superseded']))
    .$if(q.status !== undefined, (b) => b.where('q.status', '=', q.status!))
    .$if(after !== null, (b) => b.where(sql<SqlBool>`(q.number, q.id) < (${after![0]}, ${after![1]}::uuid)`))
    .orderBy('q.number', 'desc')
    .orderBy('q.id', 'desc')
    .limit(q.limit + 1)
    .execute();
  return pageFrom(rows, q.limit, (r) => [r.number, r.id], (r) => ({
    id: r.id,
    number: r.number,
    revision: r.revision,
    customerId: r.customer_id,
    status: r.status,
    isRush: r.is_rush,
    totalCents: r.total_cents,
    poNumber: r.po_number,
    turnaroundDays: r.turnaround_days,
    sentAt: iso(r.sent_at),
    expiresAt: iso(r.expires_at),
    decidedAt: iso(r.decided_at),
  }));
}

export async function listWorkOrders(user: SessionUser, q: z.infer<typeof S.workOrderListQuery>): Promise<Page<z.infer<typeof S.workOrder>>> {
  const after = decodeAfter(q.after, 1);
  const rows = await db
    .selectFrom('work_orders as w')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .select([
      'w.id', 'w.number', 'w.customer_id', 'w.part_id', 'p.part_number', 'f.code as finish_code', 'f.spec_text', 'w.po_number', 'w.state', 'w.is_rush',
      'w.quantity_ordered', 'w.quantity_received', 'w.quantity_shipped', 'w.quantity_scrapped', 'w.quantity_held', 'w.due_date',
    ])
    .select((eb) => [
      eb.selectFrom('receipts as r').whereRef('r.work_order_id', '=', 'w.id').select((e) => e.fn.min('r.received_at').as('m')).as('first_received_at'),
      eb.selectFrom('shipments as s').whereRef('s.work_order_id', '=', 'w.id').select((e) => e.fn.max('s.shipped_at').as('m')).as('last_shipped_at'),
    ])
    .where(scoped(sql.ref('w.customer_id'), user))
    .$if(q.state !== undefined, (b) => b.where('w.state', '=', q.state!))
    .$if(after !== null, (b) => b.where('w.number', '<', after![0]!))
    .orderBy('w.number', 'desc')
    .limit(q.limit + 1)
    .execute();
  const planned = await plannedDatesOf(rows.filter((r) => ['accepted', 'received', 'in_process'].includes(r.state)).map((r) => r.id));
  return pageFrom(rows, q.limit, (r) => [r.number], (r) => ({
    id: r.id,
    number: r.number,
    customerId: r.customer_id,
    partId: r.part_id,
    partNumber: r.part_number,
    finishCode: r.finish_code,
    specification: r.spec_text,
    poNumber: r.po_number,
    state: r.state,
    isRush: r.is_rush,
    quantities: { ordered: r.quantity_ordered, received: r.quantity_received, shipped: r.quantity_shipped, scrapped: r.quantity_scrapped, held: r.quantity_held },
    dueDate: r.due_date ? isoDate(r.due_date) : null,
    planned: planned.get(r.id) ?? null,
    actual: { firstReceivedAt: iso(r.first_received_at as Date | null), lastShippedAt: iso(r.last_shipped_at as Date | null) },
  }));
}

export async function listShipments(user: SessionUser, q: PageQuery): Promise<Page<z.infer<typeof S.shipment>>> {
  const after = decodeAfter(q.after, 1);
  const rows = await db
    .selectFrom('shipments as s')
    .innerJoin('work_orders as w', 'w.id', 's.work_order_id')
    .leftJoin('certificates as c', 'c.id', 's.certificate_id')
    .select(['s.id', 's.number', 's.work_order_id', 'w.number as wo_number', 's.customer_id', 's.shipped_at', 's.quantity', 's.containers', 's.weight_kg', 's.carrier', 's.tracking_number', 'c.number as cert_number'])
    .where(scoped(sql.ref('s.customer_id'), user))
    .$if(after !== null, (b) => b.where('s.number', '<', after![0]!))
    .orderBy('s.number', 'desc')
    .limit(q.limit + 1)
    .execute();
  return pageFrom(rows, q.limit, (r) => [r.number], (r) => ({
    id: r.id,
    number: r.number,
    workOrderId: r.work_order_id,
    workOrderNumber: r.wo_number,
    customerId: r.customer_id,
    shippedAt: r.shipped_at.toISOString(),
    quantity: r.quantity,
    containers: r.containers,
    weightKg: r.weight_kg === null ? null : Number(r.weight_kg),
    carrier: r.carrier,
    trackingNumber: r.tracking_number,
    certificateNumber: r.cert_number,
  }));
}

export async function listCertificates(user: SessionUser, q: PageQuery): Promise<Page<z.infer<typeof S.certificate>>> {
  const after = decodeAfter(q.after, 1);
  const rows = await db
    .selectFrom('certificates as c')
    .innerJoin('work_orders as w', 'w.id', 'c.work_order_id')
    .select(['c.id', 'c.number', 'c.work_order_id', 'w.number as wo_number', 'c.customer_id', 'c.signed_at', 'c.signed_by_name'])
    .where(scoped(sql.ref('c.customer_id'), user))
    .$if(after !== null, (b) => b.where('c.number', '<', after![0]!))
    .orderBy('c.number', 'desc')
    .limit(q.limit + 1)
    .execute();
  return pageFrom(rows, q.limit, (r) => [r.number], (r) => ({
    id: r.id,
    number: r.number,
    workOrderId: r.work_order_id,
    workOrderNumber: r.wo_number,
    customerId: r.customer_id,
    signedAt: r.signed_at.toISOString(),
    signedBy: r.signed_by_name,
    pdf: `/api/v1/certificates/${r.id}/pdf`,
  }));
}

export async function listInvoices(user: SessionUser, q: PageQuery): Promise<Page<z.infer<typeof S.invoice>>> {
  const after = decodeAfter(q.after, 1);
  const rows = await db
    .selectFrom('invoices as i')
    .select(['i.id', 'i.number', 'i.customer_id', 'i.status', 'i.issued_on', 'i.due_on', 'i.currency', 'i.total_cents', 'i.credited_cents', 'i.paid_cents'])
    .where(scoped(sql.ref('i.customer_id'), user))
    .$if(after !== null, (b) => b.where('i.number', '<', after![0]!))
    .orderBy('i.number', 'desc')
    .limit(q.limit + 1)
    .execute();
  return pageFrom(rows, q.limit, (r) => [r.number], (r) => {
    const open = openBalanceCents({ totalCents: r.total_cents, paidCents: r.paid_cents, creditedCents: r.credited_cents });
    return {
      id: r.id,
      number: r.number,
      customerId: r.customer_id,
      status: r.status,
      issuedOn: isoDate(r.issued_on),
      dueOn: isoDate(r.due_on),
      currency: r.currency,
      totalCents: r.total_cents,
      creditedCents: r.credited_cents,
      paidCents: r.paid_cents,
      openCents: Math.max(0, open),
      creditOnAccountCents: Math.max(0, -open),
    };
  });
}

function analysisSelect() {
  return db
    .selectFrom('analyses as a')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .innerJoin('tank_analytes as ta', 'ta.id', 'a.analyte_id')
    .select(['a.id', 'a.tank_id', 't.code as tank_code', 'a.analyte_id', 'ta.name as analyte', 'a.value', 'a.unit', 'a.verdict', 'a.source', 'a.taken_at', 'a.supersedes_id'])
    .select(sql<string>`a.taken_at::text`.as('taken_text'));
}

type AnalysisRow = Awaited<ReturnType<ReturnType<typeof analysisSelect>['execute']>>[number];

export function analysisJson(r: Omit<AnalysisRow, 'taken_text'>): z.infer<typeof S.analysis> {
  return {
    id: r.id,
    tankId: r.tank_id,
    tankCode: r.tank_code,
    analyteId: r.analyte_id,
    analyte: r.analyte,
    value: Number(r.value),
    unit: r.unit,
    verdict: r.verdict,
    source: r.source,
    takenAt: r.taken_at.toISOString(),
    supersedesId: r.supersedes_id,
  };
}

export async function getAnalysis(id: string): Promise<z.infer<typeof S.analysis>> {
  const r = await analysisSelect().where('a.id', '=', id).executeTakeFirstOrThrow();
  return analysisJson(r);
}

/** Newest first; the cursor keeps the exact time as PostgreSQL wrote it (microseconds and all). */
export async function listAnalyses(q: z.infer<typeof S.analysisListQuery>): Promise<Page<z.infer<typeof S.analysis>>> {
  const after = decodeAfter(q.after, 2);
  const rows = await analysisSelect()
    .$if(q.tankId !== undefined, (b) => b.where('a.tank_id', '=', q.tankId!))
    .$if(q.since !== undefined, (b) => b.where('a.taken_at', '>=', new Date(q.since!)))
    .$if(after !== null, (b) => b.where(sql<SqlBool>`(a.taken_at, a.id) < (${after![0]}::timestamptz, ${after![1]}::uuid)`))
    .orderBy('a.taken_at', 'desc')
    .orderBy('a.id', 'desc')
    .limit(q.limit + 1)
    .execute();
  return pageFrom(rows, q.limit, (r) => [r.taken_text, r.id], analysisJson);
}
