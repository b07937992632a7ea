import 'server-only';
import { db } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';

// The customer account of a signed-in customer contact; scoped by the user's own link, never by an id from the request.
export async function getOwnCustomer(user: SessionUser) {
  if (user.role !== 'customer' || !user.customerId) return null;
  return db
    .selectFrom('customers')
    .select(['id', 'code', 'name', 'billing_address', 'shipping_address', 'payment_terms_days'])
    .where('id', '=', user.customerId)
    .executeTakeFirst();
}
