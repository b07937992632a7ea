import 'server-only';
// Recording a process family's own lot records (seal test, phosphorus content, passivation
// verification, salt spray), and voiding one entered in error. A record is never edited: a void
// keeps it with its reason, and a new record replaces it.
import type { Kysely } from 'kysely';
import { db } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { type Actor, audit, lockOrder, requireActor } from '../access';
import { lotFamily } from '../lot-checks';
import { loadLot } from '../lot';
import { judgeProcessRecord, PROCESS_RECORD_LABELS, type ProcessRecordInput } from './rules';

// Records are taken once the parts have been through the process, and before the certificate.
const RECORD_STATES = new Set(['in_process', 'plated', 'baked', 'inspected']);

export async function recordProcessRecord(actor: Actor, input: ProcessRecordInput, database: Kysely<Database> = db): Promise<{ id: string; verdict: 'pass' | 'fail'; reasons: string[] }> {
  requireActor(actor, 'quality.record', 'You are not allowed to record quality tests.');
  const judged = judgeProcessRecord(input);
  return database.transaction().execute(async (trx) => {
    const order = await lockOrder(trx, input.workOrderId);
    if (!RECORD_STATES.has(order.state)) {
      throw new AppError('CONFLICT', `Quality tests are recorded after the process and before shipping; this order is ${order.state.replace('_', ' ')}.`);
    }
    const lot = (await loadLot(trx, order.id))!;
    if (lot.certificate) throw new AppError('CONFLICT', `Certificate ${lot.certificate.number} is issued: the lot's records are closed.`);
    const { family } = lotFamily(lot);
    if (!family.quality.some((q) => q.kind === input.kind)) {
      throw new AppError('BAD_INPUT', `A ${PROCESS_RECORD_LABELS[input.kind].toLowerCase()} is not a record of ${family.label.toLowerCase()}.`);
    }
    const row = await trx
      .insertInto('process_records')
      .values({
        work_order_id: order.id,
        kind: input.kind,
        method: judged.method,
        values: JSON.stringify(judged.values),
        verdict: judged.verdict,
        reasons: JSON.stringify(judged.reasons),
        notes: input.notes,
        recorded_by: actor.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await audit(trx, actor, 'quality.process_record', 'work_order', order.id, { recordId: row.id, kind: input.kind, verdict: judged.verdict });
    return { id: row.id, verdict: judged.verdict, reasons: judged.reasons };
  });
}

export async function voidProcessRecord(actor: Actor, input: { workOrderId: string; recordId: string; reason: string }, now: Date = new Date(), database: Kysely<Database> = db): Promise<void> {
  requireActor(actor, 'quality.disposition', 'Only a supervisor may void a quality record.');
  const reason = input.reason.trim();
  if (reason.length < 3 || reason.length > 500) throw new AppError('BAD_INPUT', 'Say why the record is void (3–500 characters).', { reason: ['Say why the record is void.'] });
  await database.transaction().execute(async (trx) => {
    const order = await lockOrder(trx, input.workOrderId);
    const cert = await trx.selectFrom('certificates').select('number').where('work_order_id', '=', order.id).executeTakeFirst();
    if (cert) throw new AppError('CONFLICT', `Certificate ${cert.number} is issued: the lot's records are closed.`);
    const done = await trx
      .updateTable('process_records')
      .set({ voided_at: now, voided_by: actor.id, void_reason: reason })
      .where('id', '=', input.recordId)
      .where('work_order_id', '=', order.id)
      .where('voided_at', 'is', null)
      .returning('id')
      .executeTakeFirst();
    if (!done) throw new AppError('NOT_FOUND', 'That record does not exist or is already void.');
    await audit(trx, actor, 'quality.process_record.void', 'work_order', order.id, { recordId: input.recordId, reason });
  });
}
