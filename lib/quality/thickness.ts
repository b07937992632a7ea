import 'server-only';
// Recording thickness readings: by hand or from an instrument's CSV. All readings of one entry are
// judged against the finish's limits and written together, or none are. A failing entry opens a
// nonconformance unless one for thickness is already open on the order.
import { randomUUID } from 'node:crypto';
import type { Kysely } from 'kysely';
import { db } from '@/db';
import type { Database } from '@/db/types';
import type { ThicknessMethod } from '@/db/types/quality';
import { AppError } from '@/lib/errors';
import { FILE_KINDS } from '@/lib/files/sniff';
import { storeFile } from '@/lib/files/store';
import { type Actor, audit, lockOrder, requireActor } from './access';
import { METHOD_CODES } from './methods';
import { judgeReadings } from './stats';
import { parseThicknessCsv, type CsvProblem } from './thickness-csv';

export type ReadingInput = { partNo: number; location: string; method: ThicknessMethod; thicknessUm: number };

export type RecordReadingsResult = { count: number; failCount: number; message: string; nonconformanceId: string | null };

const OPEN_STATES = new Set(['in_process', 'plated', 'baked']);
export const MAX_READINGS_PER_ENTRY = 5000;

function checkInputs(readings: readonly ReadingInput[]): void {
  if (!Array.isArray(readings) || readings.length === 0) throw new AppError('BAD_INPUT', 'Enter at least one reading.');
  if (readings.length > MAX_READINGS_PER_ENTRY) throw new AppError('BAD_INPUT', `At most ${MAX_READINGS_PER_ENTRY} readings at once.`);
  const fieldErrors: Record<string, string[]> = {};
  readings.forEach((r, i) => {
    const add = (f: string, m: string) => (fieldErrors[`rows.${i}.${f}`] ??= []).push(m);
    if (!Number.isInteger(r.partNo) || r.partNo < 1 || r.partNo > 100000) add('partNo', 'A part number from 1 to 100000.');
    if (!r.location?.trim() || r.location.trim().length > 120) add('location', 'Where on the part (up to 120 characters).');
    if (!METHOD_CODES.includes(r.method)) add('method', 'Choose a method.');
    if (typeof r.thicknessUm !== 'number' || !Number.isFinite(r.thicknessUm) || r.thicknessUm < 0 || r.thicknessUm >= 5000) {
      add('thickness', 'A thickness from 0 to 5000 µm.');
    }
  });
  if (Object.keys(fieldErrors).length) throw new AppError('BAD_INPUT', 'Some readings are not valid; nothing was saved.', fieldErrors);
}

export async function recordReadings(
  actor: Actor,
  input: { workOrderId: string; readings: readonly ReadingInput[]; entry: 'manual' | 'csv'; file?: { name: string; bytes: Uint8Array; declaredType?: string | null } },
  database: Kysely<Database> = db,
): Promise<RecordReadingsResult> {
  requireActor(actor, 'quality.record', 'You are not allowed to record thickness readings.');
  checkInputs(input.readings);
  return database.transaction().execute(async (trx) => {
    const order = await lockOrder(trx, input.workOrderId);
    if (!OPEN_STATES.has(order.state)) {
      throw new AppError('CONFLICT', `Thickness readings are recorded between plating and inspection; this order is ${order.state.replace('_', ' ')}.`);
    }
    const finish = await trx
      .selectFrom('work_orders as w')
      .innerJoin('finishes as f', 'f.id', 'w.finish_id')
      .select(['f.min_thickness_um', 'f.max_thickness_um', 'f.spec_text'])
      .where('w.id', '=', order.id)
      .executeTakeFirstOrThrow();
    const limits = { minimum: finish.min_thickness_um, maximum: finish.max_thickness_um ?? undefined };
    const judged = judgeReadings(input.readings.map((r) => r.thicknessUm), limits);
    const file = input.file
      ? await storeFile({ name: input.file.name, bytes: input.file.bytes, declaredType: input.file.declaredType, allowed: FILE_KINDS.csv, uploadedBy: actor.id, maxBytes: 2 * 1024 * 1024 }, trx)
      : null;
    const uploadId = randomUUID();
    await trx
      .insertInto('thickness_readings')
      .values(
        input.readings.map((r, i) => ({
          work_order_id: order.id,
          part_no: r.partNo,
          location: r.location.trim(),
          method: r.method,
          thickness_um: r.thicknessUm,
          minimum_um: finish.min_thickness_um,
          maximum_um: finish.max_thickness_um,
          status: judged.readings[i]!.status,
          entry: input.entry,
          upload_id: uploadId,
          source_file_id: file?.id ?? null,
          recorded_by: actor.id,
        })),
      )
      .execute();

    let nonconformanceId: string | null = null;
    if (!judged.allPass) {
      const open = await trx
        .selectFrom('nonconformances')
        .select('id')
        .where('work_order_id', '=', order.id)
        .where('source', '=', 'thickness')
        .where('disposition', 'is', null)
        .executeTakeFirst();
      nonconformanceId =
        open?.id ??
        (
          await trx
            .insertInto('nonconformances')
            .values({
              work_order_id: order.id,
              source: 'thickness',
              description: failureDescription(judged.readings, limits, finish.spec_text),
              opened_by: actor.id,
            })
            .returning('id')
            .executeTakeFirstOrThrow()
        ).id;
    }
    await audit(trx, actor, 'quality.readings.record', 'work_order', order.id, { count: judged.readings.length, failCount: judged.failCount, entry: input.entry, uploadId });
    const message = judged.allPass
      ? `All ${judged.readings.length} readings meet the specification.`
      : `${failureDescription(judged.readings, limits, finish.spec_text).replace(/^Thickness against [^:]*: /, '')}`;
    return { count: judged.readings.length, failCount: judged.failCount, message, nonconformanceId };
  });
}

