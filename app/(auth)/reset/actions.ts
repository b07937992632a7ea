'use server';

import { publicFormAction } from '@/lib/action';
import { requestPasswordReset } from '@/lib/auth/account';
import { resetRequestSchema } from '@/lib/auth/schemas';

// The answer is the same whether or not the address has an account.
export const requestResetAction = publicFormAction(resetRequestSchema, async (input) => {
  await requestPasswordReset(input.email);
  return { ok: true, message: 'If that address has an account, we have sent it a link to choose a new password. The link works once, within one hour.' };
});
