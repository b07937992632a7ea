import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getCurrentUser, getPendingSignIn, homePathFor } from '@/lib/auth/current-user';
import { VerifyForm } from './verify-form';

export const metadata: Metadata = { title: 'Second factor' };

export default async function SecondFactorPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  const pending = await getPendingSignIn();
  if (!pending) {
    const user = await getCurrentUser();
    redirect(user ? homePathFor(user) : '/sign-in');
  }
  if (pending.step === 'enrol') redirect(`/two-factor/setup${next ? `?next=${encodeURIComponent(next)}` : ''}`);
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Second factor</h1>
      <p className="mb-4 text-sm text-ink-muted">Signing in as {pending.user.email}. Type the 6-digit code your authenticator app shows for Ampwright.</p>
      <VerifyForm next={next} />
    </>
  );
}
