'use server';

import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { startInvoiceCheckout } from '@/lib/billing/checkout';
import { invoiceRefSchema } from '@/lib/billing/schemas';

// Opens a payment for the invoice's open balance (read on the server) and sends the browser to it.
export const payInvoiceAction = formAction('portal.use', invoiceRefSchema, async (input, user) => {
  const { url } = await startInvoiceCheckout(user, input.invoiceId);
  redirect(url);
});
