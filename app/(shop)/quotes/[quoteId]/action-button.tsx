'use client';

import { useActionState } from 'react';
import type { ButtonVariant } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState, type FormState } from '@/lib/action-state';

type Props = {
  action: (prev: FormState, data: FormData) => Promise<FormState>;
  fields: Record<string, string>;
  label: string;
  pendingLabel?: string;
  variant?: ButtonVariant;
  /** Asked before submitting, for steps that cannot be undone. */
  confirm?: string;
};

/** A one-button form for a server action, with its message beside it. */
export function ActionButton({ action, fields, label, pendingLabel, variant = 'secondary', confirm }: Props) {
  const [state, formAction] = useActionState(action, initialFormState);
  return (
    <form
      action={formAction}
      onSubmit={(e) => {
        if (confirm && !window.confirm(confirm)) e.preventDefault();
      }}
      className="flex flex-wrap items-center gap-2"
    >
      {Object.entries(fields).map(([k, v]) => (
        <input key={k} type="hidden" name={k} value={v} />
      ))}
      <SubmitButton variant={variant} size="sm" pendingLabel={pendingLabel}>
        {label}
      </SubmitButton>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
    </form>
  );
}
