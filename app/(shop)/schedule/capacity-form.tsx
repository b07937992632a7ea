'use client';

import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { capacityAction } from './actions';

type Tank = { id: string; code: string; cycleMinutes: number; loadAreaDm2: number | null; shiftsPerDay: number; shiftHours: number };

const input = 'h-9 w-20 rounded border border-surface-line bg-surface px-2 text-right';

/** One tank's capacity, edited in its row of the capacity table. */
export function CapacityForm({ tank }: { tank: Tank }) {
  const [state, action] = useActionState(capacityAction, initialFormState);
  const v = state.values;
  const err = state.fieldErrors;
  return (
    <form action={action} className="flex flex-wrap items-end gap-2" noValidate aria-label={`Capacity of ${tank.code}`}>
      <input type="hidden" name="tankId" value={tank.id} />
      <label className="flex flex-col text-xs">
        Cycle (min)
        <input className={input} name="cycleMinutes" inputMode="decimal" defaultValue={v?.cycleMinutes ?? tank.cycleMinutes} aria-invalid={err?.cycleMinutes ? true : undefined} />
      </label>
      <label className="flex flex-col text-xs">
        Load area (dm²)
        <input className={input} name="loadAreaDm2" inputMode="decimal" defaultValue={v?.loadAreaDm2 ?? tank.loadAreaDm2 ?? ''} placeholder="any" aria-invalid={err?.loadAreaDm2 ? true : undefined} />
      </label>
      <label className="flex flex-col text-xs">
        Shifts a day
        <input className={input} name="shiftsPerDay" inputMode="numeric" defaultValue={v?.shiftsPerDay ?? tank.shiftsPerDay} aria-invalid={err?.shiftsPerDay ? true : undefined} />
      </label>
      <label className="flex flex-col text-xs">
        Shift (h)
        <input className={input} name="shiftHours" inputMode="decimal" defaultValue={v?.shiftHours ?? tank.shiftHours} aria-invalid={err?.shiftHours ? true : undefined} />
      </label>
      <SubmitButton size="sm" variant="secondary" pendingLabel="Saving…">
        Save
      </SubmitButton>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={err ? Object.values(err).flat().join(' ') : state.message} />
    </form>
  );
}
