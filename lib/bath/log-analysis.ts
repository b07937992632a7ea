import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Analysis, AnalysisSource, Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertBathPermission, type BathActor } from './access';
import type { RaiseAlertInput } from './alerts';
import { getAnalyteWithTank, limitsOf, supplyOf, type AnalyteWithTank } from './analytes';
import { badInput } from './checks';
import { evaluateReading, evaluateValue } from './evaluate';
import { readRecommendation, type Recommendation } from './recommend';
import { describeRules, isRuleId, RULE_WINDOW, rulesAtLast } from './run-rules';
import type { RuleId } from './spc';
import type { AnalysisInputs } from './methods/titration';
import type { Verdict } from './verdict';

// Logging one analysis: validate, compute, judge against the limits and the run rules on the last
// 30 points, store, and raise alerts — the analysis and its alerts in one statement. An entry sent
// twice (same key) is stored once; the resend gets the original back. A correction is a new
// analysis that names the one it supersedes; both stay.

export type LogAnalysisInput = {
  key: string;
  tankId: string;
  analyteId: string;
  inputs: AnalysisInputs;
  entryUnit?: string;
  /** A value reported by an outside laboratory, already in the analyte's unit: no method is run. */
  reportedValue?: number;
  takenAt: Date;
  note?: string;
  supersedesId?: string | null;
  source: AnalysisSource;
};

export type LoggedAnalysis = {
  analysis: Analysis;
  verdict: Verdict['status'];
  message: string;
  rules: RuleId[];
  recommendation: Recommendation | null;
  /** Alerts this entry raised for the first time (repeats count on an open alert instead). */
  newAlertIds: string[];
  duplicate: boolean;
};

type Db = Kysely<Database>;
type StoredWithAlerts = Analysis & { raised?: { id: string; inserted: boolean }[] };

/** The method recorded for results reported by an outside laboratory. */
export const OUTSIDE_LAB_METHOD = 'outside-lab';

/** Values of the analyte's current (not superseded) analyses up to `until`, oldest first. */
export async function recentValues(trx: Db, analyteId: string, until: Date, limit: number, excludeId?: string | null): Promise<number[]> {
  let q = trx
    .selectFrom('analyses as a')
    .select(['a.value'])
    .where('a.analyte_id', '=', analyteId)
    .where('a.taken_at', '<=', until)
    .where(({ not, exists, selectFrom }) => not(exists(selectFrom('analyses as s').select('s.id').whereRef('s.supersedes_id', '=', 'a.id'))));
  if (excludeId) q = q.where('a.id', '<>', excludeId);
  const rows = await q.orderBy('a.taken_at', 'desc').limit(limit).execute();
  return rows.map((r) => r.value).reverse();
}

async function checkSupersedes(trx: Db, analyte: AnalyteWithTank, supersedesId: string): Promise<void> {
  const old = await trx.selectFrom('analyses').select(['id', 'analyte_id']).where('id', '=', supersedesId).executeTakeFirst();
  if (!old || old.analyte_id !== analyte.id) throw new AppError('NOT_FOUND', 'The analysis to correct does not exist for this analyte.');
  const later = await trx.selectFrom('analyses').select('id').where('supersedes_id', '=', supersedesId).executeTakeFirst();
  if (later) throw new AppError('CONFLICT', 'That analysis has already been corrected: correct the newest entry instead.');
}

function fromStored(row: Analysis, duplicate: boolean): LoggedAnalysis {
  return {
    analysis: row,
    verdict: row.verdict,
    message: '',
    rules: row.rules.filter(isRuleId),
    recommendation: readRecommendation(row.recommendation),
    newAlertIds: [],
    duplicate,
  };
}

