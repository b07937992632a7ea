import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import { db } from '@/db';
import type { Database } from '@/db/types';

// One-time links. The e-mailed token is 32 random bytes; only its SHA-256 is stored, so a copy of
// the database cannot be used to reset anyone's password.
export const TOKEN_LIFETIME_MS = { reset: 60 * 60 * 1000, invite: 7 * 24 * 60 * 60 * 1000 } as const;

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export async function issuePasswordToken(
  userId: string,
  purpose: 'reset' | 'invite',
  trx: Kysely<Database> | Transaction<Database> = db,
): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  // A new link replaces any earlier unused one for the same purpose.
  await trx.deleteFrom('password_tokens').where('user_id', '=', userId).where('purpose', '=', purpose).where('used_at', 'is', null).execute();
  await trx
    .insertInto('password_tokens')
    .values({ token_hash: hashToken(token), user_id: userId, purpose, expires_at: new Date(Date.now() + TOKEN_LIFETIME_MS[purpose]) })
    .execute();
  return token;
}

export type TokenCheck =
  | { ok: true; userId: string; purpose: 'reset' | 'invite'; email: string; name: string }
  | { ok: false; reason: string };

export async function checkPasswordToken(token: string): Promise<TokenCheck> {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) return { ok: false, reason: 'This link is not valid.' };
  const row = await db
    .selectFrom('password_tokens as t')
    .innerJoin('users as u', 'u.id', 't.user_id')
    .select(['t.user_id', 't.purpose', 't.expires_at', 't.used_at', 'u.email', 'u.name', 'u.is_active'])
    .where('t.token_hash', '=', hashToken(token))
    .executeTakeFirst();
  if (!row || !row.is_active) return { ok: false, reason: 'This link is not valid.' };
  if (row.used_at) return { ok: false, reason: 'This link has already been used. Ask for a new one.' };
  if (row.expires_at.getTime() < Date.now()) return { ok: false, reason: 'This link has expired. Ask for a new one.' };
  return { ok: true, userId: row.user_id, purpose: row.purpose, email: row.email, name: row.name };
}
