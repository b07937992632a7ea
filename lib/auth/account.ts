import 'server-only';
import { generateIdFromEntropySize } from 'lucia';
import { sql } from 'kysely';
import { db } from '@/db';
import type { Role, UnitSystem } from '@/db/types';
import { AppError } from '@/lib/errors';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { lucia } from './lucia';
import { dummyPasswordHash, hashPassword, verifyPassword } from './password';
import { knownDeviceHash } from './devices';
import { type Client, clearSignInFailures, recordSignInAttempt, signInWaitSeconds, waitMessage } from './throttle';
import { ROLE_LABELS } from './roles';
import { checkPasswordToken, hashToken, issuePasswordToken } from './tokens';
import type { SessionUser } from './current-user';

// The one message for a failed sign-in: it never says whether the account exists.
export const SIGN_IN_FAILED = 'That e-mail address and password do not match an active account.';

export type SignInClient = { ip: string; deviceToken?: string };
export type SignInResult = {
  sessionId: string;
  role: Role;
  /** what the session still owes before it reaches anything (lib/auth/current-user.ts) */
  next: 'done' | 'verify' | 'enrol';
  user: { id: string; email: string; name: string };
};

export async function signIn(email: string, password: string, from: SignInClient): Promise<SignInResult> {
  const device = await knownDeviceHash(email, from.deviceToken);
  const client: Client = device ? { key: `device:${device}`, ip: from.ip, known: true } : { key: `ip:${from.ip}`, ip: from.ip, known: false };
  const wait = await signInWaitSeconds(email, client);
  if (wait > 0) throw new AppError('RATE_LIMITED', waitMessage(wait));
  const user = await db
    .selectFrom('users')
    .select(['id', 'name', 'role', 'password_hash', 'is_active', 'totp_enabled_at'])
    .where('email', '=', email)
    .executeTakeFirst();
  // Verify against a dummy hash when there is no usable account, so timing reveals nothing.
  const ok = await verifyPassword(user?.password_hash ?? (await dummyPasswordHash()), password);
  const usable = !!user && !!user.password_hash && user.is_active && ok;
  await recordSignInAttempt(email, client, usable);
  if (!usable || !user) throw new AppError('UNAUTHENTICATED', SIGN_IN_FAILED);
  const next = user.totp_enabled_at ? 'verify' : user.role === 'owner' ? 'enrol' : 'done';
  const session = await lucia.createSession(user.id, { second_factor: false, second_factor_failures: 0 });
  return { sessionId: session.id, role: user.role, next, user: { id: user.id, email, name: user.name } };
}

export async function requestPasswordReset(email: string): Promise<void> {
  const user = await db.selectFrom('users').select(['id', 'name', 'is_active']).where('email', '=', email).executeTakeFirst();
  if (!user || !user.is_active) return; // same answer either way
  const token = await issuePasswordToken(user.id, 'reset');
  const link = appUrl(`/set-password/${token}`);
  await sendEmail({
    to: email,
    template: 'password-reset',
    subject: 'Reset your Ampwright password',
    text: `Hello ${user.name},\n\nSomeone (we hope you) asked to reset the password of your Ampwright account.\nOpen this link within one hour to choose a new password. It works once.\n\n${link}\n\nIf you did not ask for this, you can ignore this message.`,
  });
}

// Single use is enforced by the UPDATE itself: two concurrent submissions cannot both succeed.
export async function setPasswordWithToken(token: string, password: string): Promise<{ email: string }> {
  const check = await checkPasswordToken(token);
  if (!check.ok) throw new AppError('CONFLICT', check.reason);
  const passwordHash = await hashPassword(password);
  return db.transaction().execute(async (trx) => {
    const used = await trx
      .updateTable('password_tokens')
      .set({ used_at: sql`now()` })
      .where('token_hash', '=', hashToken(token))
      .where('used_at', 'is', null)
      .where('expires_at', '>', sql<Date>`now()`)
      .returning('user_id')
      .executeTakeFirst();
    if (!used) throw new AppError('CONFLICT', 'This link has already been used or has expired. Ask for a new one.');
    await trx.updateTable('users').set({ password_hash: passwordHash, updated_at: sql`now()` }).where('id', '=', used.user_id).execute();
    await trx.deleteFrom('sessions').where('user_id', '=', used.user_id).execute();
    await trx.insertInto('audit_log').values({ actor_id: used.user_id, action: `password.${check.purpose === 'invite' ? 'set' : 'reset'}`, entity: 'user', entity_id: used.user_id }).execute();
    return { email: check.email };
  }).then(async (r) => {
    // The link proved the mailbox: strangers' failures no longer slow the account holder.
    await clearSignInFailures(r.email);
    return r;
  });
}

