'use client';

import { useActionState } from 'react';
import { TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { acceptQuoteAction, declineQuoteAction } from '../actions';

export function AcceptForm({ quoteId }: { quoteId: string }) {
  const [state, action] = useActionState(acceptQuoteAction, initialFormState);
  return (
    <form action={action} className="grid gap-4 sm:grid-cols-2" noValidate>
      <input type="hidden" name="quoteId" value={quoteId} />
      <FormMessage className="sm:col-span-2" tone="error" message={state.message} />
      <TextField label="Purchase-order number" name="poNumber" defaultValue={state.values?.poNumber} errors={state.fieldErrors?.poNumber} autoComplete="off" required />
      <TextField label="Needed by (optional)" name="neededBy" type="date" defaultValue={state.values?.neededBy} errors={state.fieldErrors?.neededBy} hint="Leave empty for our standard lead time." />
      <div className="sm:col-span-2">
        <SubmitButton pendingLabel="Accepting…">Accept quote</SubmitButton>
      </div>
    </form>
  );
}

export function DeclineForm({ quoteId }: { quoteId: string }) {
  const [state, action] = useActionState(declineQuoteAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="quoteId" value={quoteId} />
      <FormMessage tone="error" message={state.message} />
      <TextareaField label="Reason" name="reason" defaultValue={state.values?.reason} errors={state.fieldErrors?.reason} rows={2} required />
      <div>
        <SubmitButton variant="secondary" pendingLabel="Sending…">
          Decline quote
        </SubmitButton>
      </div>
    </form>
  );
}
