import 'server-only';
// Saving the shop's edit of a passivation window: checked by the window schema, kept beside the
// other windows in the settings table, audited. The defaults and their sources stay in the code.
import { db as defaultDb } from '@/db';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/types';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { assertCan, writeAudit } from '@/lib/records/audit';
import { PASSIVATION_WINDOWS_KEY } from '../shop-data';
import { shopWindowSchema, type ShopWindow } from './windows';

export async function savePassivationWindow(actor: SessionUser, edit: unknown, database: Kysely<Database> = defaultDb): Promise<ShopWindow> {
  assertCan(actor, 'bath.limits');
  const parsed = shopWindowSchema.safeParse(edit);
  if (!parsed.success) {
    const fieldErrors: Record<string, string[]> = {};
    for (const issue of parsed.error.issues) (fieldErrors[issue.path.join('.') || '_form'] ??= []).push(issue.message);
    throw new AppError('BAD_INPUT', 'Check the highlighted figures; nothing was saved.', fieldErrors);
  }
  const w = parsed.data;
  await database.transaction().execute(async (trx) => {
    const row = await trx.selectFrom('settings').select('value').where('key', '=', PASSIVATION_WINDOWS_KEY).forUpdate().executeTakeFirst();
    const others = (Array.isArray(row?.value) ? (row.value as { id?: unknown }[]) : []).filter((x) => x?.id !== w.id);
    const value = JSON.stringify([...others, w]);
    await trx
      .insertInto('settings')
      .values({ key: PASSIVATION_WINDOWS_KEY, value })
      .onConflict((oc) => oc.column('key').doUpdateSet({ value, updated_at: new Date() }))
      .execute();
    await writeAudit(trx, actor, 'settings.passivation_window', 'setting', PASSIVATION_WINDOWS_KEY, { window: w });
  });
  return w;
}
