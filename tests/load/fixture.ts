// What a load or fault run needs in its database: a tank of its own (so its entries never disturb
// the demo tanks other tests look at) with its analytes, and a session per role that takes part.
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { createDb } from '@/db/kysely';
import { createPool } from '@/db/pool';
import { setupTankAnalytes } from '@/lib/bath/analytes';
import { DEMO_USER_IDS } from '../helpers/sessions';

export const LOAD_TANK_CODE = 'LOAD-NI1';
export type LoadRole = 'plater' | 'estimator' | 'customer';

export type LoadFixture = {
  tankId: string;
  analytes: { ph: string; temperature: string };
  cookies: Record<LoadRole, string>;
  close: () => Promise<void>;
};

export async function prepareLoadFixture(databaseUrl: string): Promise<LoadFixture> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  // A copy of the demo nickel tank under a code of its own; its analytes come from the same template.
  await client.query(
    `insert into tanks (line_id, code, name, template_id, volume_l, element, ion_charge, efficiency, rectifier_max_a, has_ah_meter, anode_type, temp_min_c, temp_max_c)
     select line_id, $1, 'Load-run nickel', template_id, volume_l, element, ion_charge, efficiency, rectifier_max_a, true, anode_type, temp_min_c, temp_max_c
       from tanks where code = 'N-NI1'
     on conflict (code) do nothing`,
    [LOAD_TANK_CODE],
  );
  const tank = await client.query<{ id: string }>(`select id from tanks where code = $1`, [LOAD_TANK_CODE]);
  const tankId = tank.rows[0]?.id;
  if (!tankId) throw new Error('the demo tank N-NI1 is missing: seed the database first');
  const db = createDb(createPool(databaseUrl));
  try {
    await setupTankAnalytes(tankId, db);
  } finally {
    await db.destroy();
  }
  const analytes = await client.query<{ key: string; id: string }>(`select key, id from tank_analytes where tank_id = $1 and key in ('ph', 'temperature')`, [tankId]);
  const byKey = new Map(analytes.rows.map((r) => [r.key, r.id]));

  const sessionIds: string[] = [];
  const cookies = {} as Record<LoadRole, string>;
  for (const role of ['plater', 'estimator', 'customer'] as const) {
    const id = randomBytes(20).toString('hex');
    await client.query(`insert into sessions (id, user_id, expires_at, second_factor) values ($1, $2, now() + interval '2 hours', true)`, [id, DEMO_USER_IDS[role]]);
    sessionIds.push(id);
    cookies[role] = `ampwright_session=${id}`;
  }
  await client.end();
  return {
    tankId,
    analytes: { ph: byKey.get('ph')!, temperature: byKey.get('temperature')! },
    cookies,
    // A connection of its own: a fault run stops the database while the fixture is in use.
    close: async () => {
      const c = new pg.Client({ connectionString: databaseUrl });
      await c.connect();
      await c.query(`delete from sessions where id = any($1)`, [sessionIds]).finally(() => c.end());
    },
  };
}

/** Rows a run wrote, found by the run's entry-key prefix. */
export async function rowsWritten(databaseUrl: string, keyPrefix: string): Promise<{ count: number; keys: Set<string> }> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const r = await client.query<{ key: string; kind: string }>(
      `select idempotency_key as key, 'analysis' as kind from analyses where idempotency_key like $1
       union all
       select idempotency_key, 'meter' from meter_readings where idempotency_key like $1`,
      [`${keyPrefix}%`],
    );
    return { count: r.rows.length, keys: new Set(r.rows.map((row) => row.key)) };
  } finally {
    await client.end();
  }
}
