// What the schedule's forms and drag-and-drop send.
import { z } from 'zod';

const isoDay = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Choose a day.').refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), 'Choose a real day.');

export const placementSchema = z.object({
  workOrderId: z.uuid({ error: 'Choose the job to move.' }),
  tankId: z.uuid({ error: 'Choose the tank.' }),
  day: isoDay,
});
export type PlacementInput = z.infer<typeof placementSchema>;

export const unplaceSchema = z.object({ workOrderId: z.uuid({ error: 'Choose the job.' }) });

const positive = (what: string, max: number) =>
  z.coerce.number({ error: `Enter the ${what} as a number.` }).refine(Number.isFinite, `Enter the ${what} as a number.`).gt(0, `The ${what} must be more than 0.`).max(max, `The ${what} must be at most ${max}.`);

export const capacitySchema = z.object({
  tankId: z.uuid({ error: 'Choose the tank.' }),
  cycleMinutes: positive('cycle time (minutes)', 1440),
  loadAreaDm2: z.preprocess((v) => (v === '' || v === null || v === undefined ? null : v), positive('load area (dm²)', 100000).nullable()),
  shiftsPerDay: z.coerce.number({ error: 'Enter the shifts per day.' }).int('Enter whole shifts.').min(0, 'Shifts per day is 0 to 3.').max(3, 'Shifts per day is 0 to 3.'),
  shiftHours: positive('shift length (hours)', 12),
});
export type CapacityInput = z.infer<typeof capacitySchema>;
