import 'server-only';
import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import type { User } from 'lucia';
import { db } from '@/db';
import type { Role } from '@/db/types';
import { hashToken } from '@/lib/auth/tokens';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';
import { isUuid } from '@/lib/files/store';
import type { TokenInput } from './token-schemas';

// API tokens: `Authorization: Bearer amp_…`. The token is 32 random bytes shown once; only its
// SHA-256 is kept. A token acts with its role and, when it is a customer's, for that customer
// only: the same SessionUser the browser's pages get, so every scoping rule that reads
// `user.customerId` and every permission check holds for tokens unchanged. Its writes are
// recorded under the person who made it, and its name goes in the audit log.

export const TOKEN_PREFIX = 'amp_';
export const CUSTOMER_ADMIN_PER_MINUTE = 120;

export type TokenPrincipal = User & { tokenId: string; tokenName: string };

export type RateState = { limit: number; remaining: number; resetSeconds: number };

type Maker = Pick<User, 'id' | 'role' | 'customerId'>;

/** Who may make tokens: the owner (any role), a customer's administrator (for their company). */
export async function assertMayManageTokens(maker: Maker): Promise<{ customerId: string | null }> {
  if (maker.role === 'owner') return { customerId: null };
  if (maker.role === 'customer' && maker.customerId) {
    const row = await db.selectFrom('users').select('is_customer_admin').where('id', '=', maker.id).executeTakeFirst();
    if (row?.is_customer_admin) return { customerId: maker.customerId };
  }
  throw new AppError('FORBIDDEN', 'Only the owner or a customer’s administrator can manage API tokens.');
}

export async function createApiToken(maker: Maker, input: TokenInput): Promise<{ id: string; token: string; prefix: string }> {
  const scope = await assertMayManageTokens(maker);
  let role: Role = input.role;
  let customerId = input.customerId ?? null;
  let perMinute = input.perMinute;
  if (scope.customerId) {
    // A customer's administrator makes tokens for their own company and nothing else.
    role = 'customer';
    customerId = scope.customerId;
    perMinute = Math.min(perMinute, CUSTOMER_ADMIN_PER_MINUTE);
  } else if (role === 'customer') {
    if (!customerId) throw new AppError('BAD_INPUT', 'Choose the customer this token is for.', { customerId: ['Choose the customer this token is for.'] });
    const exists = await db.selectFrom('customers').select('id').where('id', '=', customerId).executeTakeFirst();
    if (!exists) throw new AppError('BAD_INPUT', 'That customer does not exist.', { customerId: ['That customer does not exist.'] });
  } else {
    customerId = null;
  }
  const token = TOKEN_PREFIX + randomBytes(32).toString('base64url');
  const prefix = token.slice(0, 12);
  return db.transaction().execute(async (trx) => {
    const row = await trx
      .insertInto('api_tokens')
      .values({ name: input.name, token_hash: hashToken(token), prefix, role, customer_id: customerId, user_id: maker.id, per_minute: perMinute })
      .returning('id')
      .executeTakeFirstOrThrow();
    await trx
      .insertInto('audit_log')
      .values({ actor_id: maker.id, action: 'api_token.create', entity: 'api_token', entity_id: row.id, detail: JSON.stringify({ name: input.name, role, customerId, perMinute }) })
      .execute();
    return { id: row.id, token, prefix };
  });
}

export async function revokeApiToken(maker: Maker, tokenId: string): Promise<void> {
  const scope = await assertMayManageTokens(maker);
  if (!isUuid(tokenId)) throw new AppError('NOT_FOUND', 'No such token.');
  await db.transaction().execute(async (trx) => {
    let q = trx.updateTable('api_tokens').set({ revoked_at: new Date(), revoked_by: maker.id }).where('id', '=', tokenId).where('revoked_at', 'is', null);
    if (scope.customerId) q = q.where('customer_id', '=', scope.customerId);
    const r = await q.returning('name').executeTakeFirst();
    if (!r) throw new AppError('NOT_FOUND', 'No such token, or it is already revoked.');
    await trx.insertInto('audit_log').values({ actor_id: maker.id, action: 'api_token.revoke', entity: 'api_token', entity_id: tokenId, detail: JSON.stringify({ name: r.name }) }).execute();
  });
}

export type TokenRow = {
  id: string;
  name: string;
  prefix: string;
  role: Role;
  roleLabel: string;
  customerName: string | null;
  madeBy: string;
  perMinute: number;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
};

