import 'server-only';
import { toStorage } from '@/lib/plating';
import { type Kysely, sql } from 'kysely';
import { db, type Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { readFileFor } from '@/lib/files/access';
import { FILE_KINDS, CONTENT_TYPE } from '@/lib/files/sniff';
import { assertCan, writeAudit } from '@/lib/records/audit';
import { inTransaction } from '@/lib/records/transaction';
import { measurePartArea, partWeightG } from './measure';
import type { PartInput } from './schemas';

const DRAWING_TYPES = new Set<string>(FILE_KINDS.drawing.map((k) => CONTENT_TYPE[k]));

async function checkDrawing(actor: SessionUser, fileId: string | null, trx: Kysely<Database>): Promise<void> {
  if (!fileId) return;
  const file = await readFileFor(actor, fileId, trx);
  if (!file || !DRAWING_TYPES.has(file.content_type)) {
    throw new AppError('BAD_INPUT', 'Check the highlighted field.', { drawingFile: ['Upload the drawing again: the stored file was not found.'] });
  }
}

/** Creates or updates a part (by `partId`), with its area measured on the server. */
export async function savePart(actor: SessionUser, input: PartInput, q: Kysely<Database> = db): Promise<{ partId: string }> {
  assertCan(actor, 'customers.write');
  return inTransaction(q, async (trx) => {
    const customer = await trx.selectFrom('customers').select('id').where('id', '=', input.customerId).executeTakeFirst();
    if (!customer) throw new AppError('BAD_INPUT', 'Check the highlighted field.', { customerId: ['Choose the customer.'] });
    const clash = await trx
      .selectFrom('parts')
      .select('id')
      .where('customer_id', '=', input.customerId)
      .where('part_number', '=', input.partNumber)
      .where('revision', '=', input.revision)
      .$if(input.partId !== null, (b) => b.where('id', '<>', input.partId!))
      .executeTakeFirst();
    if (clash) {
      throw new AppError('CONFLICT', 'Check the highlighted field.', {
        partNumber: [`This customer already has part ${input.partNumber}${input.revision ? ` revision ${input.revision}` : ''}.`],
      });
    }
    await checkDrawing(actor, input.drawingFileId, trx);
    const measured = await measurePartArea(actor, input.area, input.substrate, trx);
    const calculationId = measured.calculation
      ? (
          await trx
            .insertInto('calculations')
            .values({
              title: `Area of ${input.partNumber}${input.revision ? ` rev ${input.revision}` : ''}`,
              input: JSON.stringify(measured.calculation.input),
              result: JSON.stringify(measured.calculation.result),
              area_dm2: measured.areaDm2,
              created_by: actor.id,
            })
            .returning('id')
            .executeTakeFirstOrThrow()
        ).id
      : null;
    const values = {
      customer_id: input.customerId,
      part_number: input.partNumber,
      revision: input.revision,
      description: input.description,
      substrate: input.substrate,
      tensile_mpa: input.tensileMpa,
      hardness_hrc: input.hardnessHrc,
      corrosivity_category: input.corrosivityCategory,
      design_life_years: input.designLifeYears,
      size_tolerance_um: input.sizeTolerance === null ? null : toStorage(input.sizeTolerance, input.sizeToleranceUnit),
      area_dm2: measured.areaDm2,
      weight_g: partWeightG(input, measured.volumeCm3, input.substrate),
      calculation_id: calculationId,
      stl_file_id: measured.stlFileId,
    };
    if (input.partId === null) {
      const row = await trx
        .insertInto('parts')
        .values({ ...values, drawing_file_id: input.drawingFileId })
        .returning('id')
        .executeTakeFirstOrThrow();
      await writeAudit(trx, actor, 'part.create', 'part', row.id, { partNumber: input.partNumber, areaMethod: input.area.method });
      return { partId: row.id };
    }
    const current = await trx.selectFrom('parts').select(['id', 'drawing_file_id']).where('id', '=', input.partId).forUpdate().executeTakeFirst();
    if (!current) throw new AppError('NOT_FOUND', 'That part does not exist.');
    await trx
      .updateTable('parts')
      .set({ ...values, drawing_file_id: input.drawingFileId ?? current.drawing_file_id, updated_at: sql`now()` })
      .where('id', '=', input.partId)
      .execute();
    await writeAudit(trx, actor, 'part.update', 'part', input.partId, { partNumber: input.partNumber, areaMethod: input.area.method });
    return { partId: input.partId };
  });
}
