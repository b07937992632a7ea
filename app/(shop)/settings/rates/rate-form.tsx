'use client';

import { useActionState } from 'react';
import { NumberField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { MONEY_FIELDS, PRICED_METALS } from '@/lib/rates/schemas';
import { saveRateSetAction } from './actions';

export function RateForm({ defaults, readOnly, submitLabel }: { defaults: Record<string, string>; readOnly: boolean; submitLabel: string }) {
  const [state, action] = useActionState(saveRateSetAction, initialFormState);
  const v = (k: string) => (state.ok ? defaults[k] : (state.values?.[k] ?? defaults[k])) ?? '';
  const e = (k: string) => state.fieldErrors?.[k];
  return (
    <form action={action} className="flex flex-col gap-6" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <input type="hidden" name="rateSetId" value={defaults.rateSetId} />
      <fieldset disabled={readOnly} className="contents">
        <div className="sm:max-w-xs">
          <TextField label="Takes effect on" name="effectiveFrom" type="date" defaultValue={v('effectiveFrom')} errors={e('effectiveFrom')} required hint="Quotes dated from this day use these rates." />
        </div>
        <section className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          {MONEY_FIELDS.map((f) => (
            <NumberField key={f.key} label={f.label} name={f.key} unit={`$ ${f.per}`} defaultValue={v(f.key)} errors={e(f.key)} required />
          ))}
        </section>
        <fieldset className="grid gap-4 rounded-md border border-surface-line p-4 sm:grid-cols-3 lg:grid-cols-5">
          <legend className="px-1 text-base font-semibold">Metal prices (anode or salt metal)</legend>
          {PRICED_METALS.map((m) => (
            <NumberField key={m.element} label={m.name} name={`metal_${m.element}`} unit="$/kg" defaultValue={v(`metal_${m.element}`)} errors={e(`metal_${m.element}`)} />
          ))}
        </fieldset>
        <section className="grid gap-4 sm:grid-cols-3">
          <NumberField label="Rush multiplier" name="rushMultiplierPct" unit="%" defaultValue={v('rushMultiplierPct')} errors={e('rushMultiplierPct')} hint="150 % means rush work costs 1.5 times." required />
          <NumberField label="Margin" name="marginPct" unit="%" defaultValue={v('marginPct')} errors={e('marginPct')} required />
          <NumberField label="Quotes valid for" name="quoteValidDays" unit="days" defaultValue={v('quoteValidDays')} errors={e('quoteValidDays')} required />
        </section>
      </fieldset>
      <p className="text-sm text-ink-muted">Amounts in dollars with at most two decimals (whole cents); more decimals are refused rather than rounded.</p>
      {readOnly ? null : (
        <div>
          <SubmitButton pendingLabel="Saving…">{submitLabel}</SubmitButton>
        </div>
      )}
    </form>
  );
}
