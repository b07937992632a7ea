'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { addContact, createCustomer, inviteContact, removeContact, updateCustomer } from '@/lib/customers/mutations';
import { contactRefSchema, contactSchema, customerSchema, updateCustomerSchema } from '@/lib/customers/schemas';

export const createCustomerAction = formAction('customers.write', customerSchema, async (input, actor) => {
  const { customerId } = await createCustomer(actor, input);
  revalidatePath('/customers');
  redirect(`/customers/${customerId}`);
});

export const updateCustomerAction = formAction('customers.write', updateCustomerSchema, async (input, actor) => {
  await updateCustomer(actor, input);
  revalidatePath(`/customers/${input.customerId}`);
  return { ok: true, message: 'Customer saved.' };
});

export const addContactAction = formAction('customers.write', contactSchema, async (input, actor) => {
  const { invited } = await addContact(actor, input);
  revalidatePath(`/customers/${input.customerId}`);
  return { ok: true, message: invited ? `${input.name} added; an invitation to sign in went to ${input.email}.` : `${input.name} added.` };
});

export const inviteContactAction = formAction('customers.write', contactRefSchema, async (input, actor) => {
  await inviteContact(actor, input);
  revalidatePath(`/customers/${input.customerId}`);
  return { ok: true, message: 'Invitation sent.' };
});

export const removeContactAction = formAction('customers.write', contactRefSchema, async (input, actor) => {
  await removeContact(actor, input);
  revalidatePath(`/customers/${input.customerId}`);
  return { ok: true, message: 'Contact removed.' };
});
