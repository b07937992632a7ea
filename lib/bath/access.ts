// Who may act, checked inside the bath business functions as well as by the page, action or route
// wrapper, so that scripts, jobs and tests cannot skip it.
import type { Role } from '@/db/types';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';

export type BathActor = { id: string; role: Role };

export function assertBathPermission(actor: BathActor, permission: Permission): void {
  if (!roleCan(actor.role, permission)) throw new AppError('FORBIDDEN', 'You are not allowed to do this.');
}
