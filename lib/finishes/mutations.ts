import 'server-only';
import type { Kysely } from 'kysely';
import { db, type Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { assertCan, writeAudit } from '@/lib/records/audit';
import { inTransaction } from '@/lib/records/transaction';
import type { FinishInput } from './schemas';

/** Creates or updates (by `finishId`) a finish specification. */
export async function saveFinish(actor: SessionUser, input: FinishInput, q: Kysely<Database> = db): Promise<{ finishId: string }> {
  assertCan(actor, 'quotes.write');
  const { finishId, ...fields } = input;
  const values = { ...fields, process_route: JSON.stringify(fields.process_route) };
  return inTransaction(q, async (trx) => {
    const clash = await trx
      .selectFrom('finishes')
      .select('id')
      .where('code', '=', input.code)
      .$if(finishId !== null, (b) => b.where('id', '<>', finishId!))
      .executeTakeFirst();
    if (clash) throw new AppError('CONFLICT', 'Check the highlighted field.', { code: [`Another finish already uses the code ${input.code}.`] });
    if (input.line_id) {
      const line = await trx.selectFrom('lines').select('id').where('id', '=', input.line_id).executeTakeFirst();
      if (!line) throw new AppError('BAD_INPUT', 'Check the highlighted field.', { lineId: ['Choose a line.'] });
    }
    if (finishId === null) {
      const row = await trx.insertInto('finishes').values(values).returning('id').executeTakeFirstOrThrow();
      await writeAudit(trx, actor, 'finish.create', 'finish', row.id, { code: input.code });
      return { finishId: row.id };
    }
    const updated = await trx.updateTable('finishes').set(values).where('id', '=', finishId).executeTakeFirst();
    if (Number(updated.numUpdatedRows) === 0) throw new AppError('NOT_FOUND', 'That finish does not exist.');
    await writeAudit(trx, actor, 'finish.update', 'finish', finishId, { code: input.code });
    return { finishId };
  });
}
