'use client';

import { useActionState } from 'react';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { dueDateAction } from '../actions';

export function DueDateForm({ workOrderId, dueDate }: { workOrderId: string; dueDate: string | null }) {
  const [state, action] = useActionState(dueDateAction, initialFormState);
  return (
    <form action={action} className="flex flex-wrap items-end gap-2" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <TextField label="Due date" name="dueDate" type="date" defaultValue={state.values?.dueDate ?? dueDate ?? ''} errors={state.fieldErrors?.dueDate} />
      <SubmitButton variant="secondary" size="sm" pendingLabel="Saving…">
        Change
      </SubmitButton>
      <FormMessage className="w-full" tone={state.ok ? 'success' : 'error'} message={state.message} />
    </form>
  );
}
