// Who may act, checked inside the business functions too: a server action's check guards the
// form, this one guards every other caller (tests, scripts, future routes).
import type { Role } from '@/db/types';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';

export type Actor = { id: string; role: Role; customerId: string | null; name?: string; email?: string };

export function assertCan(actor: Pick<Actor, 'role'>, permission: Permission): void {
  if (!roleCan(actor.role, permission)) throw new AppError('FORBIDDEN', 'You are not allowed to do this.');
}

/** A customer contact acts only for their own company. */
export function ownCustomerId(actor: Actor): string {
  assertCan(actor, 'portal.use');
  if (!actor.customerId) throw new AppError('FORBIDDEN', 'Your account is not linked to a customer.');
  return actor.customerId;
}
