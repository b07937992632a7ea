'use client';

import { useActionState } from 'react';
import { NumberField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { savePassivationWindowAction } from './actions';

export type WindowFormValues = {
  id: string;
  name: string;
  unit: string;
  tempUnit: string;
  concentrationMin: string;
  concentrationMax: string;
  bands: { minC: string; maxC: string; minMinutes: string }[];
  source: string;
};

/** One treatment's window: the concentration band and each temperature band's shortest time. */
export function WindowForm({ w, readOnly }: { w: WindowFormValues; readOnly: boolean }) {
  const [state, action] = useActionState(savePassivationWindowAction, initialFormState);
  const v = (k: string, d: string) => (state.ok ? d : (state.values?.[k] ?? d));
  const e = (k: string) => state.fieldErrors?.[k];
  return (
    <form action={action} className="flex flex-col gap-3" noValidate aria-label={w.name}>
      <input type="hidden" name="windowId" value={w.id} />
      <input type="hidden" name="bandCount" value={w.bands.length} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <fieldset disabled={readOnly} className="flex flex-col gap-3">
        <div className="grid grid-cols-2 gap-3 sm:max-w-md">
          <NumberField label="Acid from" name="concentrationMin" unit={w.unit} defaultValue={v('concentrationMin', w.concentrationMin)} errors={e('concentration.min')} />
          <NumberField label="Acid to" name="concentrationMax" unit={w.unit} defaultValue={v('concentrationMax', w.concentrationMax)} errors={e('concentration.max')} />
        </div>
        {w.bands.map((b, i) => (
          <div key={i} className="grid grid-cols-3 gap-3 sm:max-w-xl">
            <NumberField label={`Band ${i + 1}: from`} name={`band${i}_minC`} unit={w.tempUnit} defaultValue={v(`band${i}_minC`, b.minC)} errors={e(`bands.${i}.minC`)} />
            <NumberField label={`Band ${i + 1}: to`} name={`band${i}_maxC`} unit={w.tempUnit} defaultValue={v(`band${i}_maxC`, b.maxC)} errors={e(`bands.${i}.maxC`)} />
            <NumberField label={`Band ${i + 1}: at least`} name={`band${i}_minMinutes`} unit="min" defaultValue={v(`band${i}_minMinutes`, b.minMinutes)} errors={e(`bands.${i}.minMinutes`)} />
          </div>
        ))}
        <TextField label="Where these figures come from" name="source" defaultValue={v('source', w.source)} errors={e('source')} hint="The standard and edition, the customer's specification, or 'from memory'." />
        {readOnly ? null : (
          <div>
            <SubmitButton variant="secondary" pendingLabel="Saving…">
              Save this window
            </SubmitButton>
          </div>
        )}
      </fieldset>
    </form>
  );
}
