import 'server-only';
import { checkBathEndOfLife } from './bath-age';
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Addition, AdditionKind, Database, MeterReading } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertBathPermission, type BathActor } from './access';
import { convertSymbol } from './display';
import { isUniqueViolation } from './log-analysis';

// Additions, amp-hour meter readings and Hull cell panels, as recorded at the tank. Each entry
// carries the device's key, so a resend stores nothing new and returns the original.

type Db = Kysely<Database>;

export type RecordAdditionInput = {
  key: string;
  tankId: string;
  analyteId?: string | null;
  analysisId?: string | null;
  analysisKey?: string | null;
  kind: AdditionKind;
  material: string;
  amount: number;
  unit: 'kg' | 'L' | 'lb' | 'gal';
  recommendedAmount?: number | null;
  recommendedUnit?: 'kg' | 'L' | null;
  reason?: string;
  madeAt: Date;
  supersedesId?: string | null;
};

async function requireTank(executor: Db, tankId: string) {
  const tank = await executor.selectFrom('tanks').select(['id', 'code', 'has_ah_meter', 'is_active']).where('id', '=', tankId).executeTakeFirst();
  if (!tank) throw new AppError('NOT_FOUND', 'That tank does not exist.');
  return tank;
}

// The analysis an addition answers. Queued offline, the addition may only know the analysis by its
// entry key; an analysis that never arrived leaves the link empty rather than losing the addition.
async function resolveAnalysis(executor: Db, input: RecordAdditionInput): Promise<string | null> {
  if (!input.analysisId && !input.analysisKey) return null;
  let q = executor.selectFrom('analyses').select(['id', 'tank_id']);
  q = input.analysisId ? q.where('id', '=', input.analysisId) : q.where('idempotency_key', '=', input.analysisKey as string);
  const a = await q.executeTakeFirst();
  if (!a) return null;
  if (a.tank_id !== input.tankId) throw new AppError('BAD_INPUT', 'That analysis belongs to another tank.');
  return a.id;
}

export async function recordAddition(actor: BathActor, input: RecordAdditionInput, executor: Db = defaultDb): Promise<{ addition: Addition; duplicate: boolean }> {
  assertBathPermission(actor, 'bath.log');
  const existing = await executor.selectFrom('additions').selectAll().where('idempotency_key', '=', input.key).executeTakeFirst();
  if (existing) return { addition: existing, duplicate: true };
  await requireTank(executor, input.tankId);
  if (input.analyteId) {
    const a = await executor.selectFrom('tank_analytes').select('id').where('id', '=', input.analyteId).where('tank_id', '=', input.tankId).executeTakeFirst();
    if (!a) throw new AppError('BAD_INPUT', 'That analyte does not belong to this tank.', { analyteId: ['Choose an analyte of this tank.'] });
  }
  if (input.supersedesId) {
    const old = await executor.selectFrom('additions').select(['id', 'tank_id']).where('id', '=', input.supersedesId).executeTakeFirst();
    if (!old || old.tank_id !== input.tankId) throw new AppError('NOT_FOUND', 'The addition to correct does not exist for this tank.');
  }
  const storedUnit = input.unit === 'lb' || input.unit === 'kg' ? 'kg' : 'L';
  const amount = convertSymbol(input.amount, input.unit, storedUnit);
  if (!(amount > 0) || amount >= 100_000) throw new AppError('BAD_INPUT', 'Check the amount.', { amount: ['The amount must be more than zero and less than 100 000.'] });
  const analysisId = await resolveAnalysis(executor, input);
  try {
    const row = await executor
      .insertInto('additions')
      .values({
        tank_id: input.tankId,
        analyte_id: input.analyteId ?? null,
        analysis_id: analysisId,
        kind: input.kind,
        material: input.material.trim(),
        amount,
        unit: storedUnit,
        recommended_amount: input.recommendedUnit && input.recommendedAmount != null ? input.recommendedAmount : null,
        recommended_unit: input.recommendedUnit && input.recommendedAmount != null ? input.recommendedUnit : null,
        reason: input.reason ?? '',
        made_at: input.madeAt,
        made_by: actor.id,
        idempotency_key: input.key,
        supersedes_id: input.supersedesId ?? null,
      })
      .onConflict((oc) => oc.column('idempotency_key').doNothing())
      .returningAll()
      .executeTakeFirst();
    if (row) {
      await checkBathEndOfLife(executor, input.tankId);
      return { addition: row, duplicate: false };
    }
  } catch (e) {
    if (isUniqueViolation(e, 'additions_supersedes_id_key')) throw new AppError('CONFLICT', 'That addition has already been corrected: correct the newest entry instead.');
    throw e;
  }
  const original = await executor.selectFrom('additions').selectAll().where('idempotency_key', '=', input.key).executeTakeFirstOrThrow();
  return { addition: original, duplicate: true };
}

export type RecordMeterInput = { key: string; tankId: string; ampHours: number; readAt: Date; note?: string };

export async function recordMeterReading(actor: BathActor, input: RecordMeterInput, executor: Db = defaultDb): Promise<{ reading: MeterReading; duplicate: boolean }> {
  assertBathPermission(actor, 'bath.log');
  const existing = await executor.selectFrom('meter_readings').selectAll().where('idempotency_key', '=', input.key).executeTakeFirst();
  if (existing) return { reading: existing, duplicate: true };
  const tank = await requireTank(executor, input.tankId);
  if (!tank.has_ah_meter) throw new AppError('CONFLICT', `Tank ${tank.code} has no amp-hour meter.`);
  const row = await executor
    .insertInto('meter_readings')
    .values({ tank_id: input.tankId, amp_hours: input.ampHours, read_at: input.readAt, read_by: actor.id, idempotency_key: input.key, note: input.note ?? '' })
    .onConflict((oc) => oc.column('idempotency_key').doNothing())
    .returningAll()
    .executeTakeFirst();
  if (row) return { reading: row, duplicate: false };
  const original = await executor.selectFrom('meter_readings').selectAll().where('idempotency_key', '=', input.key).executeTakeFirstOrThrow();
  return { reading: original, duplicate: true };
}

export type RecordHullCellInput = { key: string; tankId: string; currentA: number; minutes: number; notes: string; fileId?: string | null; madeAt: Date };

export async function recordHullCellPanel(actor: BathActor, input: RecordHullCellInput, executor: Db = defaultDb): Promise<{ id: string; duplicate: boolean }> {
  assertBathPermission(actor, 'bath.log');
  await requireTank(executor, input.tankId);
  const row = await executor
    .insertInto('hull_cell_panels')
    .values({
      tank_id: input.tankId,
      file_id: input.fileId ?? null,
      current_a: input.currentA,
      minutes: input.minutes,
      notes: input.notes,
      made_at: input.madeAt,
      made_by: actor.id,
      idempotency_key: input.key,
    })
    .onConflict((oc) => oc.column('idempotency_key').doNothing())
    .returning('id')
    .executeTakeFirst();
  if (row) return { id: row.id, duplicate: false };
  const original = await executor.selectFrom('hull_cell_panels').select('id').where('idempotency_key', '=', input.key).executeTakeFirstOrThrow();
  return { id: original.id, duplicate: true };
}
