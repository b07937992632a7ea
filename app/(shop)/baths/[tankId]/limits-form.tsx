'use client';

import { useActionState } from 'react';
import { NumberField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { updateLimitsAction } from './actions';

type Props = {
  tankId: string;
  analyte: { id: string; name: string; unit: string; target: number; lowerControl: number | null; upperControl: number | null; lowerSpec: number | null; upperSpec: number | null; frequencyHours: number };
};

const text = (v: number | null) => (v === null ? '' : String(v));

/** A supervisor's change to one analyte's limits, in the analyte's own unit, with the reason. */
export function LimitsForm({ tankId, analyte }: Props) {
  const [state, action] = useActionState(updateLimitsAction, initialFormState);
  const v = (k: string, fallback: string) => (state.ok ? fallback : (state.values?.[k] ?? fallback));
  const e = state.fieldErrors ?? {};
  return (
    <form action={action} className="grid gap-3 sm:grid-cols-3" noValidate>
      <input type="hidden" name="tankId" value={tankId} />
      <input type="hidden" name="analyteId" value={analyte.id} />
      <FormMessage className="sm:col-span-3" tone={state.ok ? 'success' : 'error'} message={state.message ?? (e.limits ? e.limits[0] : null)} />
      <NumberField label="Target" name="target" unit={analyte.unit} defaultValue={v('target', text(analyte.target))} errors={e.target} required />
      <NumberField label="Lower control limit" name="lowerControl" unit={analyte.unit} defaultValue={v('lowerControl', text(analyte.lowerControl))} errors={e.lowerControl} />
      <NumberField label="Upper control limit" name="upperControl" unit={analyte.unit} defaultValue={v('upperControl', text(analyte.upperControl))} errors={e.upperControl} />
      <NumberField label="Lower specification limit" name="lowerSpec" unit={analyte.unit} defaultValue={v('lowerSpec', text(analyte.lowerSpec))} errors={e.lowerSpec} hint="Optional" />
      <NumberField label="Upper specification limit" name="upperSpec" unit={analyte.unit} defaultValue={v('upperSpec', text(analyte.upperSpec))} errors={e.upperSpec} hint="Optional" />
      <NumberField label="Analyse every" name="frequencyHours" unit="h" defaultValue={v('frequencyHours', text(analyte.frequencyHours))} errors={e.frequencyHours} required />
      <TextField className="sm:col-span-3" label="Why the change" name="reason" defaultValue={state.ok ? '' : state.values?.reason} errors={e.reason} required hint="Kept with your name and the time, e.g. the supplier's new data sheet." />
      <div className="sm:col-span-3">
        <SubmitButton pendingLabel="Saving…">Save limits</SubmitButton>
      </div>
    </form>
  );
}
