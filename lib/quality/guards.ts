// The quality steps of the work-order state machine (lib/orders/states.ts calls these from its
// guards table): an order is baked only on a passing or dispositioned bake record, and inspected
// only with what the finish's family asks (thickness, seal test, phosphorus, passivation records)
// all present and passing, and no open nonconformance.
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '@/db/types';
import { bakeCheck, inspectionChecks } from './lot-checks';
import { loadLot } from './lot';

type Db = Kysely<Database> | Transaction<Database>;

export async function bakedGuard(db: Db, order: { id: string }): Promise<string | null> {
  const lot = await loadLot(db, order.id);
  if (!lot) return 'That work order does not exist.';
  const c = bakeCheck(lot);
  return c.ok ? null : c.message;
}

export async function inspectedGuard(db: Db, order: { id: string }): Promise<string | null> {
  const lot = await loadLot(db, order.id);
  if (!lot) return 'That work order does not exist.';
  const failing = inspectionChecks(lot).filter((c) => !c.ok);
  // "No thickness readings yet" says nothing the missing-readings message does not.
  const messages = failing.filter((c) => !(c.key === 'thickness_pass' && lot.readings.length === 0)).map((c) => c.message);
  return messages.length ? messages.join(' ') : null;
}