export async function changePassword(user: SessionUser, current: string, next: string): Promise<void> {
  const row = await db.selectFrom('users').select('password_hash').where('id', '=', user.id).executeTakeFirstOrThrow();
  if (!row.password_hash || !(await verifyPassword(row.password_hash, current))) {
    throw new AppError('BAD_INPUT', 'Check the highlighted field.', { current: ['That is not your current password.'] });
  }
  const passwordHash = await hashPassword(next);
  await db.transaction().execute(async (trx) => {
    await trx.updateTable('users').set({ password_hash: passwordHash, updated_at: sql`now()` }).where('id', '=', user.id).execute();
    await trx.insertInto('audit_log').values({ actor_id: user.id, action: 'password.change', entity: 'user', entity_id: user.id }).execute();
  });
  // Every other session of this user ends; the caller issues a fresh one.
  await lucia.invalidateUserSessions(user.id);
}

export async function setUnitSystem(user: SessionUser, unitSystem: UnitSystem): Promise<void> {
  await db.updateTable('users').set({ unit_system: unitSystem, updated_at: sql`now()` }).where('id', '=', user.id).execute();
}

export type InviteInput = { email: string; name: string; role: Role; customerId?: string };

export async function inviteUser(actor: SessionUser, input: InviteInput): Promise<{ userId: string }> {
  const customerId = input.role === 'customer' ? input.customerId ?? null : null;
  const { userId, token } = await db.transaction().execute(async (trx) => {
    const exists = await trx.selectFrom('users').select('id').where('email', '=', input.email).executeTakeFirst();
    if (exists) throw new AppError('BAD_INPUT', 'Check the highlighted field.', { email: ['A user with this e-mail address already exists.'] });
    if (customerId) {
      const c = await trx.selectFrom('customers').select('id').where('id', '=', customerId).executeTakeFirst();
      if (!c) throw new AppError('BAD_INPUT', 'Check the highlighted field.', { customerId: ['Choose a customer account.'] });
    }
    const id = generateIdFromEntropySize(10);
    await trx.insertInto('users').values({ id, email: input.email, name: input.name, role: input.role, customer_id: customerId, password_hash: null }).execute();
    const t = await issuePasswordToken(id, 'invite', trx);
    await trx.insertInto('audit_log').values({ actor_id: actor.id, action: 'user.invite', entity: 'user', entity_id: id, detail: JSON.stringify({ role: input.role }) }).execute();
    return { userId: id, token: t };
  });
  await sendEmail({
    to: input.email,
    template: 'invitation',
    subject: 'You are invited to Ampwright',
    text: `Hello ${input.name},\n\n${actor.name} has invited you to Ampwright as ${ROLE_LABELS[input.role].toLowerCase()}.\nOpen this link within seven days to choose your password:\n\n${appUrl(`/set-password/${token}`)}\n`,
  });
  return { userId };
}

export async function updateUser(actor: SessionUser, userId: string, role: Role, isActive: boolean, isCustomerAdmin = false): Promise<void> {
  if (userId === actor.id && (role !== actor.role || !isActive)) {
    throw new AppError('CONFLICT', 'You cannot change your own role or deactivate yourself. Ask another owner.');
  }
  await db.transaction().execute(async (trx) => {
    const u = await trx.selectFrom('users').select(['id', 'role', 'customer_id']).where('id', '=', userId).forUpdate().executeTakeFirst();
    if (!u) throw new AppError('NOT_FOUND', 'That user does not exist.');
    if ((u.role === 'customer') !== (role === 'customer')) {
      throw new AppError('CONFLICT', 'A customer contact cannot become staff, nor staff a customer contact. Invite a new user instead.');
    }
    await trx.updateTable('users').set({ role, is_active: isActive, is_customer_admin: role === 'customer' && isCustomerAdmin, updated_at: sql`now()` }).where('id', '=', userId).execute();
    if (!isActive) await trx.deleteFrom('sessions').where('user_id', '=', userId).execute();
    await trx.insertInto('audit_log').values({ actor_id: actor.id, action: 'user.update', entity: 'user', entity_id: userId, detail: JSON.stringify({ role, isActive, isCustomerAdmin: role === 'customer' && isCustomerAdmin }) }).execute();
  });
}
