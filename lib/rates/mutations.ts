import 'server-only';
import { type Kysely, sql } from 'kysely';
import { db, type Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { assertCan, writeAudit } from '@/lib/records/audit';
import { inTransaction } from '@/lib/records/transaction';
import { databaseToday } from './queries';
import type { RateSetInput } from './schemas';

// A rate set in force or past has priced quotes already, so it never changes; only a set that
// takes effect after today may be edited. A new set takes effect today or later.
export async function saveRateSet(actor: SessionUser, input: RateSetInput, q: Kysely<Database> = db): Promise<{ rateSetId: string }> {
  assertCan(actor, 'rates.manage');
  const { rateSetId, ...fields } = input;
  const values = { ...fields, metal_per_kg_cents: JSON.stringify(fields.metal_per_kg_cents) };
  return inTransaction(q, async (trx) => {
    const today = await databaseToday(trx);
    if (input.effective_from < today) {
      throw new AppError('BAD_INPUT', 'Check the highlighted field.', { effectiveFrom: [`Rates cannot take effect in the past; choose ${today} or later.`] });
    }
    const clash = await trx
      .selectFrom('rate_sets')
      .select('id')
      .where(sql<boolean>`effective_from = ${input.effective_from}::date`)
      .$if(rateSetId !== null, (b) => b.where('id', '<>', rateSetId!))
      .executeTakeFirst();
    if (clash) throw new AppError('CONFLICT', 'Check the highlighted field.', { effectiveFrom: ['Another rate set already takes effect on that date. Edit that one instead.'] });
    if (rateSetId === null) {
      const row = await trx.insertInto('rate_sets').values({ ...values, created_by: actor.id }).returning('id').executeTakeFirstOrThrow();
      await writeAudit(trx, actor, 'rates.create', 'rate_set', row.id, { effectiveFrom: input.effective_from });
      return { rateSetId: row.id };
    }
    const current = await trx
      .selectFrom('rate_sets')
      .select(['id', sql<string>`to_char(effective_from, 'YYYY-MM-DD')`.as('day')])
      .where('id', '=', rateSetId)
      .forUpdate()
      .executeTakeFirst();
    if (!current) throw new AppError('NOT_FOUND', 'That rate set does not exist.');
    if (current.day <= today) throw new AppError('CONFLICT', 'This rate set has taken effect and is kept as it was. Add a new set with a later date instead.');
    await trx.updateTable('rate_sets').set(values).where('id', '=', rateSetId).execute();
    await writeAudit(trx, actor, 'rates.update', 'rate_set', rateSetId, { effectiveFrom: input.effective_from });
    return { rateSetId };
  });
}
