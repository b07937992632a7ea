import 'server-only';
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
  if (!user) redirect('/sign-in');
  return user;
}
