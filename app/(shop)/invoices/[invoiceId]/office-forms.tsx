'use client';

import { useActionState } from 'react';
import { SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { applyCreditAction, creditNoteAction, recordPaymentAction, refundExcessAction, resendInvoiceAction } from '../actions';

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
      {state.fieldErrors?.acceptExcess ? (
        <label className="flex items-start gap-2 rounded border border-copper bg-copper-soft p-2 text-sm">
          <input type="checkbox" name="acceptExcess" className="mt-0.5 size-4" />
          <span>Keep the excess as credit on account. The customer&apos;s credit can later be refunded or applied to another invoice.</span>
        </label>
      ) : null}
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

/** Gives a customer's credit on account back: by card through the payment service, or by check or transfer. */
export function RefundExcessForm({ invoiceId, maxText, hasCard }: { invoiceId: string; maxText: string; hasCard: boolean }) {
  const [state, action] = useActionState(refundExcessAction, initialFormState);
  const v = state.ok ? undefined : state.values;
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextField label="Amount ($)" name="amount" inputMode="decimal" hint={`At most ${maxText}.`} defaultValue={v?.amount} errors={state.fieldErrors?.amount} required />
      <SelectField
        label="Refund by"
        name="method"
        defaultValue={v?.method ?? (hasCard ? 'card' : 'check')}
        options={[
          ...(hasCard ? [{ value: 'card', label: 'Card (back to the card that paid)' }] : []),
          { value: 'check', label: 'Check' },
          { value: 'bank_transfer', label: 'Bank transfer' },
        ]}
        errors={state.fieldErrors?.method}
      />
      <TextField label="Reference" name="reference" hint="Check number or transfer reference (not needed for a card)." defaultValue={v?.reference} errors={state.fieldErrors?.reference} />
      <div>
        <SubmitButton variant="secondary" pendingLabel="Refunding…">
          Refund
        </SubmitButton>
      </div>
    </form>
  );
}

/** Moves credit on account to another open invoice of the same customer. */
export function ApplyCreditForm({ fromInvoiceId, targets }: { fromInvoiceId: string; targets: { id: string; label: string }[] }) {
  const [state, action] = useActionState(applyCreditAction, initialFormState);
  const v = state.ok ? undefined : state.values;
  if (targets.length === 0) return <p className="text-sm text-ink-muted">This customer has no other open invoice to apply the credit to.</p>;
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="fromInvoiceId" value={fromInvoiceId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField label="Invoice" name="toInvoiceId" defaultValue={v?.toInvoiceId ?? targets[0]!.id} options={targets.map((t) => ({ value: t.id, label: t.label }))} errors={state.fieldErrors?.toInvoiceId} />
      <TextField label="Amount ($)" name="amount" inputMode="decimal" defaultValue={v?.amount} errors={state.fieldErrors?.amount} required />
      <TextField label="Note" name="note" defaultValue={v?.note} errors={state.fieldErrors?.note} />
      <div>
        <SubmitButton variant="secondary" pendingLabel="Applying…">
          Apply credit
        </SubmitButton>
      </div>
    </form>
  );
}
