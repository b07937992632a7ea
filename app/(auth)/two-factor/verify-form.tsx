'use client';

import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/field';
import { initialFormState } from '@/lib/action-state';
import { signOutAction } from '@/lib/auth/actions';
import { verifySecondFactorAction } from './actions';

export function VerifyForm({ next }: { next?: string }) {
  const [state, action] = useActionState(verifySecondFactorAction, initialFormState);
  return (
    <div className="flex flex-col gap-4">
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage tone="error" message={state.message} />
      <input type="hidden" name="next" value={next ?? ''} />
      <TextField
        label="Code"
        name="code"
        inputMode="text"
        autoComplete="one-time-code"
        autoFocus
        hint="Lost your phone? Type one of your recovery codes (xxxxx-xxxxx) instead."
        errors={state.fieldErrors?.code}
        required
      />
      <SubmitButton fullWidth pendingLabel="Checking…">
        Continue
      </SubmitButton>
    </form>
    <form action={signOutAction} className="text-center">
      <button type="submit" className="text-sm text-action underline">
        Start again with your password
      </button>
    </form>
    </div>
  );
}
