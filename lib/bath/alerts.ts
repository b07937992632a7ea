import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { AlertKind, AlertState, Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertBathPermission, type BathActor } from './access';

// Bath alerts: raised by logging and by the scheduled checks, acknowledged by a supervisor with
// the corrective action taken. One open alert per condition (its dedupe key): a repeat while it is
// open counts on the same alert instead of raising another.

export const ALERT_KIND_LABEL: Record<AlertKind, string> = {
  out_of_limits: 'Out of limits',
  run_rule: 'Control rule fired',
  overdue: 'Analysis overdue',
  addition_missing: 'Addition not recorded',
  end_of_life: 'Bath at the end of its life',
};

export const ALERT_STATE_LABEL: Record<AlertState, string> = {
  open: 'Open',
  acknowledged: 'Acknowledged',
  escalated: 'Escalated',
};

export type RaiseAlertInput = {
  tankId: string;
  analyteId?: string | null;
  analysisId?: string | null;
  kind: AlertKind;
  dedupeKey: string;
  message: string;
  detail?: Record<string, unknown>;
};

/** Raises an alert, or counts a repeat on the open one with the same key. `isNew` says which. */
export async function raiseAlert(executor: Kysely<Database>, a: RaiseAlertInput): Promise<{ id: string; isNew: boolean }> {
  const row = await executor
    .insertInto('bath_alerts')
    .values({
      tank_id: a.tankId,
      analyte_id: a.analyteId ?? null,
      analysis_id: a.analysisId ?? null,
      kind: a.kind,
      dedupe_key: a.dedupeKey,
      message: a.message.slice(0, 1000),
      detail: JSON.stringify(a.detail ?? {}),
    })
    .onConflict((oc) =>
      oc
        .column('dedupe_key')
        // A literal, not a parameter: PostgreSQL must match it to the partial index's predicate.
        .where(sql<boolean>`state <> 'acknowledged'`)
        .doUpdateSet({
          occurrences: sql`bath_alerts.occurrences + 1`,
          last_seen_at: sql`now()`,
          analysis_id: sql`coalesce(excluded.analysis_id, bath_alerts.analysis_id)`,
        }),
    )
    .returning(['id', sql<boolean>`(xmax = 0)`.as('inserted')])
    .executeTakeFirstOrThrow();
  return { id: row.id, isNew: row.inserted };
}

export async function acknowledgeAlert(
  actor: BathActor,
  input: { alertId: string; correctiveAction: string },
  executor: Kysely<Database> = defaultDb,
): Promise<void> {
  assertBathPermission(actor, 'alerts.ack');
  const action = input.correctiveAction.trim();
  if (action.length < 3) {
    throw new AppError('BAD_INPUT', 'Describe the corrective action taken.', { correctiveAction: ['Describe the corrective action taken (at least 3 characters).'] });
  }
  await executor.transaction().execute(async (trx) => {
    const done = await trx
      .updateTable('bath_alerts')
      .set({ state: 'acknowledged', acknowledged_at: sql`now()`, acknowledged_by: actor.id, corrective_action: action })
      .where('id', '=', input.alertId)
      .where('state', '<>', 'acknowledged')
      .returning('id')
      .executeTakeFirst();
    if (!done) {
      const exists = await trx.selectFrom('bath_alerts').select('state').where('id', '=', input.alertId).executeTakeFirst();
      if (!exists) throw new AppError('NOT_FOUND', 'That alert does not exist.');
      throw new AppError('CONFLICT', 'This alert has already been acknowledged.');
    }
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actor.id, action: 'bath_alert.acknowledge', entity: 'bath_alert', entity_id: input.alertId, detail: JSON.stringify({ correctiveAction: action }) })
      .execute();
  });
}

/** Open and escalated alerts: the number in the navigation badge. */
export async function countOpenAlerts(executor: Kysely<Database> = defaultDb): Promise<number> {
  const r = await executor
    .selectFrom('bath_alerts')
    .select(sql<number>`count(*)::int`.as('n'))
    .where('state', '<>', 'acknowledged')
    .executeTakeFirstOrThrow();
  return r.n;
}

export type AlertRow = Awaited<ReturnType<typeof findAlerts>>[number];

export async function findAlerts(
  filter: { open: boolean; tankId?: string; limit?: number },
  executor: Kysely<Database> = defaultDb,
) {
  let q = executor
    .selectFrom('bath_alerts as al')
    .innerJoin('tanks as t', 't.id', 'al.tank_id')
    .leftJoin('tank_analytes as a', 'a.id', 'al.analyte_id')
    .leftJoin('users as u', 'u.id', 'al.acknowledged_by')
    .select([
      'al.id', 'al.kind', 'al.state', 'al.message', 'al.occurrences', 'al.raised_at', 'al.last_seen_at', 'al.escalated_at',
      'al.acknowledged_at', 'al.corrective_action', 'al.tank_id', 'al.analyte_id', 't.code as tank_code', 't.name as tank_name',
      'a.name as analyte_name', 'u.name as acknowledged_by_name',
    ]);
  q = filter.open ? q.where('al.state', '<>', 'acknowledged') : q.where('al.state', '=', 'acknowledged');
  if (filter.tankId) q = q.where('al.tank_id', '=', filter.tankId);
  return q
    .orderBy(filter.open ? 'al.raised_at' : 'al.acknowledged_at', 'desc')
    .limit(filter.limit ?? 200)
    .execute();
}
