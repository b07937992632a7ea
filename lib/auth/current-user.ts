import 'server-only';
import { cache } from 'react';
import { cookies } from 'next/headers';
import { forbidden, redirect } from 'next/navigation';
import type { Session, User } from 'lucia';
import { lucia } from './lucia';
import { type Permission, roleCan } from './roles';
import { AppError } from '@/lib/errors';

export type SessionUser = User;

/**
 * What a session still lacks: the code of an enrolled second factor ('verify'), or, for an owner,
 * setting one up ('enrol'). Until then the session reaches nothing but those two pages.
 */
export function missingStep(user: Pick<User, 'role'>, session: Pick<Session, 'secondFactor' | 'userHasTwoFactor'>): 'verify' | 'enrol' | null {
  if (session.secondFactor) return null;
  if (session.userHasTwoFactor) return 'verify';
  if (user.role === 'owner') return 'enrol';
  return null;
}

/** Any session cookie, complete or not (sign-out ends either). */
export const validate = cache(async (): Promise<{ user: User; session: Session } | { user: null; session: null }> => {
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

/** A session that has given the password but still owes its second step, for the two pages that finish it. */
export async function getPendingSignIn(): Promise<{ user: User; session: Session; step: 'verify' | 'enrol' } | null> {
  const r = await validate();
  if (!r.user) return null;
  const step = missingStep(r.user, r.session);
  return step ? { user: r.user, session: r.session, step } : null;
}

// Who is signed in, fully: a session still owing its second factor counts as signed out here.
// Cached per request; refreshes or clears the cookie where the framework allows it.
export const getSession = cache(async (): Promise<{ user: User; session: Session } | { user: null; session: null }> => {
  const r = await validate();
  if (!r.user || missingStep(r.user, r.session)) return { user: null, session: null };
  return r;
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
  if (!user) {
    const carry = nextPath ? `?next=${encodeURIComponent(nextPath)}` : '';
    // A password-only session finishes its second step rather than starting over.
    redirect((await getPendingSignIn()) ? `/two-factor${carry}` : `/sign-in${carry}`);
  }
  if (!roleCan(user.role, permission)) forbidden();
  return user;
}

export function homePathFor(user: Pick<SessionUser, 'role'>): string {
  return user.role === 'customer' ? '/portal' : '/home';
}
