// The same property against the database: random sequences of receipts, scrap, holds, releases
// and shipments on a real work order. The stored counts always match the ledgers (receipts,
// shipments, count moves), always add up, and the order closes only when they balance.
import fc from 'fast-check';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { isBalanced } from '@/lib/dock/counts';
import { recordCountMove } from '@/lib/dock/moves';
import { recordReceipt } from '@/lib/dock/receiving';
import { createShipment } from '@/lib/dock/shipping';
import { AppError } from '@/lib/errors';
import { sessionUserByEmail } from '../records/helpers';
import { dockCustomer, dockOrder, type DockCustomer } from './fixtures';

let plater: Awaited<ReturnType<typeof sessionUserByEmail>>;
let cust: DockCustomer;
beforeAll(async () => {
  plater = await sessionUserByEmail('plater@kestrel-plating.test');
  cust = await dockCustomer(db);
});
afterAll(() => db.destroy());

type Step = { kind: 'receive' | 'ship' | 'scrap' | 'hold' | 'release' | 'scrap_held'; quantity: number };
const step = fc.record({ kind: fc.constantFrom('receive', 'ship', 'scrap', 'hold', 'release', 'scrap_held'), quantity: fc.integer({ min: 1, max: 60 }) }) as fc.Arbitrary<Step>;

describe('dock counts in the database', () => {
  it('stay balanced and equal to their ledgers under any sequence', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(step, { minLength: 1, maxLength: 8 }), async (steps) => {
        const wo = await dockOrder(db, cust, { ordered: 100 });
        for (const s of steps) {
          const state = (await db.selectFrom('work_orders').select('state').where('id', '=', wo.id).executeTakeFirstOrThrow()).state;
          // Receiving is open until the runs; shipping after inspection. Jump the state as the line would.
          if (s.kind === 'ship' && state === 'received') await db.updateTable('work_orders').set({ state: 'inspected' }).where('id', '=', wo.id).execute();
          try {
            if (s.kind === 'receive') await recordReceipt(plater, { workOrderId: wo.id, quantity: s.quantity, containers: 1, weightKg: undefined, customerPartNumber: '', customerLot: '', conditionNote: '', discrepancy: 'none', discrepancyNote: '', photoIds: [] });
            else if (s.kind === 'ship') await createShipment(plater, { workOrderId: wo.id, quantity: s.quantity, containers: 1, weightKg: undefined, carrier: 'Customer pickup', trackingNumber: '' });
            else await recordCountMove(plater, { workOrderId: wo.id, kind: s.kind, quantity: s.quantity, reason: 'property test' });
          } catch (e) {
            if (!(e instanceof AppError)) throw e;
          }
          const o = await db.selectFrom('work_orders').selectAll().where('id', '=', wo.id).executeTakeFirstOrThrow();
          const ledger = await sql<{ received: number; shipped: number; scrapped: number; held: number }>`
            select (select coalesce(sum(quantity), 0)::int from receipts where work_order_id = ${wo.id}) as received,
                   (select coalesce(sum(quantity), 0)::int from shipments where work_order_id = ${wo.id}) as shipped,
                   (select coalesce(sum(quantity) filter (where kind in ('scrap', 'scrap_held')), 0)::int from count_moves where work_order_id = ${wo.id}) as scrapped,
                   (select coalesce(sum(case kind when 'hold' then quantity when 'release' then -quantity when 'scrap_held' then -quantity else 0 end), 0)::int
                      from count_moves where work_order_id = ${wo.id}) as held`.execute(db);
          const l = ledger.rows[0]!;
          expect({ received: o.quantity_received, shipped: o.quantity_shipped, scrapped: o.quantity_scrapped, held: o.quantity_held }).toEqual(l);
          expect(o.quantity_shipped + o.quantity_scrapped + o.quantity_held).toBeLessThanOrEqual(o.quantity_received);
          const counts = { received: o.quantity_received, shipped: o.quantity_shipped, scrapped: o.quantity_scrapped, held: o.quantity_held };
          if (o.state === 'shipped') expect(isBalanced(counts)).toBe(true);
          if (o.quantity_shipped > 0 && isBalanced(counts)) expect(o.state).toBe('shipped');
        }
      }),
      { numRuns: 25 },
    );
  });
});
