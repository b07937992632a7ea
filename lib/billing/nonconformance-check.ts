// Quality hold on invoicing: a work order with an open nonconformance (no disposition yet, so
// closed_at is empty) is not billed until quality has dealt with it.
import { sql, type Kysely } from 'kysely';
import type { Database } from '@/db/types';

/** The ids among `workOrderIds` that have an open nonconformance. */
export async function ordersWithOpenNonconformance(database: Kysely<Database>, workOrderIds: readonly string[]): Promise<string[]> {
  if (workOrderIds.length === 0) return [];
  // The quality records migration may not be applied yet on every database this code meets.
  const table = await sql<{ name: string | null }>`select to_regclass('public.nonconformances')::text as name`.execute(database);
  if (!table.rows[0]?.name) return [];
  const rows = await database
    .selectFrom('nonconformances')
    .select('work_order_id')
    .distinct()
    .where('work_order_id', 'in', [...workOrderIds])
    .where('closed_at', 'is', null)
    .execute();
  return rows.map((r) => r.work_order_id);
}
