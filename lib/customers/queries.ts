import 'server-only';
import { db } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { isUuid } from '@/lib/files/store';

// The customer account of a signed-in customer contact; scoped by the user's own link, never by an id from the request.
export async function getOwnCustomer(user: SessionUser) {
  if (user.role !== 'customer' || !user.customerId) return null;
  return db
    .selectFrom('customers')
    .select(['id', 'code', 'name', 'billing_address', 'shipping_address', 'payment_terms_days'])
    .where('id', '=', user.customerId)
    .executeTakeFirst();
}

export async function getCustomer(customerId: string) {
  if (!isUuid(customerId)) return null;
  const row = await db.selectFrom('customers').selectAll().where('id', '=', customerId).executeTakeFirst();
  return row ?? null;
}

export async function findContacts(customerId: string) {
  return db
    .selectFrom('customer_contacts as cc')
    .leftJoin('users as u', 'u.id', 'cc.user_id')
    .select(['cc.id', 'cc.name', 'cc.email', 'cc.phone', 'cc.is_billing', 'cc.user_id'])
    .select((eb) => eb('u.password_hash', 'is not', null).as('has_signed_in'))
    .where('cc.customer_id', '=', customerId)
    .orderBy('cc.name')
    .execute();
}

/** Customers for a choice list (code and name), alphabetical. */
export async function findCustomerOptions() {
  return db.selectFrom('customers').select(['id', 'code', 'name']).orderBy('name').execute();
}
