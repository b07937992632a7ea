'use client';

import Link from 'next/link';
import { useActionState } from 'react';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { requestResetAction } from './actions';

export function ResetForm() {
  const [state, action] = useActionState(requestResetAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextField label="E-mail" name="email" type="email" autoComplete="username" defaultValue={state.values?.email} errors={state.fieldErrors?.email} required />
      <SubmitButton fullWidth pendingLabel="Sending…">
        Send me a link
      </SubmitButton>
      <Link href="/sign-in" className="text-center text-sm text-action underline">
        Back to sign-in
      </Link>
    </form>
  );
}
