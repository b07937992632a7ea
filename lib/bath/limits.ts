import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertBathPermission, type BathActor } from './access';
import { validateLimits } from './verdict';

// A supervisor's change to an analyte's limits or frequency, kept with who, when and why.

export type LimitsChange = {
  analyteId: string;
  target: number;
  lowerControl: number | null;
  upperControl: number | null;
  lowerSpec: number | null;
  upperSpec: number | null;
  frequencyHours: number;
  reason: string;
};

const FIELDS = ['target', 'lower_control', 'upper_control', 'lower_spec', 'upper_spec', 'frequency_hours'] as const;
type Snapshot = Record<(typeof FIELDS)[number], number | null>;

export async function updateAnalyteLimits(actor: BathActor, change: LimitsChange, executor: Kysely<Database> = defaultDb): Promise<{ changed: boolean }> {
  assertBathPermission(actor, 'bath.limits');
  const reason = change.reason.trim();
  if (reason.length < 3) throw new AppError('BAD_INPUT', 'Say why the limits change.', { reason: ['Say why the limits change (at least 3 characters).'] });
  if (!(change.frequencyHours > 0 && change.frequencyHours <= 8760)) {
    throw new AppError('BAD_INPUT', 'Check the analysis frequency.', { frequencyHours: ['Give hours between analyses (more than 0).'] });
  }
  // Throws BAD_INPUT naming the field when limits are missing, crossed or nested wrongly.
  validateLimits({
    target: change.target,
    lowerControl: change.lowerControl ?? undefined,
    upperControl: change.upperControl ?? undefined,
    lowerSpec: change.lowerSpec ?? undefined,
    upperSpec: change.upperSpec ?? undefined,
  });
  const after: Snapshot = {
    target: change.target,
    lower_control: change.lowerControl,
    upper_control: change.upperControl,
    lower_spec: change.lowerSpec,
    upper_spec: change.upperSpec,
    frequency_hours: change.frequencyHours,
  };
  return executor.transaction().execute(async (trx) => {
    const current = await trx.selectFrom('tank_analytes').select(['id', ...FIELDS]).where('id', '=', change.analyteId).forUpdate().executeTakeFirst();
    if (!current) throw new AppError('NOT_FOUND', 'That analyte does not exist.');
    const before: Snapshot = Object.fromEntries(FIELDS.map((f) => [f, current[f]])) as Snapshot;
    if (FIELDS.every((f) => before[f] === after[f])) return { changed: false };
    await trx
      .updateTable('tank_analytes')
      .set({
        target: change.target,
        lower_control: change.lowerControl,
        upper_control: change.upperControl,
        lower_spec: change.lowerSpec,
        upper_spec: change.upperSpec,
        frequency_hours: change.frequencyHours,
        updated_at: sql`now()`,
      })
      .where('id', '=', change.analyteId)
      .execute();
    await trx
      .insertInto('analyte_limit_changes')
      .values({ analyte_id: change.analyteId, changed_by: actor.id, reason, before: JSON.stringify(before), after: JSON.stringify(after) })
      .execute();
    return { changed: true };
  });
}

export async function findLimitChanges(analyteIds: readonly string[], executor: Kysely<Database> = defaultDb) {
  if (analyteIds.length === 0) return [];
  return executor
    .selectFrom('analyte_limit_changes as c')
    .innerJoin('users as u', 'u.id', 'c.changed_by')
    .select(['c.id', 'c.analyte_id', 'c.reason', 'c.before', 'c.after', 'c.created_at', 'u.name as changed_by_name'])
    .where('c.analyte_id', 'in', analyteIds)
    .orderBy('c.created_at', 'desc')
    .limit(100)
    .execute();
}
