import 'server-only';
import { type Kysely, sql } from 'kysely';
import { db, type Database } from '@/db';
import { isUuid } from '@/lib/files/store';

export type RateSetStatus = 'past' | 'in force' | 'scheduled';

/** Today's date as the database sees it (YYYY-MM-DD), so every rule uses the same calendar. */
export async function databaseToday(q: Kysely<Database> = db): Promise<string> {
  const row = await sql<{ today: string }>`select to_char(current_date, 'YYYY-MM-DD') as today`.execute(q);
  return row.rows[0]!.today;
}

const DAY = sql<string>`to_char(effective_from, 'YYYY-MM-DD')`.as('effective_day');

/** Every rate set, newest date first, each marked past, in force (on `today`) or scheduled. */
export async function findRateSets(today: string, q: Kysely<Database> = db) {
  const rows = await q.selectFrom('rate_sets').selectAll().select(DAY).orderBy('effective_from', 'desc').execute();
  const inForce = rows.find((r) => r.effective_day <= today)?.id ?? null;
  return rows.map((r) => ({ ...r, status: (r.id === inForce ? 'in force' : r.effective_day > today ? 'scheduled' : 'past') as RateSetStatus }));
}

/** The set in force on `day`: the latest that took effect on or before it. */
export async function getRateSetInForce(day: string, q: Kysely<Database> = db) {
  return (await q.selectFrom('rate_sets').selectAll().select(DAY).where(sql<boolean>`effective_from <= ${day}::date`).orderBy('effective_from', 'desc').limit(1).executeTakeFirst()) ?? null;
}
