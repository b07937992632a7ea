import type { Metadata } from 'next';
import Link from 'next/link';
import { checkPasswordToken } from '@/lib/auth/tokens';
import { SetPasswordForm } from './set-password-form';

export const metadata: Metadata = { title: 'Choose a password', referrer: 'no-referrer' };

export default async function SetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const check = await checkPasswordToken(token);
  if (!check.ok) {
    return (
      <>
        <h1 className="mb-2 text-lg font-semibold">Link not usable</h1>
        <p className="mb-4 text-sm text-ink-muted">{check.reason}</p>
        <Link href="/reset" className="text-sm text-action underline">
          Ask for a new link
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">{check.purpose === 'invite' ? `Welcome, ${check.name}` : 'Choose a new password'}</h1>
      <p className="mb-4 text-sm text-ink-muted">For {check.email}</p>
      <SetPasswordForm token={token} email={check.email} />
    </>
  );
}
