'use client';

import { useActionState } from 'react';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import type { CalculationInput } from '@/lib/estimating/calculation-schema';
import { saveCalculationAction } from './actions';

export function SaveForm({ input, suggestedTitle }: { input: CalculationInput | null; suggestedTitle: string }) {
  const [state, action] = useActionState(saveCalculationAction, initialFormState);
  const otherErrors = Object.entries(state.fieldErrors ?? {})
    .filter(([k]) => k !== 'title')
    .flatMap(([, v]) => v);
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      {otherErrors.length ? <p className="text-sm text-out">{otherErrors.join(' ')}</p> : null}
      <input type="hidden" name="input" value={input ? JSON.stringify(input) : ''} />
      <div className="flex flex-wrap items-end gap-3">
        <TextField
          label="Title"
          name="title"
          className="min-w-64 flex-1"
          defaultValue={state.values?.title ?? suggestedTitle}
          errors={state.fieldErrors?.title}
          required
        />
        <SubmitButton pendingLabel="Saving…" disabled={!input}>
          Save calculation
        </SubmitButton>
      </div>
      {!input ? <p className="text-sm text-ink-muted">Fix the highlighted fields before saving.</p> : null}
    </form>
  );
}
