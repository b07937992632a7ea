'use client';

import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/field';
import { RecoveryCodes } from '@/components/account/recovery-codes';
import { initialFormState } from '@/lib/action-state';
import { confirmEnrolmentAction } from '../actions';

export function EnrolForm({ next, qrSvg, secret, home }: { next?: string; qrSvg: string; secret: string | null; home: string }) {
  const [state, action] = useActionState(confirmEnrolmentAction, initialFormState);
  if (state.ok && state.codes) {
    return (
      <div className="flex flex-col gap-4">
        <FormMessage tone="success" message={state.message} />
        <RecoveryCodes codes={state.codes} />
        <a href={state.values?.next ?? '/'} className="text-center text-sm font-medium text-action underline">
          I have kept them: continue
        </a>
      </div>
    );
  }
  if (secret === null) {
    return (
      <div className="flex flex-col gap-4 text-sm">
        <p>A second factor is already on for this account.</p>
        <a href={home} className="text-center font-medium text-action underline">
          Continue
        </a>
      </div>
    );
  }
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <p className="text-sm">1. In an authenticator app on your phone, add an account by scanning this code.</p>
      <div className="mx-auto w-44 bg-white p-1" role="img" aria-label="QR code of the authenticator set-up link" dangerouslySetInnerHTML={{ __html: qrSvg }} />
      <p className="text-center text-xs text-ink-muted">
        Cannot scan? Type this key: <code className="font-mono text-ink" data-testid="totp-secret">{secret.replace(/(.{4})/g, '$1 ').trim()}</code>
      </p>
      <FormMessage tone="error" message={state.message} />
      <input type="hidden" name="next" value={next ?? ''} />
      <TextField
        label="2. Type the 6-digit code the app shows"
        name="code"
        inputMode="numeric"
        autoComplete="one-time-code"
        errors={state.fieldErrors?.code}
        required
      />
      <SubmitButton fullWidth pendingLabel="Checking…">
        Turn on
      </SubmitButton>
    </form>
  );
}
