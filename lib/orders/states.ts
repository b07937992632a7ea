// The work-order state machine: the one place that says which step may follow which, and what
// must be on record before a step is taken. Every state change goes through changeWorkOrderState.
import { type Kysely, type Transaction, sql } from 'kysely';
import type { Database, WorkOrderState } from '@/db/types';
import { AppError } from '@/lib/errors';
import { countsOf, inShop, isBalanced } from '@/lib/dock/counts';
import { bakedGuard, inspectedGuard } from '@/lib/quality/guards';

export const WORK_ORDER_STATES: readonly WorkOrderState[] = [
  'accepted',
  'received',
  'in_process',
  'plated',
  'baked',
  'inspected',
  'shipped',
  'invoiced',
];

export const STATE_LABELS: Record<WorkOrderState, string> = {
  accepted: 'Awaiting parts',
  received: 'Received',
  in_process: 'In process',
  plated: 'Plated',
  baked: 'Baked',
  inspected: 'Inspected',
  shipped: 'Shipped',
  invoiced: 'Invoiced',
};

// The normal next step from each state; 'baked' is skipped when no bake is required.
export function nextState(from: WorkOrderState, bakeRequired: boolean): WorkOrderState | null {
  switch (from) {
    case 'accepted':
      return 'received';
    case 'received':
      return 'in_process';
    case 'in_process':
      return 'plated';
    case 'plated':
      return bakeRequired ? 'baked' : 'inspected';
    case 'baked':
      return 'inspected';
    case 'inspected':
      return 'shipped';
    case 'shipped':
      return 'invoiced';
    case 'invoiced':
      return null;
  }
}

export type StateChangeRequest = {
  workOrderId: string;
  to: WorkOrderState;
  actorId: string | null;
  note?: string;
};

type Db = Kysely<Database> | Transaction<Database>;
type LockedOrder = {
  id: string;
  state: WorkOrderState;
  bake_required: boolean;
  quantity_ordered: number;
  quantity_received: number;
  quantity_shipped: number;
  quantity_scrapped: number;
  quantity_held: number;
};

// Shipping and invoicing wait until every received part is shipped, scrapped or held.
const balancedGuard = (verb: string): StateGuard => async (_db, o) => {
  const c = countsOf(o);
  if (isBalanced(c)) return null;
  return `The order cannot be ${verb} while ${inShop(c).toLocaleString('en-US')} of its ${c.received.toLocaleString('en-US')} received parts are unaccounted for (shipped ${c.shipped.toLocaleString('en-US')}, scrapped ${c.scrapped.toLocaleString('en-US')}, held ${c.held.toLocaleString('en-US')}): ship, scrap or hold them first.`;
};

// A guard returns the reason a step cannot be taken yet, or null. Other areas (quality records,
// invoicing) add their check functions to the table below rather than writing state changes.
export type StateGuard = (db: Db, order: LockedOrder, req: StateChangeRequest) => Promise<string | null>;

const guards: Partial<Record<WorkOrderState, StateGuard[]>> = {
  received: [async (_db, o) => (o.quantity_received > 0 ? null : 'Record the parts on a receipt at the dock first.')],
  plated: [
    async (db, o) => {
      const r = await db.selectFrom('plating_runs').select(sql<number>`count(*)::int`.as('n')).where('work_order_id', '=', o.id).executeTakeFirstOrThrow();
      return r.n === 0 ? 'Log at least one plating run before marking the order plated.' : null;
    },
    // Every received part must have gone through a logged load.
    async (db, o) => {
      const r = await db
        .selectFrom('plating_runs')
        .select(sql<number>`coalesce(sum(loads * parts_per_load), 0)::int`.as('parts'))
        .where('work_order_id', '=', o.id)
        .executeTakeFirstOrThrow();
      return r.parts < o.quantity_received
        ? `The runs logged so far cover ${r.parts} of the ${o.quantity_received} parts received. Log the remaining runs before marking the order plated.`
        : null;
    },
  ],
  baked: [async (_db, o) => (o.bake_required ? null : 'This order does not require an embrittlement-relief bake.'), bakedGuard],
  inspected: [inspectedGuard],
  shipped: [async (_db, o) => (o.quantity_shipped > 0 ? null : 'Make a shipment with its packing slip first.'), balancedGuard('closed as shipped')],
  invoiced: [balancedGuard('invoiced')],
};

export async function changeWorkOrderState(trx: Transaction<Database>, req: StateChangeRequest): Promise<void> {
  const order = await trx
    .selectFrom('work_orders')
    .select(['id', 'state', 'bake_required', 'quantity_ordered', 'quantity_received', 'quantity_shipped', 'quantity_scrapped', 'quantity_held'])
    .where('id', '=', req.workOrderId)
    .forUpdate()
    .executeTakeFirst();
  if (!order) throw new AppError('NOT_FOUND', 'That work order does not exist.');
  const expected = nextState(order.state, order.bake_required);
  if (expected !== req.to) {
    const skipped = order.state === 'plated' && req.to !== 'baked' && order.bake_required;
    throw new AppError(
      'CONFLICT',
      skipped
        ? 'This order requires an embrittlement-relief bake: record the bake before it can move on.'
        : `A work order that is ${STATE_LABELS[order.state].toLowerCase()} cannot become ${STATE_LABELS[req.to].toLowerCase()}${expected ? `; the next step is ${STATE_LABELS[expected].toLowerCase()}` : ''}.`,
    );
  }
  for (const guard of guards[req.to] ?? []) {
    const reason = await guard(trx, order, req);
    if (reason) throw new AppError('CONFLICT', reason);
  }
  await trx
    .updateTable('work_orders')
    .set({
      state: req.to,
      updated_at: sql`now()`,
    })
    .where('id', '=', order.id)
    .execute();
  await trx
    .insertInto('work_order_events')
    .values({ work_order_id: order.id, from_state: order.state, to_state: req.to, actor_id: req.actorId, note: req.note ?? '' })
    .execute();
}
