'use client';

import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { payInvoiceAction } from './actions';

export function PayForm({ invoiceId, label }: { invoiceId: string; label: string }) {
  const [state, action] = useActionState(payInvoiceAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-2">
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <SubmitButton size="lg" pendingLabel="Opening the payment page…">
        {label}
      </SubmitButton>
      <FormMessage tone="error" message={state.ok ? null : state.message} />
    </form>
  );
}
