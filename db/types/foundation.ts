// Tables of migration 2026_12_01_2200_create_foundation.
import type { Generated, Insertable, Selectable, Updateable } from 'kysely';
import type { Json, Timestamp, TimestampNullable, GeneratedTimestamp } from './columns';

export type Role = 'owner' | 'estimator' | 'plater' | 'supervisor' | 'customer';
export type UnitSystem = 'metric' | 'us';

export type CustomersTable = {
  id: Generated<string>;
  code: string;
  name: string;
  billing_address: Generated<string>;
  shipping_address: Generated<string>;
  billing_email: string | null;
  phone: Generated<string>;
  payment_terms_days: Generated<number>;
  tax_rate_bp: Generated<number>;
  created_at: GeneratedTimestamp;
  updated_at: GeneratedTimestamp;
};

export type UsersTable = {
  id: string;
  email: string;
  name: string;
  role: Role;
  customer_id: string | null;
  password_hash: string | null;
  unit_system: Generated<UnitSystem>;
  is_active: Generated<boolean>;
  created_at: GeneratedTimestamp;
  updated_at: GeneratedTimestamp;
  // 2026_12_03_1100_harden_sign_in
  totp_secret: string | null;
  totp_enabled_at: TimestampNullable;
  totp_last_step: number | null;
  // 2026_12_04_1245_api_tokens: a customer contact who may make API tokens for their company
  is_customer_admin: Generated<boolean>;
};

export type SessionsTable = {
  id: string;
  user_id: string;
  expires_at: Timestamp;
  second_factor: Generated<boolean>;
  second_factor_failures: Generated<number>;
};

export type RecoveryCodesTable = { code_hash: string; user_id: string; used_at: TimestampNullable; created_at: GeneratedTimestamp };

export type KnownDevicesTable = {
  token_hash: string;
  user_id: string;
  user_agent: Generated<string>;
  ip: Generated<string>;
  created_at: GeneratedTimestamp;
  last_seen_at: GeneratedTimestamp;
};

export type SignInNoticesTable = { email_key: string; sent_at: GeneratedTimestamp };

export type PasswordTokensTable = {
  token_hash: string;
  user_id: string;
  purpose: 'reset' | 'invite';
  expires_at: Timestamp;
  used_at: TimestampNullable;
  created_at: GeneratedTimestamp;
};

export type SignInAttemptsTable = {
  id: Generated<number>;
  email_key: string;
  ip: string;
  client_key: string;
  succeeded: boolean;
  created_at: GeneratedTimestamp;
};

export type EmailsTable = {
  id: Generated<number>;
  to_address: string;
  subject: string;
  template: string;
  message_id: string | null;
  status: 'sent' | 'failed';
  error: string | null;
  created_at: GeneratedTimestamp;
};

export type AuditLogTable = {
  id: Generated<number>;
  actor_id: string | null;
  action: string;
  entity: string;
  entity_id: string | null;
  detail: Json<Record<string, unknown>>;
  created_at: GeneratedTimestamp;
};

// 2026_12_04_1245_api_tokens
export type ApiTokensTable = {
  id: Generated<string>;
  name: string;
  token_hash: string;
  prefix: string;
  role: Role;
  customer_id: string | null;
  user_id: string;
  per_minute: Generated<number>;
  created_at: GeneratedTimestamp;
  last_used_at: TimestampNullable;
  revoked_at: TimestampNullable;
  revoked_by: string | null;
};

export type ApiRateWindowsTable = { token_id: string; window_start: Timestamp; requests: number };

export type SettingsTable = { key: string; value: Json<unknown>; updated_at: GeneratedTimestamp };

/** One row: the committed changes to the tables the office lists read (lib/grid/list-cache.ts). */
export type ListDataVersionTable = {
  id: Generated<boolean>;
  /** bigint, read as text by pg. */
  version: Generated<string>;
  changed_at: GeneratedTimestamp;
};

export type FoundationTables = {
  customers: CustomersTable;
  users: UsersTable;
  sessions: SessionsTable;
  password_tokens: PasswordTokensTable;
  sign_in_attempts: SignInAttemptsTable;
  recovery_codes: RecoveryCodesTable;
  known_devices: KnownDevicesTable;
  sign_in_notices: SignInNoticesTable;
  emails: EmailsTable;
  audit_log: AuditLogTable;
  settings: SettingsTable;
  api_tokens: ApiTokensTable;
  api_rate_windows: ApiRateWindowsTable;
  list_data_version: ListDataVersionTable;
};

export type Customer = Selectable<CustomersTable>;
export type NewCustomer = Insertable<CustomersTable>;
export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type UserUpdate = Updateable<UsersTable>;
