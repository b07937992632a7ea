import 'server-only';
import { cache } from 'react';
import { cookies } from 'next/headers';
import { forbidden, redirect } from 'next/navigation';
import type { Session, User } from 'lucia';
import { lucia } from './lucia';
import { type Permission, roleCan } from './roles';
import { AppError } from '@/lib/errors';

export type SessionUser = User;

// Who is signed in. Cached per request; refreshes or clears the cookie where the framework allows
// it (setting a cookie throws while a Server Component renders, which is harmless here).
export const getSession = cache(async (): Promise<{ user: User; session: Session } | { user: null; session: null }> => {
  const jar = await cookies();
  const id = jar.get(lucia.sessionCookieName)?.value ?? null;
  if (!id) return { user: null, session: null };
  const result = await lucia.validateSession(id);
  try {
    if (result.session?.fresh) {
      const c = lucia.createSessionCookie(result.session.id);
      jar.set(c.name, c.value, c.attributes);
    }
    if (!result.session) {
      const c = lucia.createBlankSessionCookie();
      jar.set(c.name, c.value, c.attributes);
    }
  } catch {
    // Server Components cannot set cookies.
  }
  if (result.user && !result.user.isActive) return { user: null, session: null };
  return result;
});

export async function getCurrentUser(): Promise<SessionUser | null> {
  return (await getSession()).user;
}

export function can(user: SessionUser | null, permission: Permission): boolean {
  return !!user && roleCan(user.role, permission);
}

// For server actions and route handlers: throws AppError, which the wrappers map to 401/403.
export async function requirePermission(permission: Permission): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) throw new AppError('UNAUTHENTICATED', 'Please sign in.');
  if (!roleCan(user.role, permission)) throw new AppError('FORBIDDEN', 'You are not allowed to do this.');
  return user;
}

// For pages: a signed-out visitor goes to sign-in; a signed-in user without the permission gets
// the 403 "not allowed" page and no data.
export async function requirePageUser(permission: Permission, nextPath?: string): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) redirect(nextPath ? `/sign-in?next=${encodeURIComponent(nextPath)}` : '/sign-in');
  if (!roleCan(user.role, permission)) forbidden();
  return user;
}

export function homePathFor(user: Pick<SessionUser, 'role'>): string {
  return user.role === 'customer' ? '/portal' : '/home';
}
