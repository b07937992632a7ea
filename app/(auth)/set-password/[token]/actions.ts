'use server';

import { redirect } from 'next/navigation';
import { publicFormAction } from '@/lib/action';
import { setPasswordWithToken } from '@/lib/auth/account';
import { setPasswordSchema } from '@/lib/auth/schemas';

export const setPasswordAction = publicFormAction(setPasswordSchema, async (input) => {
  await setPasswordWithToken(input.token, input.password);
  redirect('/sign-in?notice=password-set');
});
