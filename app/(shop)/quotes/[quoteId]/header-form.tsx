'use client';

import { useActionState } from 'react';
import { TextareaField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { updateQuoteHeaderAction } from '../actions';

/** Rush and notes of a draft; changing rush prices every line again. */
export function HeaderForm({ quoteId, contactUserId, isRush, notes }: { quoteId: string; contactUserId: string | null; isRush: boolean; notes: string }) {
  const [state, action] = useActionState(updateQuoteHeaderAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="quoteId" value={quoteId} />
      <input type="hidden" name="contactUserId" value={contactUserId ?? ''} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="isRush" defaultChecked={isRush} className="size-4" />
        Rush job (reprices every line with the rush multiplier)
      </label>
      <TextareaField label="Notes for the customer" name="notes" defaultValue={notes} errors={state.fieldErrors?.notes} rows={2} />
      <div>
        <SubmitButton variant="secondary" size="sm" pendingLabel="Saving…">
          Save
        </SubmitButton>
      </div>
    </form>
  );
}
