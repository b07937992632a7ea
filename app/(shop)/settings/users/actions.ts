'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { inviteUser, updateUser } from '@/lib/auth/account';
import { inviteSchema, updateUserSchema } from '@/lib/auth/schemas';

export const inviteUserAction = formAction('users.manage', inviteSchema, async (input, actor) => {
  await inviteUser(actor, input);
  revalidatePath('/settings/users');
  return { ok: true, message: `Invitation sent to ${input.email}.` };
});

export const updateUserAction = formAction('users.manage', updateUserSchema, async (input, actor) => {
  await updateUser(actor, input.userId, input.role, input.isActive, input.isCustomerAdmin);
  revalidatePath('/settings/users');
  return { ok: true, message: 'Saved.' };
});
