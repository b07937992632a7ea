import 'server-only';
import { type Kysely, sql } from 'kysely';
import { db, type Database } from '@/db';
import { inviteUser } from '@/lib/auth/account';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { assertCan, writeAudit } from '@/lib/records/audit';
import { inTransaction } from '@/lib/records/transaction';
import type { ContactInput, CustomerInput, UpdateCustomerInput } from './schemas';

const DUPLICATE_CODE = (code: string) =>
  new AppError('CONFLICT', 'Check the highlighted field.', { code: [`Another customer already uses the code ${code}.`] });

function columns(input: CustomerInput) {
  return {
    code: input.code,
    name: input.name,
    billing_address: input.billingAddress,
    shipping_address: input.shippingAddress,
    billing_email: input.billingEmail,
    phone: input.phone,
    payment_terms_days: input.paymentTermsDays,
    tax_rate_bp: input.taxRatePercent,
  };
}

export async function createCustomer(actor: SessionUser, input: CustomerInput, q: Kysely<Database> = db): Promise<{ customerId: string }> {
  assertCan(actor, 'customers.write');
  return inTransaction(q, async (trx) => {
    const taken = await trx.selectFrom('customers').select('id').where('code', '=', input.code).executeTakeFirst();
    if (taken) throw DUPLICATE_CODE(input.code);
    const row = await trx.insertInto('customers').values(columns(input)).returning('id').executeTakeFirstOrThrow();
    await writeAudit(trx, actor, 'customer.create', 'customer', row.id, { code: input.code });
    return { customerId: row.id };
  });
}

export async function updateCustomer(actor: SessionUser, input: UpdateCustomerInput, q: Kysely<Database> = db): Promise<void> {
  assertCan(actor, 'customers.write');
  await inTransaction(q, async (trx) => {
    const current = await trx.selectFrom('customers').select('id').where('id', '=', input.customerId).forUpdate().executeTakeFirst();
    if (!current) throw new AppError('NOT_FOUND', 'That customer does not exist.');
    const taken = await trx.selectFrom('customers').select('id').where('code', '=', input.code).where('id', '<>', input.customerId).executeTakeFirst();
    if (taken) throw DUPLICATE_CODE(input.code);
    await trx.updateTable('customers').set({ ...columns(input), updated_at: sql`now()` }).where('id', '=', input.customerId).execute();
    await writeAudit(trx, actor, 'customer.update', 'customer', input.customerId, { code: input.code });
  });
}

/**
 * Adds a contact. When the contact may sign in, an invitation goes out through the accounts
 * module (a customer-role user linked to this customer) and the contact is linked to that user.
 */
export async function addContact(actor: SessionUser, input: ContactInput, q: Kysely<Database> = db): Promise<{ contactId: string; invited: boolean }> {
  assertCan(actor, 'customers.write');
  const contactId = await inTransaction(q, async (trx) => {
    const customer = await trx.selectFrom('customers').select('id').where('id', '=', input.customerId).executeTakeFirst();
    if (!customer) throw new AppError('NOT_FOUND', 'That customer does not exist.');
    if (input.email) {
      const same = await trx
        .selectFrom('customer_contacts')
        .select('id')
        .where('customer_id', '=', input.customerId)
        .where(sql`lower(email)`, '=', input.email)
        .executeTakeFirst();
      if (same) throw new AppError('CONFLICT', 'Check the highlighted field.', { email: ['This customer already has a contact with that e-mail address.'] });
    }
    if (input.maySignIn) {
      const user = await trx.selectFrom('users').select('id').where('email', '=', input.email!).executeTakeFirst();
      if (user) throw new AppError('CONFLICT', 'Check the highlighted field.', { email: ['Someone already has an account with this e-mail address.'] });
    }
    const row = await trx
      .insertInto('customer_contacts')
      .values({ customer_id: input.customerId, name: input.name, email: input.email, phone: input.phone, is_billing: input.isBilling })
      .returning('id')
      .executeTakeFirstOrThrow();
    await writeAudit(trx, actor, 'customer.contact.add', 'customer', input.customerId, { contactId: row.id });
    return row.id;
  });
  if (!input.maySignIn) return { contactId, invited: false };
  await inviteContact(actor, { customerId: input.customerId, contactId }, q);
  return { contactId, invited: true };
}

/** Invites an existing contact to sign in to the customer area (one account per contact). */
export async function inviteContact(actor: SessionUser, ref: { customerId: string; contactId: string }, q: Kysely<Database> = db): Promise<void> {
  assertCan(actor, 'customers.write');
  const contact = await q
    .selectFrom('customer_contacts')
    .select(['id', 'name', 'email', 'user_id'])
    .where('id', '=', ref.contactId)
    .where('customer_id', '=', ref.customerId)
    .executeTakeFirst();
  if (!contact) throw new AppError('NOT_FOUND', 'That contact does not exist.');
  if (contact.user_id) throw new AppError('CONFLICT', `${contact.name} can already sign in.`);
  if (!contact.email) throw new AppError('BAD_INPUT', `Add an e-mail address for ${contact.name} first.`);
  // inviteUser runs its own transaction and sends the e-mail after it commits.
  const { userId } = await inviteUser(actor, { email: contact.email.toLowerCase(), name: contact.name, role: 'customer', customerId: ref.customerId });
  await q.updateTable('customer_contacts').set({ user_id: userId }).where('id', '=', contact.id).execute();
}

export async function removeContact(actor: SessionUser, ref: { customerId: string; contactId: string }, q: Kysely<Database> = db): Promise<void> {
  assertCan(actor, 'customers.write');
  await inTransaction(q, async (trx) => {
    const gone = await trx.deleteFrom('customer_contacts').where('id', '=', ref.contactId).where('customer_id', '=', ref.customerId).executeTakeFirst();
    if (Number(gone.numDeletedRows) === 0) throw new AppError('NOT_FOUND', 'That contact does not exist.');
    await writeAudit(trx, actor, 'customer.contact.remove', 'customer', ref.customerId, { contactId: ref.contactId });
  });
}
