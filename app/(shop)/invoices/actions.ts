'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { sendInvoiceEmail } from '@/lib/billing/emails';
import { issueCreditNote, issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { applyCredit, refundExcess, resolvePaymentException } from '@/lib/billing/credit';
import {
  applyCreditSchema,
  creditNoteSchema,
  invoiceRefSchema,
  issueInvoiceSchema,
  manualPaymentSchema,
  refundExcessSchema,
  resolveExceptionSchema,
} from '@/lib/billing/schemas';

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
  return { ok: true, message: input.acceptExcess ? 'Payment recorded; anything above the balance is credit on account.' : 'Payment recorded.' };
});

export const applyCreditAction = formAction('invoices.issue', applyCreditSchema, async (input, user) => {
  await applyCredit(user.id, input);
  revalidatePath(`/invoices/${input.fromInvoiceId}`);
  revalidatePath(`/invoices/${input.toInvoiceId}`);
  // The form goes away once the credit is used up, so the page itself says what happened.
  redirect(`/invoices/${input.fromInvoiceId}?notice=credit-applied`);
});

export const refundExcessAction = formAction('invoices.issue', refundExcessSchema, async (input, user) => {
  await refundExcess(user.id, input);
  revalidatePath(`/invoices/${input.invoiceId}`);
  redirect(`/invoices/${input.invoiceId}?notice=refunded`);
});

export const resolveExceptionAction = formAction('invoices.issue', resolveExceptionSchema, async (input, user) => {
  const result = await resolvePaymentException(user.id, input);
  revalidatePath('/invoices/exceptions');
  return { ok: true, message: result.message };
});

export const resendInvoiceAction = formAction('invoices.issue', invoiceRefSchema, async (input) => {
  const result = await sendInvoiceEmail(input.invoiceId);
  revalidatePath(`/invoices/${input.invoiceId}`);
  return { ok: result.ok, message: result.message };
});
