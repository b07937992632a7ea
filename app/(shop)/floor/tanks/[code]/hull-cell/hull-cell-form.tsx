'use client';

import { useActionState } from 'react';
import { LinkButton } from '@/components/ui/button';
import { NumberField, TextareaField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { recordHullCellAction } from './actions';

/** A Hull cell panel: photo (optional), cell current and time, and what the panel shows. Needs a connection (photo upload). */
export function HullCellForm({ tankId, tankCode, entryKey }: { tankId: string; tankCode: string; entryKey: string }) {
  const [state, action] = useActionState(recordHullCellAction, initialFormState);
  if (state.ok) {
    return (
      <div className="flex flex-col gap-3">
        <FormMessage tone="success" message={state.message} />
        <LinkButton size="lg" href={`/floor/tanks/${tankCode}`}>Back to {tankCode}</LinkButton>
      </div>
    );
  }
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage tone="error" message={state.message} />
      <input type="hidden" name="tankId" value={tankId} />
      <input type="hidden" name="key" value={entryKey} />
      <div className="flex flex-col gap-1">
        <label htmlFor="photo" className="text-base font-medium text-ink">Photo of the panel (optional)</label>
        <input id="photo" name="photo" type="file" accept="image/png,image/jpeg,image/webp" capture="environment" className="text-base file:mr-3 file:min-h-12 file:rounded-md file:border file:border-surface-line file:bg-surface file:px-4 file:font-medium" />
      </div>
      <NumberField size="lg" label="Cell current" name="currentA" unit="A" defaultValue={state.values?.currentA ?? '2'} errors={state.fieldErrors?.currentA} required />
      <NumberField size="lg" label="Plating time" name="minutes" unit="min" defaultValue={state.values?.minutes ?? '5'} errors={state.fieldErrors?.minutes} required />
      <TextareaField size="lg" label="What the panel shows" name="notes" defaultValue={state.values?.notes} errors={state.fieldErrors?.notes} hint="Bright range, burning at high current density, dullness or pitting at low, and so on." />
      <SubmitButton size="lg" fullWidth pendingLabel="Saving…">Save panel</SubmitButton>
    </form>
  );
}
