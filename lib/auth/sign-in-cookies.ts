import 'server-only';
import { cookies, headers } from 'next/headers';
import { DEVICE_COOKIE, deviceCookieAttributes, rememberDevice } from './devices';
import { lucia } from './lucia';

// The cookies of signing in, shared by the password step, the second-factor step and enrolment.
export async function clientAddress(): Promise<string> {
  const h = await headers();
  return (h.get('x-forwarded-for')?.split(',')[0]?.trim() || h.get('x-real-ip') || 'local').slice(0, 64);
}

export async function deviceToken(): Promise<string | undefined> {
  return (await cookies()).get(DEVICE_COOKIE)?.value;
}

export async function setSessionCookie(sessionId: string): Promise<void> {
  const c = lucia.createSessionCookie(sessionId);
  (await cookies()).set(c.name, c.value, c.attributes);
}

/** A full session: its cookie, and this browser remembered as one of the user's devices. */
export async function finishSignIn(user: { id: string; email: string; name: string }, sessionId: string): Promise<void> {
  await setSessionCookie(sessionId);
  const h = await headers();
  const token = await rememberDevice(user, { ip: await clientAddress(), userAgent: h.get('user-agent') ?? '', token: await deviceToken() });
  (await cookies()).set(DEVICE_COOKIE, token, deviceCookieAttributes());
}

/** Only same-site paths are followed after sign-in. */
export function safeNext(next: string | undefined | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}

/** Where a signed-in user goes: the asked-for page when it is in their own area, else home. */
export function landingFor(role: string, next: string | undefined | null): string {
  const home = role === 'customer' ? '/portal' : '/home';
  const n = safeNext(next);
  // A customer is never sent into the staff area by a crafted link, nor staff into the portal.
  return n && (role === 'customer') === n.startsWith('/portal') ? n : home;
}
