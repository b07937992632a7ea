'use server';

import { revalidatePath } from 'next/cache';
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
  const numbers = accepted.workOrders.map((w) => w.number).join(', ');
  return { ok: true, message: `Thank you. Quote ${accepted.label} is accepted with PO ${input.poNumber}; our order${accepted.workOrders.length === 1 ? '' : 's'} ${numbers} ${accepted.workOrders.length === 1 ? 'is' : 'are'} open.` };
});

export const declineQuoteAction = formAction('portal.use', declineQuoteSchema, async (input, user) => {
  const declined = await declineQuote(user, input);
  const customer = await getOwnCustomer(user);
  await emailEstimatorDeclined({ ...declined, quoteId: input.quoteId, reason: input.reason, customerName: customer?.name ?? 'The customer' });
  revalidatePath('/portal/quotes');
  return { ok: true, message: `Quote ${declined.label} is declined. Thank you for letting us know.` };
});
