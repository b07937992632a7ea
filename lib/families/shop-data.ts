// What a family keeps for the whole shop besides finishes and tanks (the passivation windows the
// shop has edited), loaded from the settings table where a family needs it. Families without any
// get nothing. Takes the database as an argument (like lib/quality/lot.ts, which calls it), and
// lives outside the family folders, which the browser imports too.
import type { Kysely, Transaction } from 'kysely';
import type { Database, ProcessFamilyId } from '@/db/types';
import { windowsInForce } from './passivation/windows';

type Db = Kysely<Database> | Transaction<Database>;

export const PASSIVATION_WINDOWS_KEY = 'passivation_windows';

const LOADERS: Partial<Record<ProcessFamilyId, (db: Db) => Promise<Record<string, unknown>>>> = {
  passivation: async (db) => {
    const row = await db.selectFrom('settings').select('value').where('key', '=', PASSIVATION_WINDOWS_KEY).executeTakeFirst();
    return { passivationWindows: windowsInForce(row?.value) };
  },
};

export async function loadFamilyData(db: Db, family: ProcessFamilyId | undefined): Promise<Record<string, unknown>> {
  const loader = LOADERS[family ?? 'electroplating'];
  return loader ? loader(db) : {};
}

/** Every family's shop data, keyed by family (the workbench's calculators need them all). */
export async function loadAllFamilyData(db: Db): Promise<Partial<Record<ProcessFamilyId, Record<string, unknown>>>> {
  const entries = await Promise.all(Object.entries(LOADERS).map(async ([id, load]) => [id, await load!(db)] as const));
  return Object.fromEntries(entries);
}
