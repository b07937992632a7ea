'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { getOwnCustomer } from '@/lib/customers/queries';
import { acceptQuote, declineQuote } from '@/lib/quotes/lifecycle';
import { emailEstimatorAccepted, emailEstimatorDeclined } from '@/lib/quotes/notify';
import { acceptQuoteSchema, declineQuoteSchema } from '@/lib/quotes/schemas';

export const acceptQuoteAction = formAction('portal.use', acceptQuoteSchema, async (input, user) => {
  const accepted = await acceptQuote(user, input);
  const customer = await getOwnCustomer(user);
  await emailEstimatorAccepted({ ...accepted, poNumber: input.poNumber, customerName: customer?.name ?? 'The customer' });
  revalidatePath('/portal/quotes');
  revalidatePath('/portal/orders');
  // The forms leave the page once the quote is decided, so the thank-you travels in the address.
  redirect(`/portal/quotes/${input.quoteId}?done=accepted`);
});

export const declineQuoteAction = formAction('portal.use', declineQuoteSchema, async (input, user) => {
  const declined = await declineQuote(user, input);
  const customer = await getOwnCustomer(user);
  await emailEstimatorDeclined({ ...declined, quoteId: input.quoteId, reason: input.reason, customerName: customer?.name ?? 'The customer' });
  revalidatePath('/portal/quotes');
  redirect(`/portal/quotes/${input.quoteId}?done=declined`);
});
