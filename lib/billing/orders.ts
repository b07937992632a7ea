import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, WorkOrderState } from '@/db/types';
import { AppError } from '@/lib/errors';
import { lineAmountCents } from './arithmetic';
import { orderLine, type InvoiceableOrder } from './lines';
import { ordersWithOpenNonconformance } from './nonconformance-check';

// Work orders as invoicing sees them: priced facts of the order and its part, whether it has
// shipped, whether it is already on an invoice, and whether quality holds it.

export type OrderForInvoice = InvoiceableOrder & {
  customerId: string;
  customerName: string;
  state: WorkOrderState;
  shippedOn: string | null;
  invoiceNumber: string | null;
  hasOpenNonconformance: boolean;
};

type Where = { customerId?: string; orderIds?: readonly string[]; state?: WorkOrderState };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

export async function loadOrdersForInvoice(database: Kysely<Database>, where: Where): Promise<OrderForInvoice[]> {
  if (where.orderIds && where.orderIds.length === 0) return [];
  let q = database
    .selectFrom('work_orders as wo')
    .innerJoin('customers as c', 'c.id', 'wo.customer_id')
    .innerJoin('parts as p', 'p.id', 'wo.part_id')
    .innerJoin('finishes as f', 'f.id', 'wo.finish_id')
    .leftJoin('invoice_lines as il', 'il.work_order_id', 'wo.id')
    .leftJoin('invoices as i', 'i.id', 'il.invoice_id')
    .select([
      'wo.id',
      'wo.number',
      'wo.customer_id',
      'c.name as customer_name',
      'wo.state',
      'wo.po_number',
      'wo.quantity_shipped',
      'wo.unit_price_cents',
      'wo.pricing_basis',
      'p.part_number',
      'p.revision',
      'p.area_dm2',
      'p.weight_g',
      'f.name as finish_name',
      'i.number as invoice_number',
      // Parts per load as priced (the quote's job summary), else the finish's standard load.
      sql<number>`coalesce(case when (wo.quoted_cost #>> '{job,partsPerLoad}') ~ '^[0-9]+(\\.[0-9]+)?$'
        then (wo.quoted_cost #>> '{job,partsPerLoad}')::numeric end, f.parts_per_load)`.as('parts_per_load'),
      sql<string | null>`(select to_char(max(e.created_at), 'YYYY-MM-DD') from work_order_events e
        where e.work_order_id = wo.id and e.to_state = 'shipped')`.as('shipped_on'),
    ])
    .orderBy('wo.number');
  if (where.customerId) q = q.where('wo.customer_id', '=', where.customerId);
  if (where.orderIds) q = q.where('wo.id', 'in', [...where.orderIds]);
  if (where.state) q = q.where('wo.state', '=', where.state);
  const rows = await q.execute();
  const held = new Set(await ordersWithOpenNonconformance(database, rows.map((r) => r.id)));
  return rows.map((r) => ({
    id: r.id,
    number: r.number,
    poNumber: r.po_number,
    quantityShipped: r.quantity_shipped,
    unitPriceCents: Number(r.unit_price_cents),
    pricingBasis: r.pricing_basis,
    partNumber: r.part_number,
    partRevision: r.revision,
    finishName: r.finish_name,
    areaPerPartDm2: Number(r.area_dm2),
    weightPerPartG: r.weight_g === null ? null : Number(r.weight_g),
    partsPerLoad: Number(r.parts_per_load),
    customerId: r.customer_id,
    customerName: r.customer_name,
    state: r.state,
    shippedOn: r.shipped_on,
    invoiceNumber: r.invoice_number,
    hasOpenNonconformance: held.has(r.id),
  }));
}

/** Customers with shipped work orders not yet invoiced, for choosing whom to bill. */
export async function findCustomersToInvoice(database: Kysely<Database> = defaultDb) {
  return database
    .selectFrom('work_orders as wo')
    .innerJoin('customers as c', 'c.id', 'wo.customer_id')
    .select(['c.id', 'c.name', 'c.code', sql<number>`count(*)::int`.as('shipped_orders')])
    .where('wo.state', '=', 'shipped')
    .groupBy(['c.id', 'c.name', 'c.code'])
    .orderBy('c.name')
    .execute();
}

/** A shipped order as the issue form offers it: its line as it would be billed, or why it cannot be. */
export type InvoiceCandidate = {
  id: string;
  number: string;
  shippedOn: string | null;
  description: string;
  quantity: number;
  unit: string;
  unitPriceCents: number;
  amountCents: number;
  blockedReason: string | null;
};

export async function invoiceCandidates(customerId: string, database: Kysely<Database> = defaultDb) {
  if (!isUuid(customerId)) return null;
  const customer = await database
    .selectFrom('customers')
    .select(['id', 'name', 'code', 'tax_rate_bp', 'payment_terms_days', 'billing_email'])
    .where('id', '=', customerId)
    .executeTakeFirst();
  if (!customer) return null;
  const orders = await loadOrdersForInvoice(database, { customerId, state: 'shipped' });
  const candidates: InvoiceCandidate[] = orders.map((o) => {
    const base = { id: o.id, number: o.number, shippedOn: o.shippedOn };
    try {
      const line = orderLine(o);
      return {
        ...base,
        description: line.description,
        quantity: line.quantity,
        unit: line.unit,
        unitPriceCents: line.unitPriceCents,
        amountCents: lineAmountCents(line.quantity, line.unitPriceCents),
        blockedReason: o.hasOpenNonconformance ? 'An open nonconformance holds this order until quality closes it.' : null,
      };
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      return { ...base, description: o.number, quantity: 0, unit: '', unitPriceCents: 0, amountCents: 0, blockedReason: err.message };
    }
  });
  return { customer, candidates };
}
