import 'server-only';
import type { Kysely } from 'kysely';
import { db as defaultDb, type Database } from '@/db';
import { zodFieldErrors } from '@/lib/action';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { PlatingInputError } from '@/lib/plating';
import { writeAudit } from '@/lib/records/audit';
import { inTransaction } from '@/lib/records/transaction';
import { computeCalculation, fieldErrorsOf, INPUT_PATHS, type CalculationResult } from './calculation';
import { calculationInputSchema } from './calculation-schema';

export type SaveCalculationData = {
  title: string;
  input: unknown;
  // Whatever the browser computed. Never stored: the server recomputes from the input.
  result?: unknown;
};

/** Stores a workbench calculation with figures recomputed here from its input. */
export async function saveCalculation(
  actor: SessionUser,
  data: SaveCalculationData,
  conn: Kysely<Database> = defaultDb,
): Promise<{ id: string; result: CalculationResult }> {
  const title = typeof data.title === 'string' ? data.title.trim() : '';
  if (title.length < 1 || title.length > 200) {
    throw new AppError('BAD_INPUT', 'Give the calculation a title of 1 to 200 characters.', { title: ['Enter a title of 1 to 200 characters.'] });
  }
  const parsed = calculationInputSchema.safeParse(data.input);
  if (!parsed.success) {
    throw new AppError('BAD_INPUT', 'The calculation could not be read; check the workbench fields and try again.', zodFieldErrors(parsed.error));
  }
  let result: CalculationResult;
  try {
    result = computeCalculation(parsed.data);
  } catch (e) {
    if (!(e instanceof PlatingInputError)) throw e;
    throw new AppError('BAD_INPUT', e.message, fieldErrorsOf(e, INPUT_PATHS, 'input'));
  }
  return inTransaction(conn, async (trx) => {
    const row = await trx
      .insertInto('calculations')
      .values({
        title,
        input: JSON.stringify(parsed.data),
        result: JSON.stringify(result),
        area_dm2: result.geometry.areaDm2,
        created_by: actor.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await writeAudit(trx, actor, 'calculation.save', 'calculation', row.id, { title });
    return { id: row.id, result };
  });
}
