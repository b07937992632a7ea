'use client';

import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { overrideLineAction } from '../actions';

/** Sets a line's price by hand; a reason is required and kept with who and when. */
export function OverrideForm({ quoteId, lineId, lineNo }: { quoteId: string; lineId: string; lineNo: number }) {
  const [open, setOpen] = useState(false);
  const [state, action] = useActionState(overrideLineAction, initialFormState);
  if (!open && !state.message) {
    return (
      <Button variant="ghost" size="sm" onClick={() => setOpen(true)}>
        Override price…
      </Button>
    );
  }
  return (
    <form action={action} className="grid gap-3 rounded-md border border-surface-line bg-surface-muted p-3 sm:grid-cols-[10rem_1fr_auto] sm:items-start" noValidate>
      <input type="hidden" name="quoteId" value={quoteId} />
      <input type="hidden" name="lineId" value={lineId} />
      <FormMessage className="sm:col-span-3" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextField label={`Line ${lineNo} price`} name="price" unit="USD" inputMode="decimal" defaultValue={state.ok ? '' : state.values?.price} errors={state.fieldErrors?.price} required />
      <TextField label="Reason" name="reason" defaultValue={state.ok ? '' : state.values?.reason} errors={state.fieldErrors?.reason} hint="Kept with the line, your name and the time." required />
      <div className="flex gap-2 sm:pt-6">
        <SubmitButton size="sm" pendingLabel="Saving…">Set price</SubmitButton>
        <Button variant="ghost" size="sm" onClick={() => setOpen(false)}>
          Close
        </Button>
      </div>
    </form>
  );
}
