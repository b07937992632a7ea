// Sampling-plan rows in the database, shared by the supervisor's editor and the demo seed. Takes
// the database as an argument (no '@/db'), so the seed scripts can use it with their own pool.
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '@/db/types';
import { Z14_PLAN_NAME, Z14_SOURCE } from './lot';
import { Z14_LEVEL_II, type SamplingRow } from './sampling';

export async function insertPlanRows(trx: Kysely<Database> | Transaction<Database>, planId: string, rows: readonly SamplingRow[]): Promise<void> {
  await trx
    .insertInto('sampling_plan_rows')
    .values(rows.map((r, i) => ({ plan_id: planId, position: i + 1, min_lot: r.minLot, max_lot: r.maxLot, code_letter: r.codeLetter.trim(), sample_size: r.sampleSize })))
    .execute();
}

/** Makes the published Z1.4 level II table the active plan when there is none. Idempotent. */
export async function ensureDefaultSamplingPlan(db: Kysely<Database>): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const active = await trx.selectFrom('sampling_plans').select('id').where('is_active', '=', true).forUpdate().executeTakeFirst();
    if (active) return;
    const plan = await trx
      .insertInto('sampling_plans')
      .values({ name: Z14_PLAN_NAME, source: Z14_SOURCE, is_active: true, created_by: null })
      .returning('id')
      .executeTakeFirstOrThrow();
    await insertPlanRows(trx, plan.id, Z14_LEVEL_II);
  });
}
