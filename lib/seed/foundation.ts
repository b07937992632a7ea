// Demo shop, customers and one user per role. Invented names only. Idempotent: safe to run again.
import { type Kysely, sql } from 'kysely';
import type { Database, Role } from '@/db/types';
import { hashPassword } from '@/lib/auth/password';

export const DEMO_PASSWORD = 'plating-demo-2026';
/** The demo owner's authenticator key (base32, RFC 6238); invented for the demo and printed in the README. */
export const DEMO_OWNER_TOTP_SECRET = 'KESTRELDEMOOWNERTOTPSECRET234567';
export const DEMO_OWNER_ID = 'demo-owner-owner';

export const DEMO_SHOP = {
  name: 'Kestrel Lane Plating',
  address: '14 Kestrel Lane, Millbrook, OH 45000',
  phone: '(555) 010-4410',
  email: 'office@kestrel-plating.test',
};

export const DEMO_CUSTOMERS = [
  {
    code: 'NGF',
    name: 'Northgate Fastener Co.',
    billing_address: '220 Foundry Road, Millbrook, OH 45001',
    shipping_address: 'Dock 3, 220 Foundry Road, Millbrook, OH 45001',
    billing_email: 'ap@northgate-fastener.test',
    payment_terms_days: 30,
    tax_rate_bp: 725,
  },
  {
    code: 'HVI',
    name: 'Halvorsen Valve & Instrument',
    billing_address: '9 Quarry Street, Eastfield, PA 15000',
    shipping_address: '9 Quarry Street, Eastfield, PA 15000',
    billing_email: 'payables@halvorsen-valve.test',
    payment_terms_days: 45,
    tax_rate_bp: 600,
  },
  {
    code: 'BRL',
    name: 'Brightline Connector Works',
    billing_address: '51 Signal Avenue, Lakeport, MI 48000',
    shipping_address: '51 Signal Avenue, Lakeport, MI 48000',
    billing_email: 'accounts@brightline-connector.test',
    payment_terms_days: 30,
    tax_rate_bp: 0,
  },
] as const;

export const DEMO_USERS: { email: string; name: string; role: Role; customerCode?: string; isCustomerAdmin?: boolean }[] = [
  { email: 'owner@kestrel-plating.test', name: 'Dana Whitfield', role: 'owner' },
  { email: 'estimator@kestrel-plating.test', name: 'Marcus Bell', role: 'estimator' },
  { email: 'plater@kestrel-plating.test', name: 'Rosa Delgado', role: 'plater' },
  { email: 'supervisor@kestrel-plating.test', name: 'Priya Natarajan', role: 'supervisor' },
  { email: 'buyer@northgate-fastener.test', name: 'Glen Okafor', role: 'customer', customerCode: 'NGF', isCustomerAdmin: true },
  { email: 'quality@halvorsen-valve.test', name: 'Ingrid Sorensen', role: 'customer', customerCode: 'HVI' },
];

export async function seedFoundation(db: Kysely<Database>): Promise<void> {
  await db
    .insertInto('settings')
    .values({ key: 'shop', value: JSON.stringify(DEMO_SHOP) })
    .onConflict((oc) => oc.column('key').doUpdateSet({ value: JSON.stringify(DEMO_SHOP), updated_at: sql`now()` }))
    .execute();

  for (const c of DEMO_CUSTOMERS) {
    await db
      .insertInto('customers')
      .values(c)
      .onConflict((oc) => oc.column('code').doUpdateSet({ name: c.name, billing_address: c.billing_address, shipping_address: c.shipping_address }))
      .execute();
  }
  const customers = await db.selectFrom('customers').select(['id', 'code']).execute();
  const byCode = new Map(customers.map((c) => [c.code, c.id]));

  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const u of DEMO_USERS) {
    const id = `demo-${u.role}-${u.email.split('@')[0]}`.replace(/[^a-z0-9-]/g, '');
    await db
      .insertInto('users')
      .values({
        id,
        email: u.email,
        name: u.name,
        role: u.role,
        customer_id: u.customerCode ? byCode.get(u.customerCode) ?? null : null,
        password_hash: passwordHash,
        is_customer_admin: u.isCustomerAdmin ?? false,
      })
      // Re-seeding restores the demo password and role, so the printed sign-ins always work.
      .onConflict((oc) => oc.column('email').doUpdateSet({ password_hash: passwordHash, role: u.role, is_active: true, is_customer_admin: u.isCustomerAdmin ?? false }))
      .execute();
  }
  // The owner must have a second factor; the demo owner's is this published key (README), whose
  // current code `npm run demo:code` prints. Demo only: a real owner enrols their own app.
  await db
    .updateTable('users')
    .set({ totp_secret: DEMO_OWNER_TOTP_SECRET, totp_enabled_at: sql`coalesce(totp_enabled_at, now())` })
    .where('id', '=', DEMO_OWNER_ID)
    .execute();
}
