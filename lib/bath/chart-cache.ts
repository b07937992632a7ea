import 'server-only';
import { sql, type Kysely } from 'kysely';
import { LRUCache } from 'lru-cache';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { etagForKey } from '@/lib/http-etag';
import type { UnitSystem } from '@/lib/plating/units';
import { type ChartRange, getChartData, type LimitBasis } from './chart';

// A chart's JSON kept in PostgreSQL (chart_cache) under what it was worked out from: the analyte's
// count of changes to its analyses (a trigger bumps it in the same transaction as the change), its
// limits, names and this module's output format. A reader whose stamp matches gets the stored
// answer; any new or corrected analysis, a change of limits or a new format means the next reader
// works the chart out again and stores it. Five years of readings are read and judged once per
// change, not once per request. Each app process also keeps the charts it served lately under the
// same stamp (read from PostgreSQL before every answer, so another process's change is seen at the
// next read): a repeated read is the stamp's one-row statement and no 100 KB body from the database.

/** Bump when getChartData's output changes shape or content, so charts stored by an older build are not served. */
export const CHART_FORMAT = 1;

// At most 200 charts and 64 MB of JSON per process.
const kept = new LRUCache<string, { body: string; etag: string }>({ max: 200, maxSize: 64 * 1024 * 1024, sizeCalculation: (a) => Math.max(1, a.body.length) });

/** Forgets the charts this process keeps: it then reads as a process that has served none yet would (tests). */
export function forgetKeptCharts(): void {
  kept.clear();
}

/**
 * The chart's JSON and its validator (named by the stamp, so a revalidation needs no body). The
 * stamp is read before the readings: a chart worked out from a later snapshot than its stamp holds
 * at least what the stamp promises (a reader with a newer stamp misses and works it out again), so
 * no reader is ever served a chart older than the data it could see.
 */
export async function chartAnswer(
  tankId: string,
  analyteId: string,
  range: ChartRange,
  system: UnitSystem,
  basis: LimitBasis,
  executor: Kysely<Database> = defaultDb,
): Promise<{ body: string; etag: string }> {
  const { view, version } = await stampOf(tankId, analyteId, range, system, basis, executor);
  const key = `${analyteId}|${view}|${version}`;
  const held = kept.get(key);
  if (held) return held;
  const answer = { body: await storedOrWorkedOut(tankId, analyteId, range, system, basis, view, version, executor), etag: etagForKey('c', key) };
  kept.set(key, answer);
  return answer;
}

/** The chart's JSON alone. */
export async function chartJson(
  tankId: string,
  analyteId: string,
  range: ChartRange,
  system: UnitSystem,
  basis: LimitBasis,
  executor: Kysely<Database> = defaultDb,
): Promise<string> {
  return (await chartAnswer(tankId, analyteId, range, system, basis, executor)).body;
}

async function stampOf(tankId: string, analyteId: string, range: ChartRange, system: UnitSystem, basis: LimitBasis, executor: Kysely<Database>): Promise<{ view: string; version: string }> {
  const stamp = await executor
    .selectFrom('tank_analytes as a')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .select([
      'a.analyses_version',
      sql<string>`a.updated_at::text`.as('analyte_updated'),
      sql<string>`md5(concat_ws('|', a.key, a.name, a.unit, a.lower_spec, a.upper_spec, t.code, t.name))`.as('names'),
    ])
    .where('a.id', '=', analyteId)
    .where('a.tank_id', '=', tankId)
    .executeTakeFirst();
  if (!stamp) throw new AppError('NOT_FOUND', 'That analyte does not belong to this tank.');
  const view = `${range.from.toISOString()}/${range.to.toISOString()}/${basis}/${system}`;
  const version = `${CHART_FORMAT}:${stamp.analyses_version}:${stamp.analyte_updated}:${stamp.names}`;
  return { view, version };
}

async function storedOrWorkedOut(
  tankId: string,
  analyteId: string,
  range: ChartRange,
  system: UnitSystem,
  basis: LimitBasis,
  view: string,
  version: string,
  executor: Kysely<Database>,
): Promise<string> {
  const hit = await executor
    .selectFrom('chart_cache')
    .select('body')
    .where('analyte_id', '=', analyteId)
    .where('view', '=', view)
    .where('version', '=', version)
    .executeTakeFirst();
  if (hit) return hit.body;
  const body = JSON.stringify(await getChartData(tankId, analyteId, range, system, executor, basis));
  await executor.transaction().execute(async (trx) => {
    await trx
      .insertInto('chart_cache')
      .values({ analyte_id: analyteId, view, version, body })
      .onConflict((oc) => oc.columns(['analyte_id', 'view']).doUpdateSet({ version, body, created_at: sql`now()` }))
      .execute();
    // Charts of this analyte worked out from older data are of no more use to anyone.
    await trx.deleteFrom('chart_cache').where('analyte_id', '=', analyteId).where('version', '<>', version).execute();
  });
  return body;
}
