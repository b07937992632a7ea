// Document numbers, sequential per year and never reused. The counter row is bumped inside the
// caller's transaction: the row lock serialises concurrent creates, and a rolled-back create rolls
// its number back too, so no number is ever issued twice or skipped by a failure.
import { sql, type Transaction } from 'kysely';
import type { Database, NumberCountersTable } from '@/db/types';

type Series = NumberCountersTable['series'];

const FORMAT: Partial<Record<Series, { prefix: string; digits: number }>> = {
  quote: { prefix: 'Q', digits: 4 },
  work_order: { prefix: 'W', digits: 5 },
  certificate: { prefix: 'CC', digits: 5 },
  receipt: { prefix: 'R', digits: 5 },
  shipment: { prefix: 'S', digits: 5 },
};

export function formatDocumentNumber(series: Series, year: number, seq: number): string {
  const f = FORMAT[series];
  if (!f) throw new Error(`No number format for the ${series} series.`);
  return `${f.prefix}${year}-${String(seq).padStart(f.digits, '0')}`;
}

export async function nextDocumentNumber(trx: Transaction<Database>, series: Series, at: Date = new Date()): Promise<string> {
  const year = at.getUTCFullYear();
  const row = await trx
    .insertInto('number_counters')
    .values({ series, year, last_seq: 1 })
    .onConflict((oc) => oc.columns(['series', 'year']).doUpdateSet({ last_seq: sql<number>`number_counters.last_seq + 1` }))
    .returning('last_seq')
    .executeTakeFirstOrThrow();
  return formatDocumentNumber(series, year, row.last_seq);
}