export async function logAnalysis(actor: BathActor, input: LogAnalysisInput, executor: Db = defaultDb): Promise<LoggedAnalysis> {
  assertBathPermission(actor, 'bath.log');
  // Three reads that do not depend on one another: on the pool they go out at once (one round trip
  // of waiting instead of three); in a caller's transaction, one after another on its connection.
  const reads = [
    () => executor.selectFrom('analyses').selectAll().where('idempotency_key', '=', input.key).executeTakeFirst(),
    () => getAnalyteWithTank(input.tankId, input.analyteId, executor),
    () => recentValues(executor, input.analyteId, input.takenAt, RULE_WINDOW - 1, input.supersedesId),
  ] as const;
  const [existing, analyte, previous] = executor.isTransaction
    ? [await reads[0](), await reads[1](), await reads[2]()]
    : await Promise.all([reads[0](), reads[1](), reads[2]()]);
  if (existing) return fromStored(existing, true);
  if (!analyte) throw new AppError('NOT_FOUND', 'That analyte does not belong to this tank.');
  if (!analyte.is_active) throw new AppError('CONFLICT', `${analyte.name} is no longer analysed on this tank.`);
  const subject = {
    key: analyte.key,
    name: analyte.name,
    unit: analyte.unit,
    methodId: analyte.method_id,
    limits: { ...limitsOf(analyte), target: analyte.target },
    supply: supplyOf(analyte),
  };
  const evaluation =
    input.reportedValue !== undefined
      ? evaluateValue(subject, analyte.volume_l, input.reportedValue)
      : evaluateReading(subject, analyte.volume_l, input.inputs, input.entryUnit);
  if (!evaluation.ok) throw badInput(evaluation.field, evaluation.message);
  const { value, verdict, recommendation } = evaluation;

  const rules = rulesAtLast([...previous, value]);
  const where = `${analyte.tank_code} ${analyte.tank_name}, ${analyte.name}`;
  const alerts: Omit<RaiseAlertInput, 'analysisId'>[] = [
    ...(verdict.status === 'out_of_range'
      ? [{
          tankId: analyte.tank_id,
          analyteId: analyte.id,
          kind: 'out_of_limits' as const,
          dedupeKey: `out_of_limits:${analyte.id}`,
          message: `${where}: ${verdict.message}`,
          detail: { value, unit: analyte.unit, limit: verdict.limit, outOfSpec: verdict.outOfSpec },
        }]
      : []),
    ...(rules.length > 0
      ? [{
          tankId: analyte.tank_id,
          analyteId: analyte.id,
          kind: 'run_rule' as const,
          dedupeKey: `run_rule:${analyte.id}`,
          message: `${where}: ${describeRules(rules)} (last ${RULE_WINDOW} analyses).`,
          detail: { value, rules },
        }]
      : []),
  ];
  const store = async (q: Db): Promise<LoggedAnalysis> => {
    const insert = q
      .insertInto('analyses')
      .values({
        tank_id: analyte.tank_id,
        analyte_id: analyte.id,
        method_id: input.reportedValue !== undefined ? OUTSIDE_LAB_METHOD : analyte.method_id,
        inputs: JSON.stringify({ ...input.inputs, ...(input.entryUnit ? { entryUnit: input.entryUnit } : {}) }),
        value,
        unit: analyte.unit,
        verdict: verdict.status,
        severity: verdict.severity,
        rules,
        recommendation: recommendation.kind === 'none' ? null : JSON.stringify(recommendation),
        source: input.source,
        taken_at: input.takenAt,
        logged_by: actor.id,
        idempotency_key: input.key,
        supersedes_id: input.supersedesId ?? null,
        note: input.note ?? '',
      })
      .onConflict((oc) => oc.column('idempotency_key').doNothing())
      .returningAll();
    // The analysis and its alerts in one statement: stored together or not at all.
    const row = alerts.length === 0 ? await insert.executeTakeFirst() : (await sql<StoredWithAlerts>`
      with a as (${insert}),
      al as (
        insert into bath_alerts (tank_id, analyte_id, analysis_id, kind, dedupe_key, message, detail)
        select v.tank_id::uuid, v.analyte_id::uuid, a.id, v.kind, v.dedupe_key, v.message, v.detail::jsonb
          from a, (values ${sql.join(alerts.map((x) => sql`(${x.tankId}, ${x.analyteId ?? null}, ${x.kind}, ${x.dedupeKey}, ${x.message.slice(0, 1000)}, ${JSON.stringify(x.detail ?? {})})`))})
            as v (tank_id, analyte_id, kind, dedupe_key, message, detail)
        -- As raiseAlert: a repeat while the alert is open counts on it (a literal predicate, to match the partial index).
        on conflict (dedupe_key) where state <> 'acknowledged' do update set
          occurrences = bath_alerts.occurrences + 1, last_seen_at = now(), analysis_id = coalesce(excluded.analysis_id, bath_alerts.analysis_id)
        returning id, (xmax = 0) as inserted
      )
      select a.*, (select coalesce(json_agg(al), '[]'::json) from al) as raised from a`.execute(q)).rows[0];
    if (!row) {
      // The same entry arrived twice at once: the other request stored it.
      const original = await q.selectFrom('analyses').selectAll().where('idempotency_key', '=', input.key).executeTakeFirstOrThrow();
      return fromStored(original, true);
    }
    const { raised = [], ...analysis } = row as StoredWithAlerts;
    const newAlertIds = raised.filter((r) => r.inserted).map((r) => r.id);
    return { analysis, verdict: verdict.status, message: verdict.message, rules, recommendation, newAlertIds, duplicate: false };
  };

  try {
    // One statement writes the entry and any alert it raises, so no transaction is needed; a
    // correction checks what it supersedes in the same transaction as it is written (the caller's,
    // if it has one: a lab upload is all rows or none).
    if (!input.supersedesId) return await store(executor);
    const work = async (trx: Db) => {
      await checkSupersedes(trx, analyte, input.supersedesId!);
      return store(trx);
    };
    return await (executor.isTransaction ? work(executor) : executor.transaction().execute(work));
  } catch (e) {
    if (isUniqueViolation(e, 'analyses_supersedes_id_key')) {
      throw new AppError('CONFLICT', 'That analysis has just been corrected by someone else: reload and correct the newest entry.');
    }
    throw e;
  }
}

export function isUniqueViolation(e: unknown, constraint: string): boolean {
  const err = e as { code?: string; constraint?: string };
  return err?.code === '23505' && err.constraint === constraint;
}
