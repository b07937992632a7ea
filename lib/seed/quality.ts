// Demo quality records on the orders the orders seed plated: a hardened-screw lot baked, measured,
// certified and shipped; a valve-stem lot measured, certified and shipped; a cap-screw lot with a
// thin reading and its open nonconformance. Made through the same functions the app uses.
// Idempotent: an audit-log marker says the set is loaded; with no suitable orders it does nothing
// and tries again on the next seed.
import { sql, type Kysely } from 'kysely';
import type { Database, Role } from '@/db/types';
import { createShipment } from '@/lib/dock/shipping';
import { changeWorkOrderState } from '@/lib/orders/states';
import type { Actor } from '@/lib/quality/access';
import { recordBake } from '@/lib/quality/bake/records';
import { issueCertificate } from '@/lib/quality/certificate';
import { lotSample } from '@/lib/quality/lot-checks';
import { loadLot } from '@/lib/quality/lot';
import { ensureDefaultSamplingPlan } from '@/lib/quality/sampling-store';
import { recordReadings } from '@/lib/quality/thickness';

const MARKER = 'seed.quality';
const HOUR = 3_600_000;

export async function actor(db: Kysely<Database>, role: Role): Promise<Actor | undefined> {
  return db.selectFrom('users').select(['id', 'name', 'role', 'is_active as isActive']).where('role', '=', role).where('is_active', '=', true).orderBy('created_at').executeTakeFirst();
}

// A fixed pseudo-random sequence, so every demo database gets the same readings.
export function readingsFor(count: number, centreUm: number, spreadUm: number, seed: number): number[] {
  let x = seed;
  return Array.from({ length: count }, () => {
    x = (x * 1103515245 + 12345) % 2 ** 31;
    return Math.round((centreUm + ((x / 2 ** 31) * 2 - 1) * spreadUm) * 100) / 100;
  });
}

async function move(db: Kysely<Database>, workOrderId: string, to: 'baked' | 'inspected', actorId: string) {
  await db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId, to, actorId, note: 'Quality records complete' }));
}

// The first certified order leaves in two boxes a day apart; the other in one.
async function ship(db: Kysely<Database>, workOrderId: string, quantity: number, people: Actor, at: Date, split: boolean) {
  const first = split ? Math.ceil(quantity / 2) : quantity;
  const parts = split ? [first, quantity - first] : [first];
  for (const [k, q] of parts.entries()) {
    if (q <= 0) continue;
    await createShipment(
      people,
      { workOrderId, quantity: q, containers: Math.max(1, Math.ceil(q / 500)), weightKg: undefined, carrier: k === 0 ? 'Harbourline Freight' : 'Customer pickup', trackingNumber: k === 0 ? `HF${workOrderId.slice(0, 8).toUpperCase()}` : '' },
      db,
      new Date(at.getTime() + k * 24 * HOUR),
    );
  }
}

export async function seedQuality(db: Kysely<Database>): Promise<void> {
  await ensureDefaultSamplingPlan(db);
  if (await db.selectFrom('audit_log').select('id').where('action', '=', MARKER).executeTakeFirst()) return;
  const [plater, supervisor] = [await actor(db, 'plater'), await actor(db, 'supervisor')];
  if (!plater || !supervisor) return;

  const candidates = await db
    .selectFrom('work_orders as w')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .select(['w.id', 'w.bake_required', 'w.quantity_received', 'f.min_thickness_um', 'f.code'])
    .where('w.state', '=', 'plated')
    .where(({ not, exists, selectFrom }) => not(exists(selectFrom('thickness_readings as t').select('t.id').whereRef('t.work_order_id', '=', 'w.id'))))
    .orderBy('w.created_at')
    .execute();
  if (candidates.length === 0) return; // the orders seed has not plated anything yet

  const baked = candidates.find((c) => c.bake_required);
  const plain = candidates.filter((c) => !c.bake_required);
  const toCertify = [baked, plain[1]].filter((c): c is NonNullable<typeof c> => !!c);
  const withNonconformance = plain[0];

  for (const [i, c] of toCertify.entries()) {
    const lot = (await loadLot(db, c.id))!;
    const platingEnd = lot.runs.reduce((m, r) => (r.endedAt > m ? r.endedAt : m), new Date(0));
    const later = new Date(platingEnd.getTime() + 30 * HOUR);
    if (c.bake_required) {
      await recordBake(
        plater,
        { workOrderId: c.id, platingEnded: platingEnd.toISOString(), bakeStarted: new Date(platingEnd.getTime() + 1.5 * HOUR).toISOString(), oven: 'Oven 2 (walk-in)', tempMinC: 197, tempMaxC: 204, durationH: 12.5, notes: 'Loaded before passivate.' },
        later,
        db,
      );
      await move(db, c.id, 'baked', supervisor.id);
    }
    const n = lotSample(lot).sampleSize;
    const values = readingsFor(n, c.min_thickness_um * 1.4, c.min_thickness_um * 0.25, 7 + i);
    await recordReadings(plater, { workOrderId: c.id, entry: 'manual', readings: values.map((t, k) => ({ partNo: k + 1, location: k % 3 === 0 ? 'head, top face' : 'shank, mid-length', method: 'B568', thicknessUm: t })) }, db);
    await move(db, c.id, 'inspected', supervisor.id);
    await issueCertificate(supervisor, c.id, later, db);
    await ship(db, c.id, c.quantity_received, supervisor, new Date(later.getTime() + 2 * HOUR), i === 0);
    await sql`update thickness_readings set recorded_at = ${new Date(platingEnd.getTime() + 20 * HOUR)} where work_order_id = ${c.id}`.execute(db);
  }

  if (withNonconformance) {
    const lot = (await loadLot(db, withNonconformance.id))!;
    const n = Math.min(lotSample(lot).sampleSize, 20);
    const values = readingsFor(n, withNonconformance.min_thickness_um * 1.3, withNonconformance.min_thickness_um * 0.2, 29);
    values[3] = Math.round(withNonconformance.min_thickness_um * 0.86 * 100) / 100; // one thin part in a barrel load
    await recordReadings(plater, { workOrderId: withNonconformance.id, entry: 'manual', readings: values.map((t, k) => ({ partNo: k + 1, location: 'flank', method: 'B499', thicknessUm: t })) }, db);
  }
  await db.insertInto('audit_log').values({ actor_id: supervisor.id, action: MARKER, entity: 'seed', entity_id: null }).execute();
}
