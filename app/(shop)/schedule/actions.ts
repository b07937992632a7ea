'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { placeJob, setTankCapacity, unplaceJob } from '@/lib/schedule/mutations';
import { capacitySchema, placementSchema, unplaceSchema } from '@/lib/schedule/schemas';
import { formatDay } from '@/lib/quotes/format';

export const placeJobAction = formAction('schedule.plan', placementSchema, async (input, user) => {
  await placeJob(user, input);
  revalidatePath('/schedule');
  return { ok: true, message: `Placed on ${formatDay(input.day)}. The plan keeps it there until you give it back to the planner.` };
});

export const unplaceJobAction = formAction('schedule.plan', unplaceSchema, async (input, user) => {
  await unplaceJob(user, input.workOrderId);
  revalidatePath('/schedule');
  return { ok: true, message: 'Given back to the planner: it goes where its promised date and the free loads put it.' };
});

export const capacityAction = formAction('tanks.capacity', capacitySchema, async (input, user) => {
  await setTankCapacity(user, input);
  revalidatePath('/schedule');
  return { ok: true, message: 'Capacity saved; the plan uses it now.' };
});
