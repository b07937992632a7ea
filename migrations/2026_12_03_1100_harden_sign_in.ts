// Sign-in that a stranger cannot turn against an account: failures are keyed by account and
// client (a browser that signed in before is its own client), a second factor by time-based
// one-time codes with single-use recovery codes, and the devices each user has signed in from.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    -- client_key: 'ip:<address>' or 'device:<sha-256 of the device cookie>'
    alter table sign_in_attempts add column client_key text not null default '';
    update sign_in_attempts set client_key = 'ip:' || ip;
    alter table sign_in_attempts alter column client_key drop default;
    create index sign_in_attempts_client_idx on sign_in_attempts (email_key, client_key, created_at);

    -- The base32 secret is written when enrolment starts and switched on (enabled_at) only after
    -- the user has typed a code from it. last_step is the 30-second step of the last code
    -- accepted, so a code cannot be used twice.
    alter table users
      add column totp_secret text check (totp_secret ~ '^[A-Z2-7]{32}$'),
      add column totp_enabled_at timestamptz,
      add column totp_last_step bigint,
      add constraint users_totp_enabled_has_secret check (totp_enabled_at is null or totp_secret is not null);

    create table recovery_codes (
      code_hash text primary key,
      user_id text not null references users(id) on delete cascade,
      used_at timestamptz,
      created_at timestamptz not null default now()
    );
    create index recovery_codes_user_idx on recovery_codes (user_id);

    -- A session opened by the password alone. It reaches nothing until the second factor is
    -- given (or, for an owner without one, until it is set up); failures end it after five.
    alter table sessions
      add column second_factor boolean not null default false,
      add column second_factor_failures integer not null default 0 check (second_factor_failures >= 0);

    create table known_devices (
      token_hash text primary key,
      user_id text not null references users(id) on delete cascade,
      user_agent text not null default '' check (length(user_agent) <= 300),
      ip text not null default '' check (length(ip) <= 64),
      created_at timestamptz not null default now(),
      last_seen_at timestamptz not null default now()
    );
    create index known_devices_user_idx on known_devices (user_id, last_seen_at desc);

    -- When an account holder was last told of repeated failures (one notice per six hours).
    create table sign_in_notices (
      email_key text primary key,
      sent_at timestamptz not null default now()
    );
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    drop table sign_in_notices;
    drop table known_devices;
    alter table sessions drop column second_factor, drop column second_factor_failures;
    drop table recovery_codes;
    alter table users drop constraint users_totp_enabled_has_secret,
      drop column totp_secret, drop column totp_enabled_at, drop column totp_last_step;
    drop index sign_in_attempts_client_idx;
    alter table sign_in_attempts drop column client_key;
  `.execute(db);
}
