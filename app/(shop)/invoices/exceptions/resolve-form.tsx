'use client';

import { useActionState } from 'react';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { resolveExceptionAction } from '../actions';

/** The owner's answer to one payment exception: refund money that is on no invoice, or close one reviewed. */
export function ResolveExceptionForm({ exceptionId, onBooks }: { exceptionId: string; onBooks: boolean }) {
  const [state, action] = useActionState(resolveExceptionAction, initialFormState);
  if (state.ok && state.message) return <FormMessage tone="success" message={state.message} />;
  return (
    <form action={action} className="flex flex-col gap-2" noValidate>
      <input type="hidden" name="exceptionId" value={exceptionId} />
      <input type="hidden" name="action" value={onBooks ? 'keep' : 'refund'} />
      <FormMessage tone="error" message={state.message} />
      <TextField label="Note" name="note" defaultValue={state.values?.note} errors={state.fieldErrors?.note ?? state.fieldErrors?.action} />
      <div>
        <SubmitButton variant="secondary" size="sm" pendingLabel={onBooks ? 'Saving…' : 'Refunding…'}>
          {onBooks ? 'Reviewed: keep on the invoice' : 'Refund through Stripe'}
        </SubmitButton>
      </div>
    </form>
  );
}
