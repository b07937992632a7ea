import 'server-only';
import { db } from '@/db';

export async function findUsers() {
  return db
    .selectFrom('users as u')
    .leftJoin('customers as c', 'c.id', 'u.customer_id')
    .select(['u.id', 'u.email', 'u.name', 'u.role', 'u.is_active', 'u.is_customer_admin', 'u.created_at', 'c.name as customer_name'])
    .select((eb) => eb('u.password_hash', 'is not', null).as('has_password'))
    .orderBy('u.role')
    .orderBy('u.name')
    .execute();
}

export async function findCustomerChoices() {
  return db.selectFrom('customers').select(['id', 'name', 'code']).orderBy('name').execute();
}

export async function getShopSettings(): Promise<{ name: string; address: string; phone: string; email: string } | null> {
  const row = await db.selectFrom('settings').select('value').where('key', '=', 'shop').executeTakeFirst();
  return (row?.value as { name: string; address: string; phone: string; email: string } | undefined) ?? null;
}
