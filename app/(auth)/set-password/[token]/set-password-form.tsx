'use client';

import { useActionState } from 'react';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { setPasswordAction } from './actions';

export function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const [state, action] = useActionState(setPasswordAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage tone="error" message={state.message} />
      <input type="hidden" name="token" value={token} />
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A few unrelated words make a strong, memorable password."
        errors={state.fieldErrors?.password}
        required
      />
      <TextField label="Repeat the password" name="confirm" type="password" autoComplete="new-password" errors={state.fieldErrors?.confirm} required />
      <SubmitButton fullWidth pendingLabel="Saving…">
        Save password
      </SubmitButton>
    </form>
  );
}
