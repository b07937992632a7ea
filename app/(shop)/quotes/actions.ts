'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formAction } from '@/lib/action';
import { markQuoteSent, reviseQuote } from '@/lib/quotes/lifecycle';
import { addQuoteLine, clearLineOverride, createQuote, overrideLinePrice, removeQuoteLine, updateQuoteHeader } from '@/lib/quotes/mutations';
import { emailQuoteToContact } from '@/lib/quotes/notify';
import { addLineSchema, createQuoteSchema, lineRefSchema, overrideSchema, quoteHeaderSchema, quoteRefSchema, sendQuoteSchema } from '@/lib/quotes/schemas';

const at = (quoteId: string) => `/quotes/${quoteId}`;

export const createQuoteAction = formAction('quotes.write', createQuoteSchema, async (input, user) => {
  const q = await createQuote(user, input);
  revalidatePath('/quotes');
  redirect(at(q.id));
});

export const updateQuoteHeaderAction = formAction('quotes.write', quoteHeaderSchema, async (input, user) => {
  await updateQuoteHeader(user, input);
  revalidatePath(at(input.quoteId));
  return { ok: true, message: 'Saved.' };
});

export const addLineAction = formAction('quotes.price', addLineSchema, async (input, user) => {
  await addQuoteLine(user, input);
  revalidatePath(at(input.quoteId));
  return { ok: true, message: 'Line added and priced.' };
});

export const removeLineAction = formAction('quotes.price', lineRefSchema, async (input, user) => {
  await removeQuoteLine(user, input);
  revalidatePath(at(input.quoteId));
  return { ok: true, message: 'Line removed.' };
});

export const overrideLineAction = formAction('quotes.price', overrideSchema, async (input, user) => {
  await overrideLinePrice(user, input);
  revalidatePath(at(input.quoteId));
  return { ok: true, message: 'Price overridden; the reason is kept with the line.' };
});

export const clearOverrideAction = formAction('quotes.price', lineRefSchema, async (input, user) => {
  await clearLineOverride(user, input);
  revalidatePath(at(input.quoteId));
  return { ok: true, message: 'Back to the computed price.' };
});

export const sendQuoteAction = formAction('quotes.write', sendQuoteSchema, async (input, user) => {
  await markQuoteSent(user, input);
  const mail = await emailQuoteToContact(input.quoteId);
  revalidatePath('/quotes');
  // The send form leaves the page once the quote is sent, so the outcome travels in the address.
  redirect(`${at(input.quoteId)}?sent=${mail.ok ? 'ok' : 'failed'}`);
});

export const resendQuoteAction = formAction('quotes.write', quoteRefSchema, async (input) => {
  const mail = await emailQuoteToContact(input.quoteId);
  return mail.ok ? { ok: true, message: `E-mailed again to ${mail.to}.` } : { ok: false, message: 'The e-mail could not be delivered. Try again in a moment.' };
});

export const reviseQuoteAction = formAction('quotes.write', quoteRefSchema, async (input, user) => {
  const copy = await reviseQuote(user, input.quoteId);
  revalidatePath(at(input.quoteId));
  revalidatePath('/quotes');
  redirect(at(copy.id));
});
