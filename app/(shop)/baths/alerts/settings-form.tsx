'use client';

import { useActionState } from 'react';
import { NumberField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import type { BathSettings } from '@/lib/bath/settings';
import { updateBathSettingsAction } from './actions';

/** The owner's timing for bath alerts. */
export function BathSettingsForm({ settings }: { settings: BathSettings }) {
  const [state, action] = useActionState(updateBathSettingsAction, initialFormState);
  const v = (k: keyof BathSettings) => state.values?.[k] ?? String(settings[k]);
  return (
    <form action={action} className="grid gap-3 sm:grid-cols-3" noValidate>
      <FormMessage className="sm:col-span-3" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <NumberField label="Escalate to the owner after" name="escalateAfterHours" unit="h" defaultValue={v('escalateAfterHours')} errors={state.fieldErrors?.escalateAfterHours} hint="Unacknowledged alerts" />
      <NumberField label="Expect a recommended addition within" name="additionGraceHours" unit="h" defaultValue={v('additionGraceHours')} errors={state.fieldErrors?.additionGraceHours} />
      <NumberField label="Call an analysis overdue after its interval plus" name="overdueGraceHours" unit="h" defaultValue={v('overdueGraceHours')} errors={state.fieldErrors?.overdueGraceHours} />
      <div className="sm:col-span-3">
        <SubmitButton pendingLabel="Saving…">Save alert settings</SubmitButton>
      </div>
    </form>
  );
}
