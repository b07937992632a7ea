import 'server-only';
// A tank's process settings (what its family keeps besides the chemistry) and the date its bath was
// last made up. Changed by a supervisor, audited; the values go through the family's schema.
import { type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { familyOfTemplate, getFamily } from '@/lib/families';
import { readFamilyFields, type FormUnits } from '@/lib/families/form';
import { assertCan, writeAudit } from '@/lib/records/audit';
import type { SessionUser } from '@/lib/auth/current-user';

export async function updateTankSettings(
  actor: SessionUser,
  input: { tankId: string; form: Record<string, unknown>; madeUpOn: string | null; units: FormUnits },
  database: Kysely<Database> = defaultDb,
): Promise<void> {
  assertCan(actor, 'bath.limits');
  await database.transaction().execute(async (trx) => {
    const tank = await trx.selectFrom('tanks').select(['id', 'template_id', 'family_settings', 'made_up_at']).where('id', '=', input.tankId).forUpdate().executeTakeFirst();
    if (!tank) throw new AppError('NOT_FOUND', 'That tank does not exist.');
    const family = getFamily(familyOfTemplate(tank.template_id));
    if (!family.tankSettings) throw new AppError('BAD_INPUT', `A ${family.label.toLowerCase()} tank keeps no process settings.`);
    const parsed = family.tankSettings.schema.safeParse(readFamilyFields(family.tankSettings.fields, input.form, 'ts_', input.units));
    if (!parsed.success) {
      const fieldErrors: Record<string, string[]> = {};
      for (const issue of parsed.error.issues) (fieldErrors[`ts_${String(issue.path[0] ?? '')}`] ??= []).push(issue.message);
      throw new AppError('BAD_INPUT', 'Check the highlighted settings.', fieldErrors);
    }
    let madeUpAt: Date | null = tank.made_up_at;
    if (input.madeUpOn) {
      madeUpAt = new Date(`${input.madeUpOn}T06:00:00Z`);
      if (Number.isNaN(madeUpAt.getTime()) || madeUpAt.getTime() > Date.now()) {
        throw new AppError('BAD_INPUT', 'The make-up date must be a real day, today or earlier.', { madeUpOn: ['Use today or an earlier day.'] });
      }
    }
    await trx.updateTable('tanks').set({ family_settings: JSON.stringify(parsed.data), made_up_at: madeUpAt }).where('id', '=', tank.id).execute();
    await writeAudit(trx, actor, 'tank.settings', 'tank', tank.id, { before: tank.family_settings, after: parsed.data, madeUpAt });
  });
}
