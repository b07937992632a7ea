import 'server-only';
// What the dock screens read: a work order's receipts, shipments and count moves; orders open to
// receiving, found by PO, order number, quote number or customer; and the customer's own view.
import { type Kysely, sql } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { RECEIVABLE_STATES } from './receiving';

type Db = Kysely<Database>;

export async function findReceipts(workOrderId: string, conn: Db = defaultDb) {
  return conn
    .selectFrom('receipts as r')
    .leftJoin('users as u', 'u.id', 'r.received_by')
    .select([
      'r.id', 'r.number', sql<Date>`r.received_at`.as('received_at'), 'r.quantity', 'r.containers', 'r.weight_kg', 'r.customer_part_number', 'r.customer_lot', 'r.condition_note',
      'r.discrepancy', 'r.discrepancy_note', 'r.discrepancy_emailed_at', 'r.is_return', 'u.name as received_by_name',
      sql<string[]>`coalesce((select array_agg(rp.file_id::text order by rp.file_id) from receipt_photos rp where rp.receipt_id = r.id), '{}')`.as('photo_ids'),
    ])
    .where('r.work_order_id', '=', workOrderId)
    .orderBy('r.received_at')
    .orderBy('r.number')
    .execute();
}

export async function findShipments(workOrderId: string, conn: Db = defaultDb) {
  return conn
    .selectFrom('shipments as s')
    .leftJoin('users as u', 'u.id', 's.shipped_by')
    .leftJoin('certificates as c', 'c.id', 's.certificate_id')
    .select([
      's.id', 's.number', sql<Date>`s.shipped_at`.as('shipped_at'), 's.quantity', 's.containers', 's.weight_kg', 's.carrier', 's.tracking_number', 's.slip_file_id', 's.emailed_at', 's.email_to',
      'c.number as certificate_number', 'c.id as certificate_id', 'u.name as shipped_by_name',
    ])
    .where('s.work_order_id', '=', workOrderId)
    .orderBy('s.shipped_at')
    .orderBy('s.number')
    .execute();
}

export async function findCountMoves(workOrderId: string, conn: Db = defaultDb) {
  return conn
    .selectFrom('count_moves as m')
    .leftJoin('users as u', 'u.id', 'm.actor_id')
    .select(['m.id', 'm.kind', 'm.quantity', 'm.reason', sql<Date>`m.created_at`.as('created_at'), 'u.name as actor_name'])
    .where('m.work_order_id', '=', workOrderId)
    .orderBy('m.id')
    .execute();
}

export async function findReworkOrders(workOrderId: string, conn: Db = defaultDb) {
  return conn.selectFrom('work_orders').select(['id', 'number', 'quantity_ordered', 'state']).where('rework_of_id', '=', workOrderId).orderBy('number').execute();
}

export const RECEIVING_PAGE_SIZE = 30;

/** Orders waiting for parts (or for more of them), soonest due first; `q` matches PO, order, quote or customer. */
export async function findReceivableOrders(q: string, conn: Db = defaultDb) {
  let query = conn
    .selectFrom('work_orders as w')
    .innerJoin('customers as c', 'c.id', 'w.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .leftJoin('quote_lines as l', 'l.id', 'w.quote_line_id')
    .leftJoin('quotes as qt', 'qt.id', 'l.quote_id')
    .select(['w.id', 'w.number', 'w.po_number', 'w.state', 'w.due_date', 'w.quantity_ordered', 'w.quantity_received', 'c.name as customer_name', 'p.part_number', 'qt.number as quote_number'])
    .where('w.state', 'in', [...RECEIVABLE_STATES]);
  const term = q.trim();
  if (term) {
    const like = `%${term.replace(/[\\%_]/g, (m) => `\\${m}`)}%`;
    query = query.where((eb) => eb.or([eb('w.po_number', 'ilike', like), eb('w.number', 'ilike', like), eb('qt.number', 'ilike', like), eb('c.name', 'ilike', like), eb('p.part_number', 'ilike', like)]));
  }
  return query.orderBy(sql`w.due_date nulls last`).orderBy('w.number').limit(RECEIVING_PAGE_SIZE).execute();
}

/** A customer's own order with its dock records; another customer's id reads as not found. */
export async function getPortalOrder(customerId: string, workOrderId: string, conn: Db = defaultDb) {
  if (!/^[0-9a-f-]{36}$/i.test(workOrderId)) return null;
  const wo = await conn
    .selectFrom('work_orders as w')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .leftJoin('certificates as c', 'c.work_order_id', 'w.id')
    .select([
      'w.id', 'w.number', 'w.po_number', 'w.state', 'w.due_date', 'w.quantity_ordered', 'w.quantity_received', 'w.quantity_shipped', 'w.quantity_scrapped', 'w.quantity_held',
      sql<Date>`w.created_at`.as('created_at'), 'p.part_number', 'p.revision', 'p.description', 'f.name as finish_name', 'f.spec_text', 'c.id as certificate_id', 'c.number as certificate_number',
    ])
    .where('w.id', '=', workOrderId)
    .where('w.customer_id', '=', customerId)
    .executeTakeFirst();
  if (!wo) return null;
  const [receipts, shipments] = await Promise.all([findReceipts(wo.id, conn), findShipments(wo.id, conn)]);
  return { ...wo, receipts, shipments };
}
