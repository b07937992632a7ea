import type { Metadata } from 'next';
import { ResetForm } from './reset-form';

export const metadata: Metadata = { title: 'Reset password' };

export default function ResetPage() {
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Reset your password</h1>
      <p className="mb-4 text-sm text-ink-muted">Enter the e-mail address you sign in with. We will send a one-time link.</p>
      <ResetForm />
    </>
  );
}
