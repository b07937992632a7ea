'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { sendInvoiceEmail } from '@/lib/billing/emails';
import { issueCreditNote, issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { creditNoteSchema, invoiceRefSchema, issueInvoiceSchema, manualPaymentSchema } from '@/lib/billing/schemas';

export const issueInvoiceAction = formAction('invoices.issue', issueInvoiceSchema, async (input, user) => {
  const invoice = await issueInvoice(user.id, input);
  // After the commit: an e-mail that fails leaves the invoice issued, with "Send again" on its page.
  const mail = await sendInvoiceEmail(invoice.id);
  revalidatePath('/invoices');
  redirect(`/invoices/${invoice.id}?issued=1&mailed=${mail.ok ? 1 : 0}`);
});

export const creditNoteAction = formAction('invoices.issue', creditNoteSchema, async (input, user) => {
  const note = await issueCreditNote(user.id, input);
  revalidatePath(`/invoices/${input.invoiceId}`);
  return { ok: true, message: `Credit note ${note.number} issued.` };
});

export const recordPaymentAction = formAction('invoices.issue', manualPaymentSchema, async (input, user) => {
  await recordManualPayment(user.id, input);
  revalidatePath(`/invoices/${input.invoiceId}`);
  return { ok: true, message: 'Payment recorded.' };
});

export const resendInvoiceAction = formAction('invoices.issue', invoiceRefSchema, async (input) => {
  const result = await sendInvoiceEmail(input.invoiceId);
  revalidatePath(`/invoices/${input.invoiceId}`);
  return { ok: result.ok, message: result.message };
});
