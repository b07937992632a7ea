// Form and API input for quotes; shared by server actions, route handlers and tests.
import { z } from 'zod';
import { PRICING_BASES } from './basis';

const id = (what: string) => z.uuid({ error: `Choose ${what}.` });
const optionalText = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`).default('');
export const checkbox = z.preprocess((v) => v === 'on' || v === 'true' || v === true, z.boolean());

/** Dollars as typed ("1,234.50", "$80") to whole cents, exactly (no floating point). */
export const dollarsSchema = z
  .string({ error: 'Enter an amount.' })
  .trim()
  .transform((s) => s.replace(/^\$/, '').replace(/,/g, ''))
  .pipe(z.string().regex(/^\d{1,9}(\.\d{1,2})?$/, 'Enter an amount in dollars, e.g. 1250.00.'))
  .transform((s) => {
    const [whole, frac = ''] = s.split('.');
    return Number(whole) * 100 + Number(frac.padEnd(2, '0'));
  });

export const createQuoteSchema = z.object({
  customerId: id('a customer'),
  isRush: checkbox,
  notes: optionalText(2000),
});
export type CreateQuoteInput = z.infer<typeof createQuoteSchema>;

export const quoteHeaderSchema = z.object({
  quoteId: id('a quote'),
  contactUserId: z.preprocess((v) => (v === '' ? null : v), z.string().min(1).max(100).nullable()),
  isRush: checkbox,
  notes: optionalText(2000),
});
export type QuoteHeaderInput = z.infer<typeof quoteHeaderSchema>;

export const addLineSchema = z.object({
  quoteId: id('a quote'),
  partId: id('a part'),
  finishId: id('a finish'),
  quantity: z.coerce
    .number({ error: 'Enter the number of pieces.' })
    .int('Enter a whole number of pieces.')
    .min(1, 'Enter at least 1 piece.')
    .max(100_000_000, 'That is more pieces than one line can hold.'),
  basis: z.enum(PRICING_BASES as [string, ...string[]], { error: 'Choose how the line is priced.' }).transform((b) => b as (typeof PRICING_BASES)[number]),
});
export type AddLineInput = z.infer<typeof addLineSchema>;

export const lineRefSchema = z.object({ quoteId: id('a quote'), lineId: id('a line') });

export const overrideSchema = lineRefSchema.extend({
  price: dollarsSchema,
  reason: z.string().trim().min(5, 'Say why the price differs (at least 5 characters).').max(500, 'Use at most 500 characters.'),
});
export type OverrideInput = z.infer<typeof overrideSchema>;

export const quoteRefSchema = z.object({ quoteId: id('a quote') });

export const sendQuoteSchema = z.object({
  quoteId: id('a quote'),
  contactUserId: z.string({ error: 'Choose who receives the quote.' }).min(1, 'Choose who receives the quote.').max(100),
});

export const acceptQuoteSchema = z.object({
  quoteId: id('a quote'),
  poNumber: z.string().trim().min(1, 'Enter your purchase-order number.').max(60, 'Use at most 60 characters.'),
  neededBy: z.preprocess(
    (v) => (v === '' || v === undefined ? null : v),
    z.iso.date({ error: 'Enter a date as YYYY-MM-DD.' }).nullable(),
  ),
});
export type AcceptQuoteInput = z.infer<typeof acceptQuoteSchema>;

export const declineQuoteSchema = z.object({
  quoteId: id('a quote'),
  reason: z.string().trim().min(3, 'Tell us briefly why (at least 3 characters).').max(1000, 'Use at most 1000 characters.'),
});
