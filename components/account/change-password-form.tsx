'use client';

import { useActionState } from 'react';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { changePasswordAction } from '@/lib/auth/actions';

export function ChangePasswordForm({ email }: { email: string }) {
  const [state, action] = useActionState(changePasswordAction, initialFormState);
  return (
    <form action={action} className="flex max-w-sm flex-col gap-4" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <TextField label="Current password" name="current" type="password" autoComplete="current-password" errors={state.fieldErrors?.current} required />
      <TextField label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." errors={state.fieldErrors?.password} required />
      <TextField label="Repeat the new password" name="confirm" type="password" autoComplete="new-password" errors={state.fieldErrors?.confirm} required />
      <div>
        <SubmitButton pendingLabel="Saving…">Change password</SubmitButton>
      </div>
    </form>
  );
}
