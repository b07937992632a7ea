// API tokens for the shop's and the customers' other systems (a buyer's purchasing system, a lab).
// A token acts with a role and, for a customer's token, for that customer only. Only the token's
// SHA-256 is stored; its first characters are kept to tell tokens apart on screen. Requests are
// counted per token per minute in PostgreSQL, so every app process sees the same count.
// A customer contact marked as their company's administrator may make tokens for that company.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table users add column is_customer_admin boolean not null default false;

    create table api_tokens (
      id uuid primary key default gen_random_uuid(),
      name text not null check (length(name) between 1 and 80),
      token_hash text not null unique,
      prefix text not null,
      role text not null check (role in ('owner', 'estimator', 'plater', 'supervisor', 'customer')),
      customer_id uuid references customers(id) on delete cascade,
      -- The person the token's writes are recorded under (its maker).
      user_id text not null references users(id) on delete cascade,
      per_minute integer not null default 120 check (per_minute between 1 and 10000),
      created_at timestamptz not null default now(),
      last_used_at timestamptz,
      revoked_at timestamptz,
      revoked_by text references users(id) on delete set null,
      check ((role = 'customer') = (customer_id is not null))
    );
    create index api_tokens_by_customer on api_tokens (customer_id, created_at);

    create table api_rate_windows (
      token_id uuid not null references api_tokens(id) on delete cascade,
      window_start timestamptz not null,
      requests integer not null,
      primary key (token_id, window_start)
    );
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    drop table api_rate_windows;
    drop table api_tokens;
    alter table users drop column is_customer_admin;
  `.execute(db);
}
