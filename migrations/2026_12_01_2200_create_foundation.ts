// Foundation: customers, users with roles, sessions, one-time password links, sign-in attempts,
// the e-mail log, the audit log and settings. Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table customers (
      id uuid primary key default gen_random_uuid(),
      code text not null unique check (code ~ '^[A-Z0-9-]{2,16}$'),
      name text not null check (length(trim(name)) between 1 and 200),
      billing_address text not null default '' check (length(billing_address) <= 1000),
      shipping_address text not null default '' check (length(shipping_address) <= 1000),
      billing_email text check (billing_email is null or billing_email ~ '^[^@\\s]+@[^@\\s]+$'),
      phone text not null default '' check (length(phone) <= 50),
      payment_terms_days integer not null default 30 check (payment_terms_days between 0 and 365),
      tax_rate_bp integer not null default 0 check (tax_rate_bp between 0 and 10000),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );

    create table users (
      id text primary key,
      email text not null check (email = lower(email) and email ~ '^[^@\\s]+@[^@\\s]+$'),
      name text not null check (length(trim(name)) between 1 and 200),
      role text not null check (role in ('owner', 'estimator', 'plater', 'supervisor', 'customer')),
      customer_id uuid references customers(id) on delete restrict,
      password_hash text,
      unit_system text not null default 'metric' check (unit_system in ('metric', 'us')),
      is_active boolean not null default true,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      -- a customer user belongs to exactly one customer account; staff belong to none
      constraint users_customer_link check ((role = 'customer') = (customer_id is not null))
    );
    create unique index users_email_key on users (email);
    create index users_customer_idx on users (customer_id) where customer_id is not null;

    create table sessions (
      id text primary key,
      user_id text not null references users(id) on delete cascade,
      expires_at timestamptz not null
    );
    create index sessions_user_idx on sessions (user_id);

    -- One-time links (password reset, invitation). Only the SHA-256 of the token is stored.
    create table password_tokens (
      token_hash text primary key,
      user_id text not null references users(id) on delete cascade,
      purpose text not null check (purpose in ('reset', 'invite')),
      expires_at timestamptz not null,
      used_at timestamptz,
      created_at timestamptz not null default now()
    );
    create index password_tokens_user_idx on password_tokens (user_id);

    create table sign_in_attempts (
      id bigint generated always as identity primary key,
      email_key text not null,
      ip text not null,
      succeeded boolean not null,
      created_at timestamptz not null default now()
    );
    create index sign_in_attempts_email_idx on sign_in_attempts (email_key, created_at);
    create index sign_in_attempts_ip_idx on sign_in_attempts (ip, created_at);

    create table emails (
      id bigint generated always as identity primary key,
      to_address text not null,
      subject text not null,
      template text not null,
      message_id text,
      status text not null check (status in ('sent', 'failed')),
      error text,
      created_at timestamptz not null default now()
    );

    create table audit_log (
      id bigint generated always as identity primary key,
      actor_id text references users(id) on delete set null,
      action text not null,
      entity text not null,
      entity_id text,
      detail jsonb not null default '{}'::jsonb,
      created_at timestamptz not null default now()
    );
    create index audit_log_entity_idx on audit_log (entity, entity_id);

    create table settings (
      key text primary key,
      value jsonb not null,
      updated_at timestamptz not null default now()
    );
  `.execute(db);
}

export async function down(): Promise<void> {
  throw new Error('Migrations are forward-only');
}
