import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { additiveDoses, type AdditiveDue } from './amp-hours';

// A tank's records as they were entered: analyses and additions (superseded ones included and
// marked), meter readings, Hull cell panels, and the additive doses the amp-hours call for.

type Db = Kysely<Database>;

export async function findRecentAnalyses(tankId: string, opts: { analyteId?: string; limit?: number } = {}, executor: Db = defaultDb) {
  let q = executor
    .selectFrom('analyses as a')
    .innerJoin('tank_analytes as ta', 'ta.id', 'a.analyte_id')
    .innerJoin('users as u', 'u.id', 'a.logged_by')
    .leftJoin('analyses as c', 'c.supersedes_id', 'a.id')
    .select([
      'a.id', 'a.analyte_id', 'a.value', 'a.unit', 'a.verdict', 'a.rules', 'a.taken_at', 'a.source', 'a.note', 'a.method_id',
      'a.supersedes_id', 'a.inputs', 'a.recommendation', 'ta.name as analyte_name', 'ta.key as analyte_key', 'u.name as logged_by_name',
      'c.id as superseded_by_id',
    ])
    .where('a.tank_id', '=', tankId);
  if (opts.analyteId) q = q.where('a.analyte_id', '=', opts.analyteId);
  return q.orderBy('a.taken_at', 'desc').orderBy('a.created_at', 'desc').limit(opts.limit ?? 40).execute();
}

export async function findRecentAdditions(tankId: string, limit = 30, executor: Db = defaultDb) {
  return executor
    .selectFrom('additions as ad')
    .innerJoin('users as u', 'u.id', 'ad.made_by')
    .leftJoin('tank_analytes as ta', 'ta.id', 'ad.analyte_id')
    .leftJoin('additions as c', 'c.supersedes_id', 'ad.id')
    .select([
      'ad.id', 'ad.kind', 'ad.material', 'ad.amount', 'ad.unit', 'ad.recommended_amount', 'ad.recommended_unit', 'ad.reason',
      'ad.made_at', 'ad.supersedes_id', 'ta.name as analyte_name', 'u.name as made_by_name', 'c.id as superseded_by_id',
    ])
    .where('ad.tank_id', '=', tankId)
    .orderBy('ad.made_at', 'desc')
    .limit(limit)
    .execute();
}

export async function findMeterReadings(tankId: string, limit = 400, executor: Db = defaultDb) {
  const rows = await executor
    .selectFrom('meter_readings as m')
    .innerJoin('users as u', 'u.id', 'm.read_by')
    .select(['m.id', 'm.amp_hours', 'm.read_at', 'm.note', 'u.name as read_by_name'])
    .where('m.tank_id', '=', tankId)
    .where(({ not, exists, selectFrom }) => not(exists(selectFrom('meter_readings as s').select('s.id').whereRef('s.supersedes_id', '=', 'm.id'))))
    .orderBy('m.read_at', 'desc')
    .limit(limit)
    .execute();
  return rows.reverse();
}

export async function findHullCellPanels(tankId: string, limit = 10, executor: Db = defaultDb) {
  return executor
    .selectFrom('hull_cell_panels as h')
    .innerJoin('users as u', 'u.id', 'h.made_by')
    .select(['h.id', 'h.file_id', 'h.current_a', 'h.minutes', 'h.notes', 'h.made_at', 'u.name as made_by_name'])
    .where('h.tank_id', '=', tankId)
    .orderBy('h.made_at', 'desc')
    .limit(limit)
    .execute();
}

/** Each additive of the tank with its rate, kA·h since its last (current) addition and the dose due. */
export async function findAdditiveDoses(tankId: string, executor: Db = defaultDb): Promise<{ doses: AdditiveDue[]; lastReading: { at: Date; ampHours: number } | null }> {
  const additives = await sql<{ id: string; name: string; rate: number; last_at: Date | null }>`
    select ta.id, ta.name, ta.additive_rate_ml_per_kah as rate,
      (select max(ad.made_at) from additions ad
        where ad.analyte_id = ta.id and not exists (select 1 from additions s where s.supersedes_id = ad.id)) as last_at
    from tank_analytes ta
    where ta.tank_id = ${tankId} and ta.is_active and ta.additive_rate_ml_per_kah is not null
    order by ta.sort_order`.execute(executor);
  const readings = await findMeterReadings(tankId, 400, executor);
  const points = readings.map((r) => ({ at: r.read_at, ampHours: r.amp_hours }));
  const doses = additiveDoses(
    additives.rows.map((a) => ({ analyteId: a.id, name: a.name, rateMlPerKAh: a.rate, lastAdditionAt: a.last_at })),
    points,
  );
  const last = points[points.length - 1];
  return { doses, lastReading: last ?? null };
}
