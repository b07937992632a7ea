import { sql } from 'kysely';
import { afterAll, describe, expect, it } from 'vitest';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { createDb } from '@/db/kysely';

const db = createDb();
afterAll(() => db.destroy());

describe('migrations', () => {
  it('applied every migration file in order, from an empty database', async () => {
    const files = readdirSync(path.resolve(__dirname, '../../migrations')).filter((f) => f.endsWith('.ts')).map((f) => f.replace(/\.ts$/, '')).sort();
    const rows = await sql<{ name: string }>`select name from kysely_migration order by name`.execute(db);
    expect(rows.rows.map((r) => r.name)).toEqual(files);
  });
});

describe('constraints hold', () => {
  async function rejects(q: Promise<unknown>, pattern: RegExp) {
    await expect(q).rejects.toThrow(pattern);
  }

  it('a customer user must belong to a customer account, and staff to none', async () => {
    await rejects(
      db.insertInto('users').values({ id: 't-cust-1', email: 'x1@example.test', name: 'X', role: 'customer', customer_id: null, password_hash: null }).execute(),
      /users_customer_link/,
    );
    const c = await db.selectFrom('customers').select('id').limit(1).executeTakeFirstOrThrow();
    await rejects(
      db.insertInto('users').values({ id: 't-staff-1', email: 'x2@example.test', name: 'X', role: 'plater', customer_id: c.id, password_hash: null }).execute(),
      /users_customer_link/,
    );
  });

  it('roles, e-mail case, tax rates and payment terms are checked by the database', async () => {
    await rejects(
      db.insertInto('users').values({ id: 't-r', email: 'r@example.test', name: 'R', role: 'janitor' as never, customer_id: null, password_hash: null }).execute(),
      /users_role_check/,
    );
    await rejects(
      db.insertInto('users').values({ id: 't-e', email: 'Upper@Example.test', name: 'E', role: 'owner', customer_id: null, password_hash: null }).execute(),
      /users_email_check/,
    );
    await rejects(db.insertInto('customers').values({ code: 'TAX1', name: 'T', billing_email: null, tax_rate_bp: 10001 }).execute(), /tax_rate_bp/);
    await rejects(db.insertInto('customers').values({ code: 'TRM1', name: 'T', billing_email: null, payment_terms_days: -1 }).execute(), /payment_terms_days/);
  });

  it('e-mail addresses are unique', async () => {
    await rejects(
      db.insertInto('users').values({ id: 't-dup', email: 'owner@kestrel-plating.test', name: 'D', role: 'owner', customer_id: null, password_hash: null }).execute(),
      /users_email_key/,
    );
  });
});
