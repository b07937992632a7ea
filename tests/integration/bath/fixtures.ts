// A throwaway line and tank per test file (unique code), its analytes from the template, and the
// demo users as bath actors. cleanup() removes every row the tests made for the tank.
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import { db } from '@/db';
import type { Role } from '@/db/types';
import type { BathActor } from '@/lib/bath/access';
import { setupTankAnalytes } from '@/lib/bath/analytes';

export type TestTank = { id: string; code: string; lineId: string; analytes: Record<string, { id: string; unit: string }> };

export async function makeTank(templateId = 'watts-nickel', volumeL = 2000): Promise<TestTank> {
  const tag = randomBytes(4).toString('hex').toUpperCase();
  const line = await db.insertInto('lines').values({ name: `Bath test line ${tag}`, method: 'rack' }).returning('id').executeTakeFirstOrThrow();
  const tank = await db
    .insertInto('tanks')
    .values({ line_id: line.id, code: `T-${tag}`, name: `Test tank ${tag}`, template_id: templateId, volume_l: volumeL, has_ah_meter: true, rectifier_max_a: 500, anode_type: 'soluble' })
    .returning(['id', 'code'])
    .executeTakeFirstOrThrow();
  await setupTankAnalytes(tank.id);
  const rows = await db.selectFrom('tank_analytes').select(['id', 'key', 'unit']).where('tank_id', '=', tank.id).execute();
  return { id: tank.id, code: tank.code, lineId: line.id, analytes: Object.fromEntries(rows.map((r) => [r.key, { id: r.id, unit: r.unit }])) };
}

export async function removeTank(t: TestTank): Promise<void> {
  await db.deleteFrom('bath_alerts').where('tank_id', '=', t.id).execute();
  await db.deleteFrom('additions').where('tank_id', '=', t.id).where('supersedes_id', 'is not', null).execute();
  await db.deleteFrom('additions').where('tank_id', '=', t.id).execute();
  // Corrections first: an analysis another one supersedes cannot go before it.
  for (let i = 0; i < 10; i++) {
    const r = await sql`delete from analyses a where a.tank_id = ${t.id} and not exists (select 1 from analyses s where s.supersedes_id = a.id)`.execute(db);
    if (!r.numAffectedRows) break;
  }
  await db.deleteFrom('meter_readings').where('tank_id', '=', t.id).execute();
  await db.deleteFrom('hull_cell_panels').where('tank_id', '=', t.id).execute();
  await db.deleteFrom('analyte_limit_changes').where('analyte_id', 'in', Object.values(t.analytes).map((a) => a.id)).execute();
  await db.deleteFrom('tank_analytes').where('tank_id', '=', t.id).execute();
  await db.deleteFrom('tanks').where('id', '=', t.id).execute();
  await db.deleteFrom('lines').where('id', '=', t.lineId).execute();
}

export async function actor(role: Role): Promise<BathActor & { email: string }> {
  const u = await db.selectFrom('users').select(['id', 'role', 'email']).where('email', '=', `${role}@kestrel-plating.test`).executeTakeFirstOrThrow();
  return { id: u.id, role: u.role, email: u.email };
}

export function key(prefix = 'it'): string {
  return `${prefix}-${randomBytes(8).toString('hex')}`;
}

export async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'none';
  } catch (e) {
    const err = e as { code?: string; message?: string };
    return `${err.code ?? 'ERROR'}: ${err.message ?? String(e)}`;
  }
}
