import 'server-only';
import { sql, type Kysely, type SqlBool } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, ProcessFamilyId, ProcessStep } from '@/db/types';
import { getFamily } from '@/lib/families';
import type { GridColumns, GridOptions, GridSearch } from '@/lib/grid/server';
import { activeTankFacts } from '@/lib/quotes/pricing-context';
import { tanksForFinish } from '@/lib/quotes/process';
import type { LinePrice } from '@/lib/quotes/pricing';
import { WORK_ORDER_STATES } from './states';

type Db = Kysely<Database>;

// The list reads work_orders with its small lookups joined; sorted by an indexed column (number,
// due date, state) and paged with LIMIT, so it stays fast with 100 000 orders.
export function workOrderGridSelect(conn: Db = defaultDb) {
  return conn
    .selectFrom('work_orders as w')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .select([
      'w.id as id',
      'w.number as number',
      'c.name as customer',
      'p.part_number as part',
      'f.code as finish',
      'w.po_number as po_number',
      'w.state as state',
      'w.due_date as due_date',
      'w.quantity_ordered as quantity_ordered',
      'w.quantity_received as quantity_received',
      'w.total_cents as total_cents',
      'w.is_rush as is_rush',
    ]);
}

export const WORK_ORDER_GRID_COLUMNS: GridColumns = {
  number: { expr: 'w.number', type: 'text', searchable: true, header: 'Work order' },
  customer: { expr: 'c.name', type: 'text', searchable: true, sortable: false, header: 'Customer' },
  part: { expr: 'p.part_number', type: 'text', searchable: true, sortable: false, header: 'Part' },
  finish: { expr: 'f.code', type: 'text', sortable: false, header: 'Finish' },
  po_number: { expr: 'w.po_number', type: 'text', searchable: true, sortable: false, header: 'PO' },
  state: { expr: 'w.state', type: 'text', header: 'State', choices: { values: WORK_ORDER_STATES, match: (v) => sql<SqlBool>`w.state = ${v}` } },
  due_date: { expr: 'w.due_date', type: 'date', header: 'Due' },
  quantity_ordered: { expr: 'w.quantity_ordered', type: 'number', sortable: false, header: 'Ordered' },
  quantity_received: { expr: 'w.quantity_received', type: 'number', sortable: false, header: 'Received' },
  total_cents: { expr: 'w.total_cents', type: 'number', sortable: false, header: 'Total (cents)' },
  is_rush: { expr: sql`case when w.is_rush then 'rush' else '' end`, type: 'text', sortable: false, csv: true, header: 'Rush' },
};

/** Orders a page in the customer's portal. */
export const PORTAL_ORDERS_PAGE_SIZE = 25;

/**
 * The work-order list's quick search for one word: the same rows as the OR over its searchable
 * columns (number, customer, part, PO), found as one indexed select per table (trigram indexes) so
 * a part number among ten years of orders is looked up, not scanned for.
 */
export const workOrderSearch: GridSearch = (pattern) => sql<SqlBool>`w.id in (
  select id from work_orders where number ilike ${pattern} or po_number ilike ${pattern}
  union all select o.id from work_orders o join parts pp on pp.id = o.part_id where pp.part_number ilike ${pattern}
  union all select o.id from work_orders o join customers cc on cc.id = o.customer_id where cc.name ilike ${pattern})`;

/** GET /api/work-orders: the same list for every staff reader, so its answers are kept (lib/grid/list-cache.ts). */
export const WORK_ORDER_GRID = {
  columns: WORK_ORDER_GRID_COLUMNS,
  // Work-order numbers are unique, so the number itself keeps pages stable on its own index.
  key: 'w.number',
  defaultSort: { colId: 'number', dir: 'desc' },
  fileName: 'work-orders',
  search: workOrderSearch,
  cache: { name: 'work-orders' },
} as const satisfies Omit<GridOptions<never>, 'mapRow' | 'db'>;

export async function getWorkOrder(workOrderId: string, conn: Db = defaultDb) {
  const wo = await conn
    .selectFrom('work_orders as w')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .leftJoin('quote_lines as l', 'l.id', 'w.quote_line_id')
    .leftJoin('quotes as q', 'q.id', 'l.quote_id')
    .select([
      'w.id', 'w.number', 'w.customer_id', 'w.po_number', 'w.due_date', 'w.quantity_ordered', 'w.quantity_received', 'w.quantity_shipped',
      'w.quantity_scrapped', 'w.quantity_held', 'w.rework_of_id', 'w.rework_nonconformance_id',
      'w.state', 'w.bake_required', 'w.is_rush', 'w.unit_price_cents', 'w.pricing_basis', 'w.total_cents', 'w.quoted_cost',
      sql<Date>`w.created_at`.as('created_at'),
      'c.name as customer_name', 'c.code as customer_code', 'c.shipping_address',
      'p.id as part_id', 'p.part_number', 'p.revision as part_revision', 'p.description as part_description', 'p.substrate', 'p.area_dm2', 'p.weight_g', 'p.hardness_hrc', 'p.tensile_mpa',
      'f.id as finish_id', 'f.code as finish_code', 'f.name as finish_name', 'f.spec_text', 'f.process_route', 'f.element', 'f.ion_charge', 'f.min_thickness_um',
      'f.max_thickness_um', 'f.method', 'f.distribution_ratio', 'f.current_density_adm2', 'f.tank_volts', 'f.handling_minutes_per_load', 'f.masking_per_piece_cents',
      'f.parts_per_load', 'f.line_id as finish_line_id', 'f.bake_temp_c', 'f.bake_hours', 'f.bake_window_hours', 'f.family', 'f.family_params',
      'q.id as quote_id', 'q.number as quote_number', 'q.revision as quote_revision', 'q.rate_set_id',
    ])
    .where('w.id', '=', workOrderId)
    .executeTakeFirst();
  if (!wo) return null;
  return { ...wo, process_route: wo.process_route as ProcessStep[], quoted_cost: wo.quoted_cost as LinePrice | Record<string, never> };
}

