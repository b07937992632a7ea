'use client';

import { useActionState } from 'react';
import { SelectField, TextareaField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { createQuoteAction } from '../actions';

export function NewQuoteForm({ customers, customerId }: { customers: { id: string; code: string; name: string }[]; customerId?: string }) {
  const [state, action] = useActionState(createQuoteAction, initialFormState);
  return (
    <form action={action} className="grid max-w-xl gap-4" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField
        label="Customer"
        name="customerId"
        defaultValue={state.values?.customerId ?? customerId ?? ''}
        placeholder="Choose a customer…"
        options={customers.map((c) => ({ value: c.id, label: `${c.name} (${c.code})` }))}
        errors={state.fieldErrors?.customerId}
        required
      />
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="isRush" defaultChecked={state.values?.isRush === 'on'} className="size-4" />
        Rush job (the rate set&apos;s rush multiplier applies)
      </label>
      <TextareaField label="Notes for the customer" name="notes" defaultValue={state.values?.notes} errors={state.fieldErrors?.notes} hint="Printed on the quote." />
      <div>
        <SubmitButton pendingLabel="Creating…">Create draft quote</SubmitButton>
      </div>
    </form>
  );
}
