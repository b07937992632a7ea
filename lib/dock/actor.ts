// Who acts at the dock, checked inside each business function too (forms check first; scripts,
// tests and the API reach these directly).
import type { Role } from '@/db/types';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';

export type DockActor = { id: string; role: Role; name?: string };

export function assertDock(actor: DockActor, permission: Permission): void {
  if (!roleCan(actor.role, permission)) throw new AppError('FORBIDDEN', 'You are not allowed to do this.');
}
