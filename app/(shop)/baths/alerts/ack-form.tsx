'use client';

import { useActionState } from 'react';
import { TextareaField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { acknowledgeAlertAction } from './actions';

export function AcknowledgeForm({ alertId }: { alertId: string }) {
  const [state, action] = useActionState(acknowledgeAlertAction, initialFormState);
  if (state.ok) return <FormMessage tone="success" message={state.message} />;
  return (
    <form action={action} className="flex flex-col gap-2" noValidate>
      <input type="hidden" name="alertId" value={alertId} />
      <FormMessage tone="error" message={state.message} />
      <TextareaField
        label="Corrective action taken"
        name="correctiveAction"
        rows={2}
        defaultValue={state.values?.correctiveAction}
        errors={state.fieldErrors?.correctiveAction}
        required
      />
      <div>
        <SubmitButton pendingLabel="Saving…">Acknowledge</SubmitButton>
      </div>
    </form>
  );
}
