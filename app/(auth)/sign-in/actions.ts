'use server';

import { redirect } from 'next/navigation';
import { publicFormAction } from '@/lib/action';
import { signIn } from '@/lib/auth/account';
import { signInSchema } from '@/lib/auth/schemas';
import { clientAddress, deviceToken, finishSignIn, landingFor, safeNext, setSessionCookie } from '@/lib/auth/sign-in-cookies';

export const signInAction = publicFormAction(signInSchema, async (input) => {
  const r = await signIn(input.email, input.password, { ip: await clientAddress(), deviceToken: await deviceToken() });
  const next = safeNext(input.next);
  const carry = next ? `?next=${encodeURIComponent(next)}` : '';
  if (r.next === 'verify') {
    await setSessionCookie(r.sessionId);
    redirect(`/two-factor${carry}`);
  }
  if (r.next === 'enrol') {
    await setSessionCookie(r.sessionId);
    redirect(`/two-factor/setup${carry}`);
  }
  await finishSignIn(r.user, r.sessionId);
  redirect(landingFor(r.role, next));
});
