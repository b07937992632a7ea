import 'server-only';
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import type { BathActor } from './access';
import { notifyAlert } from './alert-mail';
import { logAnalysis } from './log-analysis';
import type { Recommendation } from './recommend';
import { recordAddition, recordMeterReading } from './record';
import type { FloorEntry } from './schemas';

// One entry from the floor (sent at once, or later from the device's offline queue) routed to the
// business function for its kind. The answer says whether it was new or a resend of a stored one.

export type FloorEntryAnswer = {
  kind: FloorEntry['kind'];
  key: string;
  id: string;
  duplicate: boolean;
  analysis?: { value: number; unit: string; verdict: string; rules: string[]; recommendation: Recommendation | null; takenAt: string };
  newAlertIds: string[];
};

export async function submitFloorEntry(actor: BathActor, entry: FloorEntry, executor: Kysely<Database> = defaultDb): Promise<FloorEntryAnswer> {
  if (entry.kind === 'analysis') {
    const r = await logAnalysis(
      actor,
      {
        key: entry.key,
        tankId: entry.tankId,
        analyteId: entry.analyteId,
        inputs: entry.inputs,
        entryUnit: entry.entryUnit,
        takenAt: entry.takenAt,
        note: entry.note,
        supersedesId: entry.supersedesId ?? null,
        source: 'floor',
      },
      executor,
    );
    return {
      kind: 'analysis',
      key: entry.key,
      id: r.analysis.id,
      duplicate: r.duplicate,
      analysis: {
        value: r.analysis.value,
        unit: r.analysis.unit,
        verdict: r.analysis.verdict,
        rules: r.rules,
        recommendation: r.recommendation,
        takenAt: r.analysis.taken_at.toISOString(),
      },
      newAlertIds: r.newAlertIds,
    };
  }
  if (entry.kind === 'addition') {
    const r = await recordAddition(
      actor,
      {
        key: entry.key,
        tankId: entry.tankId,
        analyteId: entry.analyteId ?? null,
        analysisId: entry.analysisId ?? null,
        analysisKey: entry.analysisKey ?? null,
        kind: entry.additionKind,
        material: entry.material,
        amount: entry.amount,
        unit: entry.unit,
        recommendedAmount: entry.recommendedAmount ?? null,
        recommendedUnit: entry.recommendedUnit ?? null,
        reason: entry.reason,
        madeAt: entry.madeAt,
        supersedesId: entry.supersedesId ?? null,
      },
      executor,
    );
    return { kind: 'addition', key: entry.key, id: r.addition.id, duplicate: r.duplicate, newAlertIds: [] };
  }
  const r = await recordMeterReading(actor, { key: entry.key, tankId: entry.tankId, ampHours: entry.ampHours, readAt: entry.readAt, note: entry.note }, executor);
  return { kind: 'meter', key: entry.key, id: r.reading.id, duplicate: r.duplicate, newAlertIds: [] };
}

/** E-mails supervisors about newly raised alerts; failures are logged, never thrown at the plater. */
export async function notifyNewAlerts(alertIds: readonly string[]): Promise<void> {
  for (const id of alertIds) {
    try {
      await notifyAlert(id, 'raised');
    } catch (err) {
      console.error(`[bath] alert e-mail for ${id} failed:`, err instanceof Error ? err.message : err);
    }
  }
}
