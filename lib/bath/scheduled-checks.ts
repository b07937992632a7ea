import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { notifyAlert } from './alert-mail';
import { raiseAlert } from './alerts';
import { getBathSettings } from './settings';
import { formatWhen } from './display';

// The checks the background worker runs on a schedule. Each is idempotent: running it twice raises
// nothing new (alerts dedupe on their key while open) and sends no e-mail twice (alert-mail claims
// each message before sending). `now` is a parameter so tests can move the clock.

type Db = Kysely<Database>;
export type CheckResult = { raised: number; repeated: number; emailed: number };

const HOUR_MS = 3600_000;

async function raiseAndNotify(executor: Db, alerts: Parameters<typeof raiseAlert>[1][]): Promise<CheckResult> {
  const result: CheckResult = { raised: 0, repeated: 0, emailed: 0 };
  for (const a of alerts) {
    const r = await raiseAlert(executor, a);
    if (r.isNew) result.raised++;
    else result.repeated++;
    result.emailed += await notifyAlert(r.id, 'raised', executor);
  }
  return result;
}

/** Analytes whose last analysis (or set-up) is older than their interval plus the grace period. */
export async function checkOverdueAnalyses(now: Date = new Date(), executor: Db = defaultDb): Promise<CheckResult> {
  const { overdueGraceHours } = await getBathSettings(executor);
  const rows = await executor
    .selectFrom('tank_analytes as a')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .leftJoinLateral(
      (eb) => eb.selectFrom('analyses as x').select((e) => e.fn.max('x.taken_at').as('last_at')).whereRef('x.analyte_id', '=', 'a.id').as('last'),
      (join) => join.onTrue(),
    )
    .select(['a.id', 'a.tank_id', 'a.name', 'a.frequency_hours', 't.code', 't.name as tank_name', 'last.last_at', 'a.created_at'])
    .where('a.is_active', '=', true)
    .where('t.is_active', '=', true)
    .where(
      sql<boolean>`coalesce(last.last_at, a.created_at) + (a.frequency_hours + ${overdueGraceHours}) * interval '1 hour' < ${now}`,
    )
    // One alert per lapse: once acknowledged, the same lapse is not raised again.
    .where(({ not, exists, selectFrom }) =>
      not(
        exists(
          selectFrom('bath_alerts as b')
            .select('b.id')
            .where('b.kind', '=', 'overdue')
            .whereRef('b.analyte_id', '=', 'a.id')
            .where(sql<boolean>`b.acknowledged_at > coalesce(last.last_at, a.created_at)`),
        ),
      ),
    )
    .execute();
  return raiseAndNotify(
    executor,
    rows.map((r) => {
      const since = (r.last_at as Date | null) ?? null;
      const hours = Math.round((now.getTime() - (since ?? r.created_at).getTime()) / HOUR_MS);
      return {
        tankId: r.tank_id,
        analyteId: r.id,
        kind: 'overdue' as const,
        dedupeKey: `overdue:${r.id}`,
        message: `${r.code} ${r.tank_name}, ${r.name}: ${since ? `last analysed ${hours} h ago` : `never analysed (set up ${hours} h ago)`}; due every ${r.frequency_hours} h.`,
        detail: { lastAt: since?.toISOString() ?? null, frequencyHours: r.frequency_hours },
      };
    }),
  );
}

/** Open alerts nobody acknowledged within the set time go to the owner. */
export async function escalateUnacknowledged(now: Date = new Date(), executor: Db = defaultDb): Promise<{ escalated: number; emailed: number }> {
  const { escalateAfterHours } = await getBathSettings(executor);
  const cutoff = new Date(now.getTime() - escalateAfterHours * HOUR_MS);
  const rows = await executor
    .updateTable('bath_alerts')
    .set({ state: 'escalated', escalated_at: now })
    .where('state', '=', 'open')
    .where('raised_at', '<', cutoff)
    .returning('id')
    .execute();
  let emailed = 0;
  // Also the escalated alerts whose owner e-mail a crashed run never sent.
  const owed = await executor.selectFrom('bath_alerts').select('id').where('state', '=', 'escalated').where('escalated_at', '>', new Date(now.getTime() - 7 * 24 * HOUR_MS)).execute();
  for (const a of owed) emailed += await notifyAlert(a.id, 'escalated', executor);
  return { escalated: rows.length, emailed };
}

/**
 * One alert per analyte (repeats count on it) for out-of-range analyses of the past week whose recommended correction was not recorded within the
 * grace period: no addition since, no later analysis back in range, and not corrected away.
 */
export async function checkMissingAdditions(now: Date = new Date(), executor: Db = defaultDb): Promise<CheckResult> {
  const { additionGraceHours } = await getBathSettings(executor);
  const due = new Date(now.getTime() - additionGraceHours * HOUR_MS);
  const rows = await executor
    .selectFrom('analyses as an')
    .innerJoin('tank_analytes as a', 'a.id', 'an.analyte_id')
    .innerJoin('tanks as t', 't.id', 'an.tank_id')
    .select(['an.id', 'an.tank_id', 'an.analyte_id', 'an.taken_at', 'an.recommendation', 'a.name', 't.code', 't.name as tank_name'])
    .where('an.verdict', '=', 'out_of_range')
    .where(sql<boolean>`an.recommendation->>'kind' in ('add', 'decant')`)
    .where('an.taken_at', '<', due)
    .where('an.taken_at', '>', new Date(now.getTime() - 7 * 24 * HOUR_MS))
    .where(({ not, exists, selectFrom, or }) =>
      not(
        or([
          exists(selectFrom('analyses as s').select('s.id').whereRef('s.supersedes_id', '=', 'an.id')),
          exists(
            selectFrom('additions as ad')
              .select('ad.id')
              .where((w) => w.or([w('ad.analysis_id', '=', w.ref('an.id')), w.and([w('ad.analyte_id', '=', w.ref('an.analyte_id')), w('ad.made_at', '>=', w.ref('an.taken_at'))])])),
          ),
          exists(
            selectFrom('analyses as later')
              .select('later.id')
              .whereRef('later.analyte_id', '=', 'an.analyte_id')
              .whereRef('later.taken_at', '>', 'an.taken_at')
              .where('later.verdict', '<>', 'out_of_range'),
          ),
          // Once acknowledged, readings taken before the acknowledgement are not raised again.
          exists(
            selectFrom('bath_alerts as b')
              .select('b.id')
              .where('b.kind', '=', 'addition_missing')
              .whereRef('b.analyte_id', '=', 'an.analyte_id')
              .whereRef('b.acknowledged_at', '>', 'an.taken_at'),
          ),
        ]),
      ),
    )
    .execute();
  return raiseAndNotify(
    executor,
    rows.map((r) => ({
      tankId: r.tank_id,
      analyteId: r.analyte_id,
      analysisId: r.id,
      kind: 'addition_missing' as const,
      dedupeKey: `addition_missing:${r.analyte_id}`,
      message: `${r.code} ${r.tank_name}, ${r.name}: the correction recommended on ${formatWhen(r.taken_at)} has not been recorded.`,
      detail: { recommendation: r.recommendation },
    })),
  );
}
