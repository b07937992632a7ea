'use server';

import { cookies, headers } from 'next/headers';
import { redirect } from 'next/navigation';
import { publicFormAction } from '@/lib/action';
import { signIn } from '@/lib/auth/account';
import { homePathFor } from '@/lib/auth/current-user';
import { lucia } from '@/lib/auth/lucia';
import { signInSchema } from '@/lib/auth/schemas';

async function clientAddress(): Promise<string> {
  const h = await headers();
  return (h.get('x-forwarded-for')?.split(',')[0]?.trim() || h.get('x-real-ip') || 'local').slice(0, 64);
}

// Only same-site paths are followed after sign-in.
function safeNext(next: string | undefined): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}

export const signInAction = publicFormAction(signInSchema, async (input) => {
  const { sessionId, role } = await signIn(input.email, input.password, await clientAddress());
  const c = lucia.createSessionCookie(sessionId);
  (await cookies()).set(c.name, c.value, c.attributes);
  const home = homePathFor({ role });
  const next = safeNext(input.next);
  // A customer is never sent into the staff area by a crafted link, nor staff into the portal.
  redirect(next && (role === 'customer') === next.startsWith('/portal') ? next : home);
});
