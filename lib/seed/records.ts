// Demo customer contacts: each customer's billing contact, and the demo customer users as
// contacts who may sign in. Idempotent (adds only contacts not there yet, matched by e-mail).
import { type Kysely, sql } from 'kysely';
import type { Database } from '@/db/types';

const BILLING_NAMES: Record<string, string> = { NGF: 'Accounts payable', HVI: 'Payables desk', BRL: 'Accounts team' };

export async function seedRecords(db: Kysely<Database>): Promise<void> {
  const customers = await db.selectFrom('customers').select(['id', 'code', 'billing_email']).where('code', 'in', Object.keys(BILLING_NAMES)).execute();
  const users = await db.selectFrom('users').select(['id', 'name', 'email', 'customer_id']).where('role', '=', 'customer').where('email', 'like', '%.test').execute();
  const wanted = [
    ...customers.filter((c) => c.billing_email).map((c) => ({ customer_id: c.id, name: BILLING_NAMES[c.code]!, email: c.billing_email!, is_billing: true, user_id: null as string | null })),
    ...users.filter((u) => u.customer_id).map((u) => ({ customer_id: u.customer_id!, name: u.name, email: u.email, is_billing: false, user_id: u.id as string | null })),
  ];
  for (const c of wanted) {
    await db
      .insertInto('customer_contacts')
      .columns(['customer_id', 'name', 'email', 'is_billing', 'user_id'])
      .expression(
        db
          .selectNoFrom([sql`${c.customer_id}::uuid`.as('customer_id'), sql`${c.name}`.as('name'), sql`${c.email}`.as('email'), sql`${c.is_billing}`.as('is_billing'), sql`${c.user_id}`.as('user_id')])
          .where(({ not, exists, selectFrom }) =>
            not(exists(selectFrom('customer_contacts').select(sql`1`.as('one')).where('customer_id', '=', c.customer_id).where(sql`lower(email)`, '=', c.email.toLowerCase()))),
          ),
      )
      .execute();
  }
}
