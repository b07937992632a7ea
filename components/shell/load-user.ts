import 'server-only';
import { headers } from 'next/headers';
import { redirect } from 'next/navigation';
import { isDatabaseUnavailable } from '@/db/errors';
import { getCurrentUser, type SessionUser } from '@/lib/auth/current-user';

// For layouts: the signed-in user, 'unavailable' when the database cannot be reached, or a redirect
// to sign-in. Layouts only shape the page; every page and action checks permissions itself.
export async function loadLayoutUser(): Promise<SessionUser | 'unavailable'> {
  let user: SessionUser | null;
  try {
    user = await getCurrentUser();
  } catch (err) {
    if (isDatabaseUnavailable(err)) return 'unavailable';
    throw err;
  }
  if (!user) {
    const path = (await headers()).get('x-ampwright-path');
    redirect(path && path.startsWith('/') ? `/sign-in?next=${encodeURIComponent(path)}` : '/sign-in');
  }
  return user;
}
