'use server';

import { cookies } from 'next/headers';
import { redirect } from 'next/navigation';
import { revalidatePath } from 'next/cache';
import { formAction, publicFormAction } from '@/lib/action';
import { getPendingSignIn, getSession } from '@/lib/auth/current-user';
import { lucia } from '@/lib/auth/lucia';
import { secondFactorSchema, totpCodeSchema } from '@/lib/auth/schemas';
import { completeSignIn, confirmEnrolment, regenerateRecoveryCodes, turnOffSecondFactor, upgradeSession } from '@/lib/auth/second-factor';
import { finishSignIn, landingFor } from '@/lib/auth/sign-in-cookies';
import { AppError } from '@/lib/errors';

// The second step of signing in, for a session that has given its password.
export const verifySecondFactorAction = publicFormAction(secondFactorSchema, async (input) => {
  const pending = await getPendingSignIn();
  if (!pending || pending.step !== 'verify') throw new AppError('UNAUTHENTICATED', 'Sign in again with your password.');
  try {
    const { sessionId } = await completeSignIn(pending.session.id, input.code);
    await finishSignIn({ id: pending.user.id, email: pending.user.email, name: pending.user.name }, sessionId);
  } catch (err) {
    if (err instanceof AppError && err.code === 'UNAUTHENTICATED') {
      const c = lucia.createBlankSessionCookie();
      (await cookies()).set(c.name, c.value, c.attributes);
    }
    throw err;
  }
  redirect(landingFor(pending.user.role, input.next));
});

// Setting up the app: for an owner right after the password (required), or any signed-in user
// from their account page. The recovery codes come back once, to be shown and printed.
export const confirmEnrolmentAction = publicFormAction(totpCodeSchema, async (input) => {
  const pending = await getPendingSignIn();
  const current = pending ? (pending.step === 'enrol' ? pending : null) : await getSession();
  if (!current?.user) throw new AppError('UNAUTHENTICATED', 'Sign in again with your password.');
  const { user, session } = current;
  const codes = await confirmEnrolment(user.id, input.code);
  // This session has now given both factors (other sessions of the user will be asked for a code).
  const sessionId = await upgradeSession(session.id, user.id);
  await finishSignIn({ id: user.id, email: user.email, name: user.name }, sessionId);
  // No revalidation: this page would re-render as "already on" and leave before the codes show.
  return { ok: true, message: 'The second factor is on. Keep these recovery codes somewhere safe: each works once, and they are not shown again.', codes, values: { next: landingFor(user.role, input.next) } };
});

export const newRecoveryCodesAction = formAction('account.self', totpCodeSchema, async (input, user) => {
  const codes = await regenerateRecoveryCodes(user.id, input.code);
  return { ok: true, message: 'New recovery codes. The old ones no longer work.', codes };
});

export const turnOffSecondFactorAction = formAction('account.self', totpCodeSchema, async (input, user) => {
  await turnOffSecondFactor(user.id, input.code);
  revalidatePath('/', 'layout');
  return { ok: true, message: 'The second factor is off. Signing in asks for your password only.' };
});
