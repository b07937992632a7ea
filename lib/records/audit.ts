import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';

/** One audit-log line for a change to a shop record, written in the change's own transaction. */
export async function writeAudit(
  trx: Kysely<Database>,
  actor: SessionUser,
  action: string,
  entity: string,
  entityId: string | null,
  detail: Record<string, unknown> = {},
): Promise<void> {
  await trx.insertInto('audit_log').values({ actor_id: actor.id, action, entity, entity_id: entityId, detail: JSON.stringify(detail) }).execute();
}

/** The business functions check the actor's permission too, so no caller can skip it. */
export function assertCan(actor: SessionUser, permission: Permission): void {
  if (!roleCan(actor.role, permission)) throw new AppError('FORBIDDEN', 'You are not allowed to do this.');
}
