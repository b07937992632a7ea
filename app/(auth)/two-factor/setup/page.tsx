import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import QRCode from 'qrcode';
import { getCurrentUser, getPendingSignIn, homePathFor } from '@/lib/auth/current-user';
import { beginEnrolment, pendingEnrolment, secondFactorStatus } from '@/lib/auth/second-factor';
import { EnrolForm } from './enrol-form';

export const metadata: Metadata = { title: 'Set up a second factor' };

export default async function SetUpSecondFactorPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  const pending = await getPendingSignIn();
  if (pending?.step === 'verify') redirect(`/two-factor${next ? `?next=${encodeURIComponent(next)}` : ''}`);
  const user = pending?.user ?? (await getCurrentUser());
  if (!user) redirect('/sign-in');
  // Once on, the same form stays in place: turning it on sets cookies, which re-renders this page,
  // and the recovery codes the form holds must still show.
  const on = (await secondFactorStatus(user.id)).enabled;
  const enrolment = on ? null : ((await pendingEnrolment(user.id)) ?? (await beginEnrolment(user.id)));
  const svg = enrolment ? await QRCode.toString(enrolment.uri, { type: 'svg', errorCorrectionLevel: 'M', margin: 1 }) : '';
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Set up a second factor</h1>
      <p className="mb-4 text-sm text-ink-muted">
        {pending
          ? 'The owner account needs a code from an authenticator app as well as the password, because it holds the money and the records.'
          : 'Signing in will ask for a code from an authenticator app as well as your password.'}
      </p>
      <EnrolForm next={next} qrSvg={svg} secret={enrolment?.secret ?? null} home={homePathFor(user)} />
    </>
  );
}
