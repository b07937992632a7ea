import 'server-only';
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import { db } from '@/db';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';
import { hashToken } from './tokens';

// A browser that has signed in to an account keeps a random device cookie; only its SHA-256 is
// stored. It lets that browser past the throttles that strangers meet, and a sign-in from a
// browser without one e-mails the account holder.
export const DEVICE_COOKIE = 'ampwright_device';
export const DEVICE_COOKIE_MAX_AGE_SECONDS = 400 * 24 * 60 * 60; // browsers cap cookie lifetimes near 400 days

export function deviceCookieAttributes(): { httpOnly: true; sameSite: 'lax'; secure: boolean; path: '/'; maxAge: number } {
  return { httpOnly: true, sameSite: 'lax', secure: (process.env.APP_URL ?? '').startsWith('https://'), path: '/', maxAge: DEVICE_COOKIE_MAX_AGE_SECONDS };
}

const TOKEN_SHAPE = /^[A-Za-z0-9_-]{40,60}$/;

/** The device-cookie hash if that browser has signed in to the account with this e-mail before. */
export async function knownDeviceHash(email: string, token: string | undefined): Promise<string | null> {
  if (!token || !TOKEN_SHAPE.test(token)) return null;
  const hash = hashToken(token);
  const row = await db
    .selectFrom('known_devices as d')
    .innerJoin('users as u', 'u.id', 'd.user_id')
    .select('d.token_hash')
    .where('d.token_hash', '=', hash)
    .where('u.email', '=', email)
    .executeTakeFirst();
  return row?.token_hash ?? null;
}

export type DeviceContext = { ip: string; userAgent: string; token?: string };

/**
 * After a full sign-in: refresh a known device, or remember a new one and e-mail the user.
 * Returns the cookie value to set (the same token, or a new one).
 */
export async function rememberDevice(user: { id: string; email: string; name: string }, ctx: DeviceContext): Promise<string> {
  if (ctx.token && TOKEN_SHAPE.test(ctx.token)) {
    const seen = await db
      .updateTable('known_devices')
      .set({ last_seen_at: sql`now()`, ip: ctx.ip.slice(0, 64) })
      .where('token_hash', '=', hashToken(ctx.token))
      .where('user_id', '=', user.id)
      .returning('token_hash')
      .executeTakeFirst();
    if (seen) return ctx.token;
  }
  // A browser another account used keeps its cookie for that account and gets a new one here
  // only if it had none; one cookie per browser, one device row per account it signed in to.
  const token = randomBytes(32).toString('base64url');
  await db
    .insertInto('known_devices')
    .values({ token_hash: hashToken(token), user_id: user.id, user_agent: ctx.userAgent.slice(0, 300), ip: ctx.ip.slice(0, 64) })
    .execute();
  await sendEmail({
    to: user.email,
    template: 'new-device',
    subject: 'New sign-in to your Ampwright account',
    text:
      `Hello ${user.name},\n\nYour Ampwright account was just signed in to from a browser it had not been used from before.\n\n` +
      `  When:    ${formatShopTime(new Date(), shopTimeZone())}\n` +
      `  Address: ${ctx.ip}\n  Browser: ${ctx.userAgent.slice(0, 200) || 'not given'}\n\n` +
      `If this was you, there is nothing to do. If it was not, change your password now and turn on a second factor:\n${appUrl('/account')}\n`,
  });
  return token;
}
