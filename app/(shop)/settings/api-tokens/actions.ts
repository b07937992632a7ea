'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { createApiToken, revokeApiToken } from '@/lib/api/tokens';
import { revokeSchema, tokenSchema } from '@/lib/api/token-schemas';

// Shared by the owner's page and a customer administrator's portal page; lib/api/tokens.ts
// decides what each may make and see (the owner, or a customer's administrator for their own
// company), so the actions ask only for a signed-in account.
function refresh() {
  revalidatePath('/settings/api-tokens');
  revalidatePath('/portal/api-tokens');
}

export const createTokenAction = formAction('account.self', tokenSchema, async (input, actor) => {
  const made = await createApiToken(actor, input);
  refresh();
  return { ok: true, message: `Token “${input.name}” made. Copy it now: it is shown only once.`, secret: made.token };
});

export const revokeTokenAction = formAction('account.self', revokeSchema, async (input, actor) => {
  await revokeApiToken(actor, input.tokenId);
  refresh();
  return { ok: true, message: 'Revoked: the token no longer works.' };
});
