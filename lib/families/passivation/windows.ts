// The shop's own passivation windows: the defaults (lib/plating/passivation, each naming its source)
// with whatever figures the shop has changed, read back through a schema so a stored window that
// no longer makes sense is never used. Pure.
import { z } from 'zod';
import { DEFAULT_PASSIVATION_WINDOWS, type PassivationWindow } from '@/lib/plating';

const band = z
  .object({
    minC: z.number().min(0).max(100),
    maxC: z.number().min(0).max(100),
    minMinutes: z.number().positive().max(600),
  })
  .refine((b) => b.minC < b.maxC, { message: 'The band’s lowest temperature must be below its highest.', path: ['maxC'] });

export const shopWindowSchema = z
  .object({
    id: z.enum(DEFAULT_PASSIVATION_WINDOWS.map((w) => w.id) as [string, ...string[]]),
    concentration: z.object({ min: z.number().positive().max(100), max: z.number().positive().max(100) }).refine((c) => c.min < c.max, { message: 'The lowest concentration must be below the highest.', path: ['max'] }),
    bands: z.array(band).min(1).max(6),
    source: z.string().trim().min(3, 'Say where the figures come from.').max(300),
  })
  .strict();
export type ShopWindow = z.infer<typeof shopWindowSchema>;

/** The windows in force: each default, replaced by the shop's valid edit of it where there is one. */
export function windowsInForce(stored: unknown): PassivationWindow[] {
  const edits = new Map<string, ShopWindow>();
  if (Array.isArray(stored)) {
    for (const raw of stored) {
      const parsed = shopWindowSchema.safeParse(raw);
      if (parsed.success) edits.set(parsed.data.id, parsed.data);
    }
  }
  return DEFAULT_PASSIVATION_WINDOWS.map((w) => {
    const e = edits.get(w.id);
    return e ? { ...w, concentration: { ...w.concentration, min: e.concentration.min, max: e.concentration.max }, bands: e.bands, source: e.source } : w;
  });
}

/** The family data the passivation functions read: the shop's windows. */
export function windowsOf(familyData: Record<string, unknown> | undefined): readonly PassivationWindow[] {
  const w = familyData?.passivationWindows;
  return Array.isArray(w) && w.length ? (w as PassivationWindow[]) : DEFAULT_PASSIVATION_WINDOWS;
}