export type WorkOrderDetail = NonNullable<Awaited<ReturnType<typeof getWorkOrder>>>;

export async function findWorkOrderEvents(workOrderId: string, conn: Db = defaultDb) {
  return conn
    .selectFrom('work_order_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .select(['e.id', 'e.from_state', 'e.to_state', 'e.note', sql<Date>`e.created_at`.as('created_at'), 'u.name as actor_name'])
    .where('e.work_order_id', '=', workOrderId)
    .orderBy('e.created_at')
    .orderBy('e.id')
    .execute();
}

export async function findPlatingRuns(workOrderId: string, conn: Db = defaultDb) {
  return conn
    .selectFrom('plating_runs as r')
    .innerJoin('tanks as t', 't.id', 'r.tank_id')
    .leftJoin('users as u', 'u.id', 'r.logged_by')
    .select([
      'r.id', 'r.started_at', 'r.ended_at', 'r.current_a', 'r.meter_start_ah', 'r.meter_stop_ah', 'r.amp_hours', 'r.loads', 'r.parts_per_load',
      'r.predicted_thickness_um', 'r.is_below_minimum', 'r.is_outside_window', 'r.conditions', 't.code as tank_code', 't.name as tank_name', 't.efficiency as tank_efficiency',
      't.template_id', 'u.name as logged_by_name',
    ])
    .where('r.work_order_id', '=', workOrderId)
    .orderBy('r.started_at')
    .execute();
}

/** Tanks a run for this finish may be logged on: active, running the finish's family and metal; a plating tank with a known efficiency. */
export async function findTanksForFinish(
  finish: { family: ProcessFamilyId; family_params: unknown; element: string; ion_charge: number; method: 'rack' | 'barrel'; finish_line_id: string | null },
  conn: Db = defaultDb,
) {
  const needsEfficiency = getFamily(finish.family).usesEfficiency;
  const facts = (await activeTankFacts(conn)).filter((t) => !needsEfficiency || t.efficiency !== null);
  return tanksForFinish({ family: finish.family, familyParams: finish.family_params, element: finish.element, ionCharge: finish.ion_charge, method: finish.method, lineId: finish.finish_line_id }, facts);
}

/** A customer's own work orders (scoped by the signed-in contact's company). */
/** Where a page of a customer's orders ends (newest first). */
export type OrderCursor = { createdAt: string; id: string };

/** One page of a customer's own orders, newest first, by key (created at, id); `next` starts the page after. */
export async function findPortalOrders(customerId: string, before: OrderCursor | null = null, size = PORTAL_ORDERS_PAGE_SIZE, conn: Db = defaultDb) {
  let q = conn
    .selectFrom('work_orders as w')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .select([
      'w.id', 'w.number', 'w.po_number', 'w.state', 'w.due_date', 'w.quantity_ordered', 'w.quantity_received', 'w.quantity_shipped',
      'p.part_number', 'p.revision as part_revision', 'f.name as finish_name', sql<Date>`w.created_at`.as('created_at'),
      // Actual dates at the docks: the first delivery in, the latest shipment out (indexed by order).
      sql<Date | null>`(select min(r.received_at) from receipts r where r.work_order_id = w.id)`.as('received_at'),
      sql<Date | null>`(select max(s.shipped_at) from shipments s where s.work_order_id = w.id)`.as('last_shipped_at'),
      // The cursor keeps the microseconds a JavaScript Date would drop, so two orders made in one millisecond are both listed.
      sql<string>`to_char(w.created_at at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`.as('created_key'),
    ])
    .where('w.customer_id', '=', customerId)
    .orderBy('w.created_at', 'desc')
    .orderBy('w.id', 'desc')
    .limit(size + 1);
  if (before) q = q.where(sql<boolean>`(w.created_at, w.id) < (${before.createdAt}::timestamptz, ${before.id}::uuid)`);
  const rows = await q.execute();
  const orders = rows.slice(0, size).map(({ created_key: _key, ...o }) => o);
  const last = rows[size - 1];
  return { orders, next: rows.length > size && last ? { createdAt: last.created_key, id: last.id } : null };
}
