import { z } from 'zod';
import { ROLES } from './roles';

// Shared by server actions and tests; messages are shown next to the field.
export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }));

// OWASP ASVS: at least 8 characters (we ask for 10), long passphrases allowed, no composition rules.
export const newPasswordSchema = z
  .string({ error: 'Enter a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(128, 'Use at most 128 characters.');

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(128, 'That password is too long.'),
  next: z.string().max(500).optional(),
});

export const resetRequestSchema = z.object({ email: emailSchema });

export const setPasswordSchema = z
  .object({ token: z.string().min(1).max(200), password: newPasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords do not match.' });

export const changePasswordSchema = z
  .object({ current: z.string().min(1, 'Enter your current password.').max(128), password: newPasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords do not match.' });

export const inviteSchema = z
  .object({
    email: emailSchema,
    name: z.string().trim().min(1, 'Enter a name.').max(200, 'Use at most 200 characters.'),
    role: z.enum(ROLES, { error: 'Choose a role.' }),
    customerId: z.preprocess((v) => (v === '' ? undefined : v), z.uuid({ error: 'Choose a customer account.' }).optional()),
  })
  .refine((v) => v.role !== 'customer' || !!v.customerId, { path: ['customerId'], message: 'A customer contact needs a customer account.' });

export const updateUserSchema = z.object({
  userId: z.string().min(1).max(100),
  role: z.enum(ROLES, { error: 'Choose a role.' }),
  isActive: z.preprocess((v) => v === 'on' || v === 'true' || v === true, z.boolean()),
  // A customer contact who may make API tokens for their company.
  isCustomerAdmin: z.preprocess((v) => v === 'on' || v === 'true' || v === true, z.boolean()),
});

export const unitSystemSchema = z.object({ unitSystem: z.enum(['metric', 'us'], { error: 'Choose metric or US units.' }) });

// The second step of signing in: six digits from the app, or a recovery code (xxxxx-xxxxx).
export const secondFactorSchema = z.object({
  code: z.string({ error: 'Type the code.' }).trim().min(1, 'Type the 6-digit code, or a recovery code.').max(40, 'That is too long for a code.'),
  next: z.string().max(500).optional(),
});

export const totpCodeSchema = z.object({
  code: z
    .string({ error: 'Type the code.' })
    .trim()
    .transform((v) => v.replace(/\s/g, ''))
    .pipe(z.string().regex(/^\d{6}$/, 'Type the 6 digits your app shows.')),
  next: z.string().max(500).optional(),
});
