import { redirect } from 'next/navigation';
import { getCurrentUser, homePathFor } from '@/lib/auth/current-user';

// The front door: each signed-in user goes to their own home; everyone else to sign-in.
export default async function Index() {
  const user = await getCurrentUser();
  redirect(user ? homePathFor(user) : '/sign-in');
}
