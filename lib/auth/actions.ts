'use server';

// Account actions shared by the staff area and the customer area.
import { cookies } from 'next/headers';
import { redirect } from 'next/navigation';
import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { changePassword, setUnitSystem } from './account';
import { validate } from './current-user';
import { lucia } from './lucia';
import { changePasswordSchema, unitSystemSchema } from './schemas';

export const changePasswordAction = formAction('account.self', changePasswordSchema, async (input, user) => {
  await changePassword(user, input.current, input.password);
  // All sessions ended with the change; this device gets a fresh one, as complete as the old.
  const session = await lucia.createSession(user.id, { second_factor: true, second_factor_failures: 0 });
  const c = lucia.createSessionCookie(session.id);
  (await cookies()).set(c.name, c.value, c.attributes);
  return { ok: true, message: 'Password changed. Other devices have been signed out.' };
});

export const setUnitSystemAction = formAction('account.self', unitSystemSchema, async (input, user) => {
  await setUnitSystem(user, input.unitSystem);
  revalidatePath('/', 'layout');
  return { ok: true, message: input.unitSystem === 'us' ? 'Showing US customary units.' : 'Showing metric units.' };
});

export async function signOutAction(): Promise<void> {
  const { session } = await validate();
  if (session) await lucia.invalidateSession(session.id);
  const c = lucia.createBlankSessionCookie();
  (await cookies()).set(c.name, c.value, c.attributes);
  redirect('/sign-in?notice=signed-out');
}