export async function listApiTokens(maker: Maker): Promise<TokenRow[]> {
  const scope = await assertMayManageTokens(maker);
  let q = db
    .selectFrom('api_tokens as t')
    .innerJoin('users as u', 'u.id', 't.user_id')
    .leftJoin('customers as c', 'c.id', 't.customer_id')
    .select(['t.id', 't.name', 't.prefix', 't.role', 'c.name as customerName', 'u.name as madeBy', 't.per_minute', 't.created_at', 't.last_used_at', 't.revoked_at'])
    .orderBy('t.revoked_at', (o) => o.desc().nullsFirst())
    .orderBy('t.created_at', 'desc')
    .limit(500);
  if (scope.customerId) q = q.where('t.customer_id', '=', scope.customerId);
  const rows = await q.execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    prefix: r.prefix,
    role: r.role,
    roleLabel: ROLE_LABELS[r.role],
    customerName: r.customerName,
    madeBy: r.madeBy,
    perMinute: r.per_minute,
    createdAt: r.created_at,
    lastUsedAt: r.last_used_at,
    revokedAt: r.revoked_at,
  }));
}

const BEARER = /^Bearer\s+(amp_[A-Za-z0-9_-]{43})\s*$/;

/**
 * The principal of an Authorization header, counting the request against the token's minute.
 * One statement finds the token (live, its maker active), counts the request, notes when it was
 * last used (at most once a minute) and drops its windows older than an hour.
 */
export async function authenticateToken(header: string): Promise<{ user: TokenPrincipal; rate: RateState }> {
  const m = BEARER.exec(header);
  if (!m) throw new AppError('UNAUTHENTICATED', 'The Authorization header must be "Bearer " and an API token.');
  const hash = hashToken(m[1]!);
  const row = await sql<{
    id: string;
    name: string;
    role: Role;
    customer_id: string | null;
    per_minute: number;
    user_id: string;
    email: string;
    user_name: string;
    unit_system: User['unitSystem'];
    requests: number;
    reset_seconds: number;
  }>`
    with t as (
      select t.id, t.name, t.role, t.customer_id, t.per_minute, t.user_id, u.email, u.name as user_name, u.unit_system
      from api_tokens t join users u on u.id = t.user_id
      where t.token_hash = ${hash} and t.revoked_at is null and u.is_active
        and (u.role = 'owner' or (u.is_customer_admin and u.customer_id = t.customer_id))
    ),
    w as (
      insert into api_rate_windows (token_id, window_start, requests)
      select id, date_trunc('minute', now()), 1 from t
      on conflict (token_id, window_start) do update set requests = api_rate_windows.requests + 1
      returning requests
    ),
    used as (
      update api_tokens set last_used_at = now()
      where id = (select id from t) and (last_used_at is null or last_used_at < now() - interval '1 minute')
    ),
    old as (
      delete from api_rate_windows where token_id = (select id from t) and window_start < now() - interval '1 hour'
    )
    select t.*, w.requests, (60 - extract(epoch from now() - date_trunc('minute', now())))::int as reset_seconds
    from t, w
  `.execute(db);
  const r = row.rows[0];
  if (!r) throw new AppError('UNAUTHENTICATED', 'This API token is not valid or has been revoked.');
  const rate = { limit: r.per_minute, remaining: Math.max(0, r.per_minute - r.requests), resetSeconds: Math.max(1, r.reset_seconds) };
  if (r.requests > r.per_minute) throw new RateLimited(rate);
  return {
    user: {
      id: r.user_id,
      email: r.email,
      name: `${r.user_name} (API token “${r.name}”)`,
      role: r.role,
      customerId: r.customer_id,
      unitSystem: r.unit_system,
      isActive: true,
      tokenId: r.id,
      tokenName: r.name,
    },
    rate,
  };
}

export class RateLimited extends AppError {
  constructor(readonly rate: RateState) {
    super('RATE_LIMITED', `This token may make ${rate.limit} requests a minute. Try again in ${rate.resetSeconds} s.`);
  }
}

export function rateHeaders(rate: RateState): Record<string, string> {
  return { 'ratelimit-limit': String(rate.limit), 'ratelimit-remaining': String(rate.remaining), 'ratelimit-reset': String(rate.resetSeconds) };
}
