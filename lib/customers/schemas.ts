// Form and import input for customers and their contacts; shared by server actions, the CSV import and tests.
import { z } from 'zod';
import { emailSchema } from '@/lib/auth/schemas';
import { checkbox, numberField, optionalText, percentToBasisPoints, requiredText, uuidField } from '@/lib/records/fields';

const optionalEmail = z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), emailSchema.nullable().default(null));

export const customerCodeSchema = z
  .string({ error: 'Enter a customer code.' })
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9-]{2,16}$/, 'Use 2–16 capital letters, digits or dashes, e.g. NGF.');

// Field names match the form inputs and the CSV import columns.
export const customerFields = {
  code: customerCodeSchema,
  name: requiredText('the company name', 200),
  billingAddress: optionalText(1000),
  shippingAddress: optionalText(1000),
  billingEmail: optionalEmail,
  phone: optionalText(50),
  paymentTermsDays: numberField('the payment terms in days', { integer: true, min: 0, max: 365 }),
  taxRatePercent: percentToBasisPoints('the tax rate', 100),
};

export const customerSchema = z.object(customerFields);
export type CustomerInput = z.infer<typeof customerSchema>;

export const updateCustomerSchema = customerSchema.extend({ customerId: uuidField('a customer') });
export type UpdateCustomerInput = z.infer<typeof updateCustomerSchema>;

export const contactSchema = z
  .object({
    customerId: uuidField('a customer'),
    name: requiredText('the contact’s name', 200),
    email: optionalEmail,
    phone: optionalText(50),
    isBilling: checkbox,
    maySignIn: checkbox,
  })
  .refine((v) => !v.maySignIn || v.email !== null, { path: ['email'], message: 'A contact who may sign in needs an e-mail address.' });
export type ContactInput = z.infer<typeof contactSchema>;

export const contactRefSchema = z.object({ customerId: uuidField('a customer'), contactId: uuidField('a contact') });
