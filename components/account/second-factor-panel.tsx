'use client';

import Link from 'next/link';
import { useActionState } from 'react';
import { buttonClasses } from '@/components/ui/button';
import { cx } from '@/components/ui/cx';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/field';
import { initialFormState } from '@/lib/action-state';
import { newRecoveryCodesAction, turnOffSecondFactorAction } from '@/app/(auth)/two-factor/actions';
import { RecoveryCodes } from './recovery-codes';

type Props = { enabled: boolean; required: boolean; recoveryCodesLeft: number };

export function SecondFactorPanel({ enabled, required, recoveryCodesLeft }: Props) {
  const [codesState, codesAction] = useActionState(newRecoveryCodesAction, initialFormState);
  const [offState, offAction] = useActionState(turnOffSecondFactorAction, initialFormState);
  if (!enabled || (offState.ok && !required)) {
    return (
      <div className="flex flex-col gap-3 text-sm">
        <FormMessage tone="success" message={offState.ok ? offState.message : undefined} />
        <p>Off. Signing in asks for your password only.</p>
        <Link href="/two-factor/setup" className={cx(buttonClasses(), 'self-start')}>
          Set up an authenticator app
        </Link>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-4 text-sm">
      <p>
        On. Signing in asks for a code from your authenticator app. {recoveryCodesLeft} unused recovery code{recoveryCodesLeft === 1 ? '' : 's'} left.
        {required ? ' The owner account must keep it.' : ''}
      </p>
      <form action={codesAction} className="flex flex-wrap items-end gap-3" noValidate>
        <TextField label="Code from the app" name="code" inputMode="numeric" autoComplete="one-time-code" errors={codesState.fieldErrors?.code} className="w-48" />
        <SubmitButton variant="secondary" pendingLabel="Making…">
          New recovery codes
        </SubmitButton>
      </form>
      <FormMessage tone={codesState.ok ? 'success' : 'error'} message={codesState.message} />
      {codesState.ok && codesState.codes ? <RecoveryCodes codes={codesState.codes} /> : null}
      {required ? null : (
        <form action={offAction} className="flex flex-wrap items-end gap-3 border-t border-surface-line pt-4" noValidate>
          <TextField label="Code from the app" name="code" inputMode="numeric" autoComplete="one-time-code" errors={offState.fieldErrors?.code} className="w-48" />
          <SubmitButton variant="secondary" pendingLabel="Turning off…">
            Turn off
          </SubmitButton>
          <FormMessage tone="error" message={offState.ok ? undefined : offState.message} />
        </form>
      )}
    </div>
  );
}
