import 'server-only';
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import type { Hazard } from './hazards';
import { findRecentAnalyses } from './history';
import { findAnalyteStatus, getTank, isUuid, type AnalyteStatus } from './queries';
import { readSupply, type AnalyteSupply } from './templates/supplies';
import { getTemplate } from './templates';

// What the floor screens need, shaped as plain data for the client components.

export type FloorAnalyte = {
  id: string;
  key: string;
  name: string;
  unit: string;
  methodId: string;
  target: number;
  lowerControl: number | null;
  upperControl: number | null;
  lowerSpec: number | null;
  upperSpec: number | null;
  supply: AnalyteSupply | null;
  rateMlPerKAh: number | null;
  lastValue: number | null;
  lastVerdict: AnalyteStatus['last_verdict'];
  lastTakenAt: string | null;
  isOverdue: boolean;
};

export type FloorTank = {
  id: string;
  code: string;
  name: string;
  lineName: string;
  volumeL: number;
  hasAhMeter: boolean;
  templateName: string;
  hazards: Hazard[];
  /** A Hull cell panel tells something only of a bath that plates metal by current. */
  takesHullCell: boolean;
  analytes: FloorAnalyte[];
};

function toFloorAnalyte(a: AnalyteStatus): FloorAnalyte {
  return {
    id: a.id,
    key: a.key,
    name: a.name,
    unit: a.unit,
    methodId: a.method_id,
    target: a.target,
    lowerControl: a.lower_control,
    upperControl: a.upper_control,
    lowerSpec: a.lower_spec,
    upperSpec: a.upper_spec,
    supply: readSupply(a.supply),
    rateMlPerKAh: a.additive_rate_ml_per_kah,
    lastValue: a.last_value,
    lastVerdict: a.last_verdict,
    lastTakenAt: a.last_taken_at ? new Date(a.last_taken_at).toISOString() : null,
    isOverdue: a.is_overdue,
  };
}

export async function getFloorTank(where: { code: string } | { id: string }, executor: Kysely<Database> = defaultDb): Promise<FloorTank | null> {
  const tank = await getTank(where, executor);
  if (!tank) return null;
  const template = getTemplate(tank.template_id);
  const analytes = await findAnalyteStatus([tank.id], new Date(), executor);
  return {
    id: tank.id,
    code: tank.code,
    name: tank.name,
    lineName: tank.line_name,
    volumeL: tank.volume_l,
    hasAhMeter: tank.has_ah_meter,
    templateName: template?.name ?? tank.template_id,
    hazards: template?.hazards ?? [],
    takesHullCell: !!template?.deposit,
    analytes: analytes.map(toFloorAnalyte),
  };
}

export type CorrectionTarget = { id: string; value: number; unit: string; takenAt: string; inputs: Record<string, unknown> };

/** The analysis a plater is correcting: it must be this analyte's and not already corrected. */
export async function getCorrectionTarget(analyteId: string, analysisId: string | undefined, executor: Kysely<Database> = defaultDb): Promise<CorrectionTarget | null> {
  if (!analysisId || !isUuid(analysisId)) return null;
  const a = await executor
    .selectFrom('analyses as a')
    .leftJoin('analyses as c', 'c.supersedes_id', 'a.id')
    .select(['a.id', 'a.value', 'a.unit', 'a.taken_at', 'a.inputs', 'c.id as corrected_by'])
    .where('a.id', '=', analysisId)
    .where('a.analyte_id', '=', analyteId)
    .executeTakeFirst();
  if (!a || a.corrected_by) return null;
  return { id: a.id, value: a.value, unit: a.unit, takenAt: a.taken_at.toISOString(), inputs: a.inputs };
}

export async function recentForAnalyte(tankId: string, analyteId: string, executor: Kysely<Database> = defaultDb) {
  const rows = await findRecentAnalyses(tankId, { analyteId, limit: 5 }, executor);
  return rows.map((r) => ({
    id: r.id,
    value: r.value,
    unit: r.unit,
    verdict: r.verdict,
    takenAt: r.taken_at.toISOString(),
    supersededBy: r.superseded_by_id,
    loggedBy: r.logged_by_name,
  }));
}