function failureDescription(judged: readonly { status: string }[], limits: { minimum: number; maximum?: number }, spec: string): string {
  const below = judged.filter((r) => r.status === 'below_minimum').length;
  const above = judged.filter((r) => r.status === 'above_maximum').length;
  const what = [below ? `${below} below the minimum ${limits.minimum} µm` : '', above ? `${above} above the maximum ${limits.maximum} µm` : ''].filter(Boolean);
  return `Thickness against ${spec || 'the finish specification'}: ${below + above} of ${judged.length} readings fail (${what.join('; ')}).`;
}

export class CsvRejected extends AppError {
  readonly problems: CsvProblem[];
  constructor(problems: CsvProblem[]) {
    super('BAD_INPUT', `The file was not saved: ${problems.length} ${problems.length === 1 ? 'problem' : 'problems'} found. Nothing was written.`);
    this.problems = problems;
  }
}

/** Checks every row of the CSV, then records all its readings, or nothing. */
export async function recordReadingsCsv(
  actor: Actor,
  input: { workOrderId: string; fileName: string; bytes: Uint8Array; declaredType?: string | null; defaultMethod?: ThicknessMethod | null },
): Promise<RecordReadingsResult> {
  requireActor(actor, 'quality.record', 'You are not allowed to record thickness readings.');
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(input.bytes);
  } catch {
    throw new AppError('BAD_INPUT', `"${input.fileName}" is not a UTF-8 text file.`);
  }
  const parsed = parseThicknessCsv(text, { defaultMethod: input.defaultMethod ?? null });
  if (!parsed.ok) throw new CsvRejected(parsed.problems);
  return recordReadings(actor, {
    workOrderId: input.workOrderId,
    entry: 'csv',
    readings: parsed.readings.map(({ partNo, location, method, thicknessUm }) => ({ partNo, location, method, thicknessUm })),
    file: { name: input.fileName, bytes: input.bytes, declaredType: input.declaredType },
  });
}

/** A supervisor voids a reading taken in error; it stays on record with the reason. */
export async function voidReading(actor: Actor, input: { readingId: string; reason: string }): Promise<void> {
  requireActor(actor, 'quality.disposition', 'Only a supervisor may void a thickness reading.');
  const reason = input.reason?.trim() ?? '';
  if (reason.length < 3) throw new AppError('BAD_INPUT', 'Say why the reading is void.', { reason: ['Say why the reading is void.'] });
  await db.transaction().execute(async (trx) => {
    const r = /^[0-9a-f-]{36}$/i.test(input.readingId)
      ? await trx.selectFrom('thickness_readings').select(['id', 'work_order_id', 'voided_at']).where('id', '=', input.readingId).executeTakeFirst()
      : undefined;
    if (!r) throw new AppError('NOT_FOUND', 'That reading does not exist.');
    const order = await lockOrder(trx, r.work_order_id);
    if (!OPEN_STATES.has(order.state)) throw new AppError('CONFLICT', 'Readings of an inspected lot cannot be voided.');
    if (r.voided_at) throw new AppError('CONFLICT', 'That reading is already void.');
    await trx.updateTable('thickness_readings').set({ voided_at: new Date(), voided_by: actor.id, void_reason: reason }).where('id', '=', r.id).execute();
    await audit(trx, actor, 'quality.reading.void', 'work_order', order.id, { readingId: r.id, reason });
  });
}
