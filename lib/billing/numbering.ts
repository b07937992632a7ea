// Invoice and credit-note numbers: I2026-00001, C2026-00001. Sequential per year and never reused:
// the counter row is bumped inside the transaction that issues the document, so its row lock
// serialises concurrent issues and a rolled-back issue takes its number back with it.
import { sql, type Transaction } from 'kysely';
import type { Database } from '@/db/types';

export type BillingSeries = 'invoice' | 'credit_note';

const PREFIX: Record<BillingSeries, string> = { invoice: 'I', credit_note: 'C' };

export function formatBillingNumber(series: BillingSeries, year: number, seq: number): string {
  return `${PREFIX[series]}${year}-${String(seq).padStart(5, '0')}`;
}

export async function nextBillingNumber(trx: Transaction<Database>, series: BillingSeries, year: number): Promise<string> {
  const { last_seq } = await trx
    .insertInto('number_counters')
    .values({ series, year, last_seq: 1 })
    .onConflict((oc) => oc.columns(['series', 'year']).doUpdateSet({ last_seq: sql<number>`number_counters.last_seq + 1` }))
    .returning('last_seq')
    .executeTakeFirstOrThrow();
  return formatBillingNumber(series, year, last_seq);
}
