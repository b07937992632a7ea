import 'server-only';
// The sampling table a supervisor keeps (lot size range → sample size). A change saves a new plan
// and makes it the active one; the earlier plan stays on record with its rows.
import { db } from '@/db';
import { AppError } from '@/lib/errors';
import { type Actor, audit, requireActor } from './access';
import { validateSamplingTable, type SamplingRow } from './sampling';
import { insertPlanRows } from './sampling-store';
import { getActiveSamplingPlan } from './lot';

export type PlanInput = { name: string; source: string; rows: SamplingRow[] };

export async function replaceSamplingPlan(actor: Actor, input: PlanInput): Promise<string> {
  requireActor(actor, 'quality.disposition', 'Only a supervisor may change the sampling table.');
  const name = input.name?.trim() ?? '';
  const source = input.source?.trim() ?? '';
  const fieldErrors: Record<string, string[]> = {};
  if (!name || name.length > 200) fieldErrors.name = ['Name the plan (up to 200 characters).'];
  if (source.length > 300) fieldErrors.source = ['At most 300 characters.'];
  const problems = validateSamplingTable(input.rows ?? []);
  if (problems.length) fieldErrors.rows = problems;
  if (input.rows?.length > 100) (fieldErrors.rows ??= []).push('At most 100 rows.');
  if (Object.keys(fieldErrors).length) throw new AppError('BAD_INPUT', 'The table was not saved: check the rows.', fieldErrors);
  return db.transaction().execute(async (trx) => {
    // Serialises concurrent saves: the second waits, then deactivates the first one's plan.
    await trx.selectFrom('sampling_plans').select('id').where('is_active', '=', true).forUpdate().execute();
    await trx.updateTable('sampling_plans').set({ is_active: false }).where('is_active', '=', true).execute();
    const plan = await trx
      .insertInto('sampling_plans')
      .values({ name, source, is_active: true, created_by: actor.id })
      .returning('id')
      .executeTakeFirstOrThrow();
    await insertPlanRows(trx, plan.id, input.rows);
    await audit(trx, actor, 'quality.sampling.replace', 'sampling_plan', plan.id, { rows: input.rows.length });
    return plan.id;
  });
}

export async function findSamplingPlanHistory() {
  return db
    .selectFrom('sampling_plans as s')
    .leftJoin('users as u', 'u.id', 's.created_by')
    .select(['s.id', 's.name', 's.source', 's.is_active', 's.created_at', 'u.name as created_by_name'])
    .orderBy('s.created_at', 'desc')
    .limit(20)
    .execute();
}

/** The plan in force, read with the app's database. */
export async function getActivePlan() {
  return getActiveSamplingPlan(db);
}
