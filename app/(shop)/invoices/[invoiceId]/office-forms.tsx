'use client';

import { useActionState } from 'react';
import { SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { creditNoteAction, recordPaymentAction, resendInvoiceAction } from '../actions';

// The owner's forms on an issued invoice: correct it with a credit note, record a check or
// transfer, e-mail it again. The invoice itself is never edited.

export function CreditNoteForm({ invoiceId, maxText }: { invoiceId: string; maxText: string }) {
  const [state, action] = useActionState(creditNoteAction, initialFormState);
  const v = state.ok ? undefined : state.values;
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextField label="Amount ($)" name="amount" inputMode="decimal" hint={`At most ${maxText}, the open balance.`} defaultValue={v?.amount} errors={state.fieldErrors?.amount} required />
      <TextareaField label="Reason" name="reason" rows={2} defaultValue={v?.reason} errors={state.fieldErrors?.reason} required />
      <div>
        <SubmitButton variant="secondary" pendingLabel="Issuing…">
          Issue credit note
        </SubmitButton>
      </div>
    </form>
  );
}

export function ManualPaymentForm({ invoiceId, today }: { invoiceId: string; today: string }) {
  const [state, action] = useActionState(recordPaymentAction, initialFormState);
  const v = state.ok ? undefined : state.values;
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextField label="Amount ($)" name="amount" inputMode="decimal" defaultValue={v?.amount} errors={state.fieldErrors?.amount} required />
      <SelectField
        label="Paid by"
        name="method"
        defaultValue={v?.method ?? 'check'}
        options={[
          { value: 'check', label: 'Check' },
          { value: 'bank_transfer', label: 'Bank transfer' },
        ]}
        errors={state.fieldErrors?.method}
      />
      <TextField label="Reference" name="reference" hint="Check number or transfer reference." defaultValue={v?.reference} errors={state.fieldErrors?.reference} />
      <TextField label="Received on" name="receivedOn" type="date" max={today} defaultValue={v?.receivedOn ?? today} errors={state.fieldErrors?.receivedOn} required />
      <div>
        <SubmitButton variant="secondary" pendingLabel="Recording…">
          Record payment
        </SubmitButton>
      </div>
    </form>
  );
}

export function ResendForm({ invoiceId, label }: { invoiceId: string; label: string }) {
  const [state, action] = useActionState(resendInvoiceAction, initialFormState);
  return (
    <form action={action} className="flex flex-col items-start gap-2">
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <SubmitButton variant="secondary" size="sm" pendingLabel="Sending…">
        {label}
      </SubmitButton>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
    </form>
  );
}
