// Form and API input for invoicing; shared by server actions, route handlers and tests.
import { z } from 'zod';
import { checkbox, dollarsSchema } from '@/lib/quotes/schemas';
import { isIsoDate } from './dates';

const id = (what: string) => z.uuid({ error: `Choose ${what}.` });
const optionalText = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`).default('');
const isoDay = (what: string) =>
  z.string({ error: `Enter the ${what}.` }).trim().refine(isIsoDate, `Enter the ${what} as a date (YYYY-MM-DD).`);

/** Hidden fields carry lists as text: "id,id" or JSON written by the form. */
function listFromText(v: unknown): unknown {
  if (typeof v !== 'string') return v;
  const text = v.trim();
  if (text === '') return [];
  if (text.startsWith('[')) {
    try {
      return JSON.parse(text) as unknown;
    } catch {
      return v;
    }
  }
  return text.split(',').map((s) => s.trim()).filter(Boolean);
}

export const extraLineSchema = z
  .object({
    kind: z.enum(['rush', 'expedite', 'rework', 'other'], { error: 'Choose the kind of charge.' }),
    description: z.string({ error: 'Describe the charge.' }).trim().min(1, 'Describe the charge.').max(300, 'Use at most 300 characters.'),
    quantity: z.coerce
      .number({ error: 'Enter a quantity.' })
      .positive('Enter a quantity above zero.')
      .max(1_000_000, 'That quantity is too large.')
      .refine((q) => Math.abs(q * 10_000 - Math.round(q * 10_000)) < 1e-6, 'Use at most 4 decimal places.'),
    // Rework is billed at no charge, so its price may be left empty.
    unitPrice: z.preprocess((v) => (v === '' || v === undefined || v === null ? '0' : v), dollarsSchema),
  })
  .transform(({ unitPrice, ...rest }) => ({ ...rest, unitPriceCents: rest.kind === 'rework' ? 0 : unitPrice }));

export const issueInvoiceSchema = z.object({
  customerId: id('a customer'),
  orderIds: z.preprocess(
    listFromText,
    z.array(z.uuid({ error: 'That is not a work order.' }), { error: 'Choose at least one shipped work order.' })
      .min(1, 'Choose at least one shipped work order.')
      .max(200, 'Put at most 200 work orders on one invoice.'),
  ),
  extras: z.preprocess(listFromText, z.array(extraLineSchema, { error: 'The extra lines could not be read.' }).max(50, 'Use at most 50 extra lines.')),
  issuedOn: isoDay('invoice date').optional(),
  notes: optionalText(2000),
});
export type IssueInvoiceInput = z.infer<typeof issueInvoiceSchema>;

export const creditNoteSchema = z.object({
  invoiceId: id('an invoice'),
  amount: dollarsSchema.refine((c) => c > 0, 'Enter an amount above zero.'),
  reason: z.string({ error: 'Say why the invoice is credited.' }).trim().min(5, 'Say why the invoice is credited (at least 5 characters).').max(1000, 'Use at most 1000 characters.'),
});
export type CreditNoteInput = z.infer<typeof creditNoteSchema>;

export const manualPaymentSchema = z.object({
  invoiceId: id('an invoice'),
  amount: dollarsSchema.refine((c) => c > 0, 'Enter an amount above zero.'),
  method: z.enum(['check', 'bank_transfer'], { error: 'Choose how it was paid.' }),
  reference: optionalText(200),
  receivedOn: isoDay('date received'),
  // More than the open balance is recorded only when the office says so; the excess is credit on account.
  acceptExcess: checkbox.default(false),
});
export type ManualPaymentInput = z.infer<typeof manualPaymentSchema>;

export const invoiceRefSchema = z.object({ invoiceId: id('an invoice') });

export const applyCreditSchema = z
  .object({
    fromInvoiceId: id('the invoice that holds the credit'),
    toInvoiceId: id('an open invoice to apply it to'),
    amount: dollarsSchema.refine((c) => c > 0, 'Enter an amount above zero.'),
    note: optionalText(500),
  })
  .refine((v) => v.fromInvoiceId !== v.toInvoiceId, { path: ['toInvoiceId'], message: 'Choose another invoice than the one holding the credit.' });
export type ApplyCreditInput = z.infer<typeof applyCreditSchema>;

export const refundExcessSchema = z.object({
  invoiceId: id('an invoice'),
  amount: dollarsSchema.refine((c) => c > 0, 'Enter an amount above zero.'),
  method: z.enum(['card', 'check', 'bank_transfer'], { error: 'Choose how the money goes back.' }),
  reference: optionalText(200),
});
export type RefundExcessInput = z.infer<typeof refundExcessSchema>;

export const resolveExceptionSchema = z.object({
  exceptionId: id('a payment exception'),
  action: z.enum(['refund', 'keep'], { error: 'Choose what to do with the payment.' }),
  note: z.string().trim().max(500, 'Use at most 500 characters.').default(''),
});
export type ResolveExceptionInput = z.infer<typeof resolveExceptionSchema>;
