'use client';

import Link from 'next/link';
import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/field';
import { initialFormState } from '@/lib/action-state';
import { signInAction } from './actions';

export function SignInForm({ next, notice }: { next?: string; notice?: string }) {
  const [state, action] = useActionState(signInAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      {notice && !state.message ? <FormMessage tone="success" message={notice} /> : null}
      <FormMessage tone="error" message={state.message} />
      <input type="hidden" name="next" value={next ?? ''} />
      <TextField label="E-mail" name="email" type="email" autoComplete="username" defaultValue={state.values?.email} errors={state.fieldErrors?.email} required />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" errors={state.fieldErrors?.password} required />
      <SubmitButton fullWidth pendingLabel="Signing in…">
        Sign in
      </SubmitButton>
      <Link href="/reset" className="text-center text-sm text-action underline">
        Forgot your password?
      </Link>
    </form>
  );
}
