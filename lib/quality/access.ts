import 'server-only';
// The permission check inside each quality write (the wrappers check too; a direct call from a
// script or a test must not slip past), the audit line each write leaves, and the order lock.
import type { Transaction } from 'kysely';
import type { Database, WorkOrderState } from '@/db/types';
import type { SessionUser } from '@/lib/auth/current-user';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';

export type Actor = Pick<SessionUser, 'id' | 'name' | 'role' | 'isActive'>;

export function requireActor(actor: Actor, permission: Permission, message: string): void {
  if (!actor.isActive || !roleCan(actor.role, permission)) throw new AppError('FORBIDDEN', message);
}

export async function audit(
  trx: Transaction<Database>,
  actor: Actor,
  action: string,
  entity: string,
  entityId: string,
  detail: Record<string, unknown> = {},
): Promise<void> {
  await trx.insertInto('audit_log').values({ actor_id: actor.id, action, entity, entity_id: entityId, detail: JSON.stringify(detail) }).execute();
}

/** Locks the work order for the rest of the transaction, so two writers judge the same lot in turn. */
export async function lockOrder(trx: Transaction<Database>, workOrderId: string): Promise<{ id: string; state: WorkOrderState }> {
  const row = /^[0-9a-f-]{36}$/i.test(workOrderId)
    ? await trx.selectFrom('work_orders').select(['id', 'state']).where('id', '=', workOrderId).forUpdate().executeTakeFirst()
    : undefined;
  if (!row) throw new AppError('NOT_FOUND', 'That work order does not exist.');
  return row;
}
