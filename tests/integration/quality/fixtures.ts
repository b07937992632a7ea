// Lots of our own for the quality tests: a work order on a demo part and finish with one plating
// run, numbered in a range the shop's counter never reaches (W2099-…), so tests never touch
// another area's records and never assume empty tables.
import { randomInt } from 'node:crypto';
import { sql, type Kysely } from 'kysely';
import type { Database, WorkOrderState } from '@/db/types';
import { changeWorkOrderState } from '@/lib/orders/states';
import type { Actor } from '@/lib/quality/access';

export type LotOptions = {
  bake?: boolean;
  quantity?: number;
  state?: WorkOrderState;
  /** Plating end as an instant; defaults to two hours ago. */
  platingEnd?: Date;
  ampHours?: number;
  customerCode?: string;
};

export async function createLot(db: Kysely<Database>, opts: LotOptions = {}): Promise<{ id: string; number: string }> {
  const bake = opts.bake ?? false;
  const customer = await db.selectFrom('customers').select('id').where('code', '=', opts.customerCode ?? 'NGF').executeTakeFirstOrThrow();
  const part = await db
    .selectFrom('parts')
    .select(['id', 'area_dm2'])
    .where('customer_id', '=', customer.id)
    // The hardest steel part for a bake lot (parts of no stated hardness last), else the weakest.
    .orderBy(bake ? sql`hardness_hrc desc nulls last` : sql`tensile_mpa asc nulls last`)
    .executeTakeFirstOrThrow();
  const finish = await db
    .selectFrom('finishes')
    .select('id')
    .where('code', '=', bake ? 'ZN-B633-SC2-HS' : 'ZN-B633-SC2')
    .executeTakeFirstOrThrow();
  const tank = await db.selectFrom('tanks').select('id').where('code', '=', 'Z-ZN1').executeTakeFirstOrThrow();
  const quantity = opts.quantity ?? 40;
  const number = `W2099-${String(randomInt(1_000_000, 9_999_999))}`;
  const wo = await db
    .insertInto('work_orders')
    .values({
      number,
      customer_id: customer.id,
      part_id: part.id,
      finish_id: finish.id,
      po_number: `PO-T${randomInt(10000, 99999)}`,
      quantity_ordered: quantity,
      quantity_received: quantity,
      state: opts.state ?? 'plated',
      bake_required: bake,
      unit_price_cents: 25,
      pricing_basis: 'piece',
      total_cents: quantity * 25,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const end = opts.platingEnd ?? new Date(Date.now() - 2 * 3_600_000);
  await db
    .insertInto('plating_runs')
    .values({
      work_order_id: wo.id,
      tank_id: tank.id,
      started_at: new Date(end.getTime() - 45 * 60_000),
      ended_at: end,
      // About what 11 µm of zinc at 72 % efficiency needs: 17.08 µm per A·h/dm² at 100 %
      // (ECE 1.2196 g/A·h over 7.14 g/cm³; reference §1.1), so the measured efficiency reads true.
      amp_hours: opts.ampHours ?? Math.round(((quantity * part.area_dm2 * 11) / (17.08 * 0.72)) * 1000) / 1000,
      loads: 1,
      parts_per_load: quantity,
      predicted_thickness_um: 11,
      is_below_minimum: false,
    })
    .execute();
  return { id: wo.id, number };
}

export async function actorFor(db: Kysely<Database>, email: string): Promise<Actor & { email: string; customerId: string | null; unitSystem: 'metric' | 'us' }> {
  const u = await db.selectFrom('users').selectAll().where('email', '=', email).executeTakeFirstOrThrow();
  return { id: u.id, name: u.name, role: u.role, isActive: u.is_active, email: u.email, customerId: u.customer_id, unitSystem: u.unit_system };
}

export const SUPERVISOR = 'supervisor@kestrel-plating.test';
export const PLATER = 'plater@kestrel-plating.test';
export const ESTIMATOR = 'estimator@kestrel-plating.test';
export const BUYER = 'buyer@northgate-fastener.test';
export const OTHER_CUSTOMER = 'quality@halvorsen-valve.test';

/** `count` passing readings, one per part, between 9 and 12 µm (finish minimum 8 µm). */
export function passingReadings(count: number) {
  return Array.from({ length: count }, (_, i) => ({ partNo: i + 1, location: 'head flat', method: 'B499' as const, thicknessUm: 9 + (i % 4) }));
}

export async function errorOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'none';
  } catch (e) {
    return e instanceof Error ? `${(e as { code?: string }).code ?? e.name}: ${e.message}` : String(e);
  }
}

/** Moves a lot whose records pass through its bake (where it has one) to inspected: certificates come after inspection. */
export async function inspect(db: Kysely<Database>, workOrderId: string): Promise<void> {
  const supervisor = await actorFor(db, SUPERVISOR);
  const wo = await db.selectFrom('work_orders').select(['state', 'bake_required']).where('id', '=', workOrderId).executeTakeFirstOrThrow();
  const steps: WorkOrderState[] = wo.state === 'plated' && wo.bake_required ? ['baked', 'inspected'] : ['inspected'];
  for (const to of steps) {
    await db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId, to, actorId: supervisor.id, note: 'Quality records complete' }));
  }
}
