import 'server-only';
// The age of every electroless nickel bath, from the nickel additions since its last make-up, in
// one query for the baths board, the tank page and the floor; and the end-of-life alert.
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { EN_TEMPLATES } from '@/lib/families/electroless-nickel/bath';
import { bathAge, type BathAge } from '@/lib/families/electroless-nickel/bath-age';
import { raiseAlert } from './alerts';
import { readSupply } from './templates/supplies';

type Db = Kysely<Database>;

const EN_TEMPLATE_IDS = EN_TEMPLATES.map((t) => t.id);

export async function findBathAges(tankIds: readonly string[] | null, executor: Db = defaultDb): Promise<Map<string, BathAge>> {
  let tanks = executor.selectFrom('tanks').select(['id', 'volume_l', 'family_settings', 'made_up_at', 'created_at']).where('template_id', 'in', EN_TEMPLATE_IDS);
  if (tankIds) {
    if (tankIds.length === 0) return new Map();
    tanks = tanks.where('id', 'in', [...tankIds]);
  }
  const rows = await tanks.execute();
  if (rows.length === 0) return new Map();
  // Replenishment of the nickel analyte since the last make-up; a corrected addition counts once (its correction).
  const sums = await executor
    .selectFrom('additions as a')
    .innerJoin('tank_analytes as ta', 'ta.id', 'a.analyte_id')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .select(['a.tank_id', 'a.unit', 'ta.supply', sql<number>`sum(a.amount)::float8`.as('amount')])
    .where('a.tank_id', 'in', rows.map((r) => r.id))
    .where('ta.key', '=', 'nickel')
    .where('a.kind', '<>', 'make_up')
    .where(sql<boolean>`a.made_at >= coalesce(t.made_up_at, t.created_at)`)
    .where(sql<boolean>`not exists (select 1 from additions c where c.supersedes_id = a.id)`)
    .groupBy(['a.tank_id', 'a.unit', 'ta.supply'])
    .execute();
  return new Map(
    rows.map((t) => [
      t.id,
      bathAge({
        volumeL: t.volume_l,
        settings: t.family_settings,
        additions: sums.filter((s) => s.tank_id === t.id).map((s) => ({ amount: s.amount, unit: s.unit, supply: readSupply(s.supply) })),
      }),
    ]),
  );
}

/** After a nickel addition: a bath at or past the end of life the shop set raises one alert per make-up. */
export async function checkBathEndOfLife(executor: Db, tankId: string): Promise<void> {
  const age = (await findBathAges([tankId], executor)).get(tankId);
  if (!age?.atEndOfLife) return;
  const tank = await executor.selectFrom('tanks').select(['code', 'name', 'made_up_at', 'created_at']).where('id', '=', tankId).executeTakeFirstOrThrow();
  await raiseAlert(executor, {
    tankId,
    kind: 'end_of_life',
    dedupeKey: `end_of_life:${tankId}:${(tank.made_up_at ?? tank.created_at).toISOString()}`,
    message: `${tank.code} ${tank.name}: ${age.text}, the end of life set for this bath. Plan a decant and make-up.`,
    detail: { metalTurnovers: age.metalTurnovers, endOfLifeMto: age.endOfLifeMto },
  });
}
