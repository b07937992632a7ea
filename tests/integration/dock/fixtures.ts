// A customer, a contact and a part of the test's own (unique codes), and work orders on them at
// any state with any counts, so dock tests never read another area's records or mail.
import { randomInt } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { Database, WorkOrderState } from '@/db/types';

export type DockCustomer = { id: string; code: string; email: string; partId: string };

export async function dockCustomer(db: Kysely<Database>): Promise<DockCustomer> {
  const code = `DK${randomInt(100000, 999999)}`;
  const email = `dock-${code.toLowerCase()}@customer.test`;
  const c = await db
    .insertInto('customers')
    .values({ code, name: `Dock test ${code}`, shipping_address: '12 Quay Road, Portside', billing_email: `ap-${code.toLowerCase()}@customer.test` })
    .returning('id')
    .executeTakeFirstOrThrow();
  await db.insertInto('customer_contacts').values({ customer_id: c.id, name: 'Receiving desk', email }).execute();
  const part = await db
    .insertInto('parts')
    .values({ customer_id: c.id, part_number: `${code}-BRKT`, revision: 'A', description: 'Bracket, mild steel', substrate: 'carbon-steel', area_dm2: 0.5, weight_g: 120 })
    .returning('id')
    .executeTakeFirstOrThrow();
  return { id: c.id, code, email, partId: part.id };
}

export async function dockOrder(
  db: Kysely<Database>,
  customer: DockCustomer,
  opts: { state?: WorkOrderState; ordered?: number; received?: number } = {},
): Promise<{ id: string; number: string }> {
  const finish = await db.selectFrom('finishes').select('id').where('code', '=', 'ZN-B633-SC2').executeTakeFirstOrThrow();
  const number = `W2099-${String(randomInt(1_000_000, 9_999_999))}`;
  const ordered = opts.ordered ?? 100;
  return db
    .insertInto('work_orders')
    .values({
      number,
      customer_id: customer.id,
      part_id: customer.partId,
      finish_id: finish.id,
      po_number: `PO-${customer.code}`,
      quantity_ordered: ordered,
      quantity_received: opts.received ?? 0,
      state: opts.state ?? 'accepted',
      unit_price_cents: 40,
      pricing_basis: 'piece',
      total_cents: ordered * 40,
    })
    .returning(['id', 'number'])
    .executeTakeFirstOrThrow();
}
