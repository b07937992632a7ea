import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getCurrentUser, getPendingSignIn, homePathFor } from '@/lib/auth/current-user';
import { SignInForm } from './sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

const NOTICES: Record<string, string> = {
  'password-set': 'Your password is set. Sign in with it now.',
  'signed-out': 'You have signed out.',
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; notice?: string }> }) {
  const user = await getCurrentUser();
  if (user) redirect(homePathFor(user));
  const { next, notice } = await searchParams;
  if (await getPendingSignIn()) redirect(`/two-factor${next ? `?next=${encodeURIComponent(next)}` : ''}`);
  return (
    <>
      <h1 className="mb-4 text-lg font-semibold">Sign in</h1>
      <SignInForm next={next} notice={notice ? NOTICES[notice] : undefined} />
    </>
  );
}
