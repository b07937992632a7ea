'use client';

import { useActionState } from 'react';
import { NumberField, SelectField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { BASIS_LABELS, PRICING_BASES } from '@/lib/quotes/basis';
import { addLineAction } from '../actions';

type Choices = {
  parts: { id: string; part_number: string; revision: string; description: string }[];
  finishes: { id: string; code: string; name: string }[];
};

export function AddLineForm({ quoteId, choices }: { quoteId: string; choices: Choices }) {
  const [state, action] = useActionState(addLineAction, initialFormState);
  const v = state.ok ? {} : (state.values ?? {});
  return (
    <form action={action} className="grid gap-4 md:grid-cols-2 lg:grid-cols-4" noValidate>
      <input type="hidden" name="quoteId" value={quoteId} />
      <FormMessage className="md:col-span-2 lg:col-span-4" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField
        label="Part"
        name="partId"
        defaultValue={v.partId ?? ''}
        placeholder="Choose a part…"
        options={choices.parts.map((p) => ({ value: p.id, label: `${p.part_number}${p.revision ? ` rev ${p.revision}` : ''} · ${p.description}` }))}
        errors={state.fieldErrors?.partId}
        required
      />
      <SelectField
        label="Finish"
        name="finishId"
        defaultValue={v.finishId ?? ''}
        placeholder="Choose a finish…"
        options={choices.finishes.map((f) => ({ value: f.id, label: `${f.code} · ${f.name}` }))}
        errors={state.fieldErrors?.finishId}
        required
      />
      <NumberField label="Quantity" name="quantity" unit="pc" defaultValue={v.quantity} errors={state.fieldErrors?.quantity} required />
      <SelectField
        label="Priced"
        name="basis"
        defaultValue={v.basis ?? 'piece'}
        options={PRICING_BASES.map((b) => ({ value: b, label: BASIS_LABELS[b] }))}
        errors={state.fieldErrors?.basis}
        required
      />
      <div className="md:col-span-2 lg:col-span-4">
        <SubmitButton pendingLabel="Pricing…">Add and price line</SubmitButton>
      </div>
    </form>
  );
}
