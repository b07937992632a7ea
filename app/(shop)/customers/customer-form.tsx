'use client';

import { useActionState } from 'react';
import { NumberField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { type FormState, initialFormState } from '@/lib/action-state';

export type CustomerFormValues = {
  customerId?: string;
  code: string;
  name: string;
  billingAddress: string;
  shippingAddress: string;
  billingEmail: string;
  phone: string;
  paymentTermsDays: string;
  taxRatePercent: string;
};

type Props = {
  action: (state: FormState, data: FormData) => Promise<FormState>;
  defaults: CustomerFormValues;
  submitLabel: string;
  readOnly?: boolean;
};

export function CustomerForm({ action, defaults, submitLabel, readOnly = false }: Props) {
  const [state, formAction] = useActionState(action, initialFormState);
  // After a failed save keep what was typed; after success show what was saved.
  const v = (k: keyof CustomerFormValues) => (state.ok ? defaults[k] : (state.values?.[k] ?? defaults[k])) ?? '';
  const e = (k: string) => state.fieldErrors?.[k];
  return (
    <form action={formAction} className="grid gap-4 sm:grid-cols-2" noValidate>
      <FormMessage className="sm:col-span-2" tone={state.ok ? 'success' : 'error'} message={state.message} />
      {defaults.customerId ? <input type="hidden" name="customerId" value={defaults.customerId} /> : null}
      <fieldset disabled={readOnly} className="contents">
        <TextField label="Customer code" name="code" defaultValue={v('code')} errors={e('code')} required hint="2–16 capital letters, digits or dashes; used on quotes and imports." autoCapitalize="characters" />
        <TextField label="Company name" name="name" defaultValue={v('name')} errors={e('name')} required />
        <TextareaField label="Billing address" name="billingAddress" defaultValue={v('billingAddress')} errors={e('billingAddress')} />
        <TextareaField label="Shipping address" name="shippingAddress" defaultValue={v('shippingAddress')} errors={e('shippingAddress')} />
        <TextField label="Billing e-mail" name="billingEmail" type="email" defaultValue={v('billingEmail')} errors={e('billingEmail')} hint="Invoices go here." />
        <TextField label="Phone" name="phone" type="tel" defaultValue={v('phone')} errors={e('phone')} />
        <NumberField label="Payment terms" name="paymentTermsDays" unit="days" defaultValue={v('paymentTermsDays')} errors={e('paymentTermsDays')} required />
        <NumberField label="Sales tax rate" name="taxRatePercent" unit="%" defaultValue={v('taxRatePercent')} errors={e('taxRatePercent')} hint="Up to two decimals, e.g. 7.25. Enter 0 for tax-exempt customers." required />
      </fieldset>
      {readOnly ? null : (
        <div className="sm:col-span-2">
          <SubmitButton pendingLabel="Saving…">{submitLabel}</SubmitButton>
        </div>
      )}
    </form>
  );
}
