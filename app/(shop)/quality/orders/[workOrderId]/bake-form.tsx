'use client';

import { useActionState, useState } from 'react';
import { Field, NumberField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { uploadFile } from '@/lib/files/upload-client';
import { recordBakeAction } from './actions';

type Props = {
  workOrderId: string;
  /** Local wall-clock value for the input ("2026-06-10T14:05"), in the shop's zone. */
  platingEndedDefault: string;
  nowDefault: string;
  timeZone: string;
  tempUnit: string;
  tempDefault: string;
  hoursDefault: string;
};

const dateTimeClass = 'min-h-target w-full rounded-md border border-surface-line bg-surface px-3 text-lg tabular';

/** The bake as it happened at the oven; the verdict is computed when it is saved. */
export function BakeForm(p: Props) {
  const [state, action] = useActionState(recordBakeAction, initialFormState);
  const [chart, setChart] = useState<{ id: string; name: string } | null>(null);
  const [upload, setUpload] = useState<{ busy: boolean; error: string | null }>({ busy: false, error: null });
  const v = state.values ?? {};

  async function onChart(file: File | undefined) {
    if (!file) return;
    setUpload({ busy: true, error: null });
    try {
      const f = await uploadFile(file, 'oven-chart');
      setChart({ id: f.id, name: f.name });
      setUpload({ busy: false, error: null });
    } catch (e) {
      setChart(null);
      setUpload({ busy: false, error: e instanceof Error ? e.message : 'The upload failed.' });
    }
  }

  return (
    <form action={action} className="grid gap-3 sm:grid-cols-2" noValidate>
      <input type="hidden" name="workOrderId" value={p.workOrderId} />
      <input type="hidden" name="chartFileId" value={chart?.id ?? ''} />
      <FormMessage className="sm:col-span-2" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <Field label="Plating ended" name="platingEnded" size="lg" hint={`Shop time (${p.timeZone}). From the last run; correct it if needed.`} errors={state.fieldErrors?.platingEnded} required>
        {(c) => <input type="datetime-local" {...c} className={dateTimeClass} defaultValue={v.platingEnded ?? p.platingEndedDefault} />}
      </Field>
      <Field label="Bake started" name="bakeStarted" size="lg" hint="When the load reached temperature in the oven." errors={state.fieldErrors?.bakeStarted} required>
        {(c) => <input type="datetime-local" {...c} className={dateTimeClass} defaultValue={v.bakeStarted ?? p.nowDefault} />}
      </Field>
      <TextField label="Oven" name="oven" size="lg" defaultValue={v.oven} errors={state.fieldErrors?.oven} required />
      <NumberField label="Bake time" name="durationH" unit="h" size="lg" defaultValue={v.durationH ?? p.hoursDefault} errors={state.fieldErrors?.durationH} required />
      <NumberField label="Lowest part temperature" name="tempMin" unit={p.tempUnit} size="lg" defaultValue={v.tempMin ?? p.tempDefault} errors={state.fieldErrors?.tempMin} required />
      <NumberField label="Highest part temperature" name="tempMax" unit={p.tempUnit} size="lg" defaultValue={v.tempMax ?? p.tempDefault} errors={state.fieldErrors?.tempMax} required />
      <Field label="Oven chart (optional)" name="chart" hint="A photo, PDF or logger CSV of the temperature record." errors={upload.error ?? state.fieldErrors?.chart}>
        {(c) => (
          <input
            type="file"
            accept=".pdf,.png,.jpg,.jpeg,.webp,.csv,.txt"
            {...c}
            name={undefined}
            onChange={(e) => void onChart(e.target.files?.[0])}
            className="block w-full text-sm file:mr-3 file:rounded-md file:border file:border-surface-line file:bg-surface-muted file:px-3 file:py-2"
          />
        )}
      </Field>
      <p className="self-end text-sm text-ink-muted" aria-live="polite">
        {upload.busy ? 'Uploading the chart…' : chart ? `Attached: ${chart.name}` : ''}
      </p>
      <TextareaField className="sm:col-span-2" label="Notes (optional)" name="notes" rows={2} defaultValue={v.notes} errors={state.fieldErrors?.notes} />
      <div className="sm:col-span-2">
        <SubmitButton size="lg" pendingLabel="Saving…" disabled={upload.busy}>
          Record the bake
        </SubmitButton>
      </div>
    </form>
  );
}
