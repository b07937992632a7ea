// Form input of the workbench's save action. The calculation itself arrives as JSON in one hidden
// field and is checked by saveCalculation (lib/estimating/mutations.ts).
import { z } from 'zod';
import { requiredText } from '@/lib/records/fields';

export const saveCalculationSchema = z.object({
  title: requiredText('a title', 200),
  input: z.string({ error: 'The workbench sent no calculation.' }).transform((s, ctx): unknown => {
    try {
      return JSON.parse(s);
    } catch {
      ctx.addIssue({ code: 'custom', message: 'The calculation could not be read; change a field and try again.' });
      return z.NEVER;
    }
  }),
});

export type SaveCalculationInput = z.infer<typeof saveCalculationSchema>;
