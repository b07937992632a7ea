// What a new API token asks for (the owner's and a customer administrator's forms).
import { z } from 'zod';
import { ROLES } from '@/lib/auth/roles';

export const tokenSchema = z.object({
  name: z.string().trim().min(1, 'Give the token a name, e.g. the system that will use it.').max(80, 'Keep the name under 80 characters.'),
  role: z.enum(ROLES, { error: 'Choose a role.' }).default('customer'),
  customerId: z.uuid({ error: 'Choose a customer.' }).optional().or(z.literal('').transform(() => undefined)),
  perMinute: z.coerce.number({ error: 'Requests a minute must be a number.' }).int('Requests a minute must be a whole number.').min(1, 'At least 1 request a minute.').max(10000, 'At most 10,000 requests a minute.').default(120),
});

export type TokenInput = z.infer<typeof tokenSchema>;

export const revokeSchema = z.object({ tokenId: z.uuid({ error: 'Choose a token.' }) });
