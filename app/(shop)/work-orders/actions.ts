'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/action';
import { advanceSchema, advanceWorkOrder, dueDateSchema, setDueDate } from '@/lib/orders/mutations';
import { logPlatingRun, runSchema } from '@/lib/orders/runs';
import { STATE_LABELS } from '@/lib/orders/states';
import { formatStoredQuantity } from '@/lib/plating';

const at = (id: string) => `/work-orders/${id}`;

export const advanceAction = formAction('orders.advance', advanceSchema, async (input, user) => {
  await advanceWorkOrder(user, input);
  revalidatePath(at(input.workOrderId));
  return { ok: true, message: `Now ${STATE_LABELS[input.to].toLowerCase()}.` };
});

export const dueDateAction = formAction('quotes.write', dueDateSchema, async (input, user) => {
  await setDueDate(user, input);
  revalidatePath(at(input.workOrderId));
  return { ok: true, message: 'Due date saved.' };
});

export const logRunAction = formAction('runs.log', runSchema, async (input, user) => {
  const run = await logPlatingRun(user, input);
  revalidatePath(at(input.workOrderId));
  if (run.duplicate) return { ok: true, message: 'This run was already saved; nothing was added twice.' };
  const p = run.prediction;
  if (run.bathOutside.length) {
    return { ok: true, message: `Run saved. The bath was outside its specification limits (${run.bathOutside.join(', ')}), so a nonconformance is open: a supervisor's disposition comes before inspection.` };
  }
  if (p?.outsideWindow.length) {
    return { ok: true, message: `Run saved as it was. It was outside the process window (${p.outsideWindow.join(' ')}), so a nonconformance is open for quality.` };
  }
  return {
    ok: true,
    message:
      p && p.averageThicknessUm > 0
        ? `Run saved: about ${formatStoredQuantity(p.averageThicknessUm, 'thickness', user.unitSystem)} average, ${formatStoredQuantity(p.minimumThicknessUm, 'thickness', user.unitSystem)} on the thinnest significant surface.`
        : 'Run saved: inside the process window.',
  };
});
