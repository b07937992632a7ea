// Quality hold on invoicing: a work order with an open nonconformance (no disposition yet, so
// closed_at is empty) is not billed until quality has dealt with it.
import type { Kysely } from 'kysely';
import type { Database } from '@/db/types';

/** The ids among `workOrderIds` that have an open nonconformance. */
export async function ordersWithOpenNonconformance(database: Kysely<Database>, workOrderIds: readonly string[]): Promise<string[]> {
  if (workOrderIds.length === 0) return [];
  const rows = await database
    .selectFrom('nonconformances')
    .select('work_order_id')
    .distinct()
    .where('work_order_id', 'in', [...workOrderIds])
    .where('closed_at', 'is', null)
    .execute();
  return rows.map((r) => r.work_order_id);
}
