'use client';

import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { setUnitSystemAction } from '@/lib/auth/actions';
import type { UnitSystem } from '@/db/types';

const CHOICES: { value: UnitSystem; label: string; detail: string }[] = [
  { value: 'metric', label: 'Metric', detail: 'µm, dm², A/dm², L, g/L, kg, °C' },
  { value: 'us', label: 'US customary', detail: 'mil and µin, ft², A/ft² (ASF), gal, oz/gal, lb, °F' },
];

export function UnitSystemForm({ current }: { current: UnitSystem }) {
  const [state, action] = useActionState(setUnitSystemAction, initialFormState);
  return (
    <form action={action} className="flex max-w-md flex-col gap-3">
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-medium">Units shown on every screen</legend>
        {CHOICES.map((c) => (
          <label key={c.value} className="flex min-h-10 items-center gap-3 rounded-md border border-surface-line px-3 py-2 has-[:checked]:border-action has-[:checked]:bg-action-soft">
            <input type="radio" name="unitSystem" value={c.value} defaultChecked={current === c.value} />
            <span>
              <span className="font-medium">{c.label}</span>
              <span className="block text-xs text-ink-muted">{c.detail}</span>
            </span>
          </label>
        ))}
      </fieldset>
      <div>
        <SubmitButton variant="secondary" pendingLabel="Saving…">
          Save units
        </SubmitButton>
      </div>
    </form>
  );
}
