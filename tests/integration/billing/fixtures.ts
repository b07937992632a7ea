// Test data for billing: shipped work orders of the demo customers, numbered from the real
// counter, and the demo users as the app sees them when signed in.
import type { Kysely } from 'kysely';
import { db as appDb } from '@/db';
import type { Database, PricingBasis, WorkOrderState } from '@/db/types';
import type { SessionUser } from '@/lib/auth/current-user';
import { nextDocumentNumber } from '@/lib/quotes/numbering';

export const NGF_BUYER = 'buyer@northgate-fastener.test';
export const HVI_QUALITY = 'quality@halvorsen-valve.test';
export const OWNER = 'owner@kestrel-plating.test';

const PART_OF: Record<string, string> = { NGF: 'NGF-HX-0816', HVI: 'HV-STEM-220', BRL: 'BL-PIN-0102' };

export type OrderSpec = {
  customer: 'NGF' | 'HVI' | 'BRL';
  quantity?: number;
  unitPriceCents?: number;
  basis?: PricingBasis;
  /** Orders are created at this state directly: a fixture, not a walk through the state machine. */
  state?: WorkOrderState;
  poNumber?: string;
};

export async function customerId(code: string, database: Kysely<Database> = appDb): Promise<string> {
  return (await database.selectFrom('customers').select('id').where('code', '=', code).executeTakeFirstOrThrow()).id;
}

export async function makeOrder(spec: OrderSpec, database: Kysely<Database> = appDb): Promise<{ id: string; number: string }> {
  const quantity = spec.quantity ?? 1000;
  const unit = spec.unitPriceCents ?? 18.5;
  const state = spec.state ?? 'shipped';
  const shipped = state === 'shipped' || state === 'invoiced';
  return database.transaction().execute(async (trx) => {
    const cid = await customerId(spec.customer, trx);
    const part = await trx.selectFrom('parts').select('id').where('customer_id', '=', cid).where('part_number', '=', PART_OF[spec.customer]!).executeTakeFirstOrThrow();
    const finish = await trx.selectFrom('finishes').select('id').where('code', '=', 'ZN-B633-SC2').executeTakeFirstOrThrow();
    const number = await nextDocumentNumber(trx, 'work_order');
    const wo = await trx
      .insertInto('work_orders')
      .values({
        number,
        customer_id: cid,
        part_id: part.id,
        finish_id: finish.id,
        po_number: spec.poNumber ?? `PO-T${Math.floor(Math.random() * 1e6)}`,
        quantity_ordered: quantity,
        quantity_received: quantity,
        quantity_shipped: shipped ? quantity : 0,
        state,
        unit_price_cents: unit,
        pricing_basis: spec.basis ?? 'piece',
        total_cents: Math.round(quantity * unit),
        quoted_cost: JSON.stringify({ job: { partsPerLoad: 500 } }),
      })
      .returning(['id', 'number'])
      .executeTakeFirstOrThrow();
    await trx.insertInto('work_order_events').values({ work_order_id: wo.id, from_state: null, to_state: state, actor_id: null, note: 'billing test fixture' }).execute();
    return wo;
  });
}

export async function sessionUser(email: string, database: Kysely<Database> = appDb): Promise<SessionUser> {
  const u = await database.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirstOrThrow();
  return { id: u.id, email: u.email, name: u.name, role: u.role, customerId: u.customer_id, unitSystem: u.unit_system, isActive: u.is_active };
}

export async function lastSeq(series: 'invoice' | 'credit_note', year: number, database: Kysely<Database> = appDb): Promise<number> {
  const r = await database.selectFrom('number_counters').select('last_seq').where('series', '=', series).where('year', '=', year).executeTakeFirst();
  return r?.last_seq ?? 0;
}
