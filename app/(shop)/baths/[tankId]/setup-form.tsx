'use client';

import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { setupAnalytesAction } from './actions';

export function SetupAnalytesForm({ tankId }: { tankId: string }) {
  const [state, action] = useActionState(setupAnalytesAction, initialFormState);
  return (
    <form action={action} className="flex flex-col items-center gap-2">
      <input type="hidden" name="tankId" value={tankId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SubmitButton pendingLabel="Setting up…">Set up analytes from the bath template</SubmitButton>
    </form>
  );
}
