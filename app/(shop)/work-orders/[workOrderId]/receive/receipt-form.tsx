'use client';

import { useActionState, useState } from 'react';
import { NumberField, SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { DISCREPANCIES, DISCREPANCY_LABELS } from '@/lib/dock/schemas';
import { uploadFile, type UploadedFile } from '@/lib/files/upload-client';
import { receiveAction } from '../../dock-actions';

/** The dock's count for one delivery: large fields for a tablet, photos taken on the spot. */
export function ReceiptForm({ workOrderId, expected }: { workOrderId: string; expected: number }) {
  const [state, action] = useActionState(receiveAction, initialFormState);
  const [photos, setPhotos] = useState<UploadedFile[]>([]);
  const [uploadError, setUploadError] = useState<string | null>(null);
  const [uploading, setUploading] = useState(false);
  const [discrepancy, setDiscrepancy] = useState(state.values?.discrepancy ?? 'none');
  const v = state.ok ? undefined : state.values;

  async function addPhotos(files: FileList | null) {
    if (!files?.length) return;
    setUploadError(null);
    setUploading(true);
    try {
      for (const f of Array.from(files)) {
        const up = await uploadFile(f, 'receipt-photo');
        setPhotos((p) => [...p, up]);
      }
    } catch (e) {
      setUploadError(e instanceof Error ? e.message : 'The photo could not be uploaded.');
    } finally {
      setUploading(false);
    }
  }

  return (
    <form action={action} className="flex flex-col gap-4" noValidate key={state.ok ? state.message : 'form'}>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="photoIds" value={state.ok ? '' : photos.map((p) => p.id).join(',')} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <div className="grid gap-4 sm:grid-cols-3">
        <NumberField label="Parts counted" name="quantity" unit="pc" size="lg" defaultValue={v?.quantity ?? String(expected)} errors={state.fieldErrors?.quantity} required />
        <NumberField label="Containers" name="containers" size="lg" defaultValue={v?.containers ?? '1'} errors={state.fieldErrors?.containers} required hint="One label prints for each." />
        <NumberField label="Gross weight" name="weightKg" unit="kg" size="lg" step="any" defaultValue={v?.weightKg} errors={state.fieldErrors?.weightKg} />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Customer's part number" name="customerPartNumber" defaultValue={v?.customerPartNumber} errors={state.fieldErrors?.customerPartNumber} />
        <TextField label="Customer's lot" name="customerLot" defaultValue={v?.customerLot} errors={state.fieldErrors?.customerLot} />
      </div>
      <TextareaField label="Condition" name="conditionNote" rows={2} hint="Packaging, rust, oil, anything worth a line." defaultValue={v?.conditionNote} errors={state.fieldErrors?.conditionNote} />
      <SelectField
        label="Discrepancy"
        name="discrepancy"
        value={discrepancy}
        onChange={(e) => setDiscrepancy(e.target.value)}
        options={DISCREPANCIES.map((d) => ({ value: d, label: DISCREPANCY_LABELS[d] }))}
        errors={state.fieldErrors?.discrepancy}
      />
      {discrepancy !== 'none' ? (
        <TextareaField
          label="What is wrong"
          name="discrepancyNote"
          rows={3}
          required
          hint="The customer is e-mailed this text with the counts."
          defaultValue={v?.discrepancyNote}
          errors={state.fieldErrors?.discrepancyNote}
        />
      ) : null}
      <div className="flex flex-col gap-2">
        <label className="text-sm font-medium" htmlFor="receipt-photos">
          Photos
        </label>
        <input id="receipt-photos" type="file" accept="image/png,image/jpeg,image/gif,image/webp" capture="environment" multiple onChange={(e) => void addPhotos(e.target.files)} className="text-sm" />
        <p className="text-xs text-ink-muted">PNG, JPEG, GIF or WebP, up to 25 MB each; checked by content.{uploading ? ' Uploading…' : ''}</p>
        {photos.length ? <p className="text-sm">{photos.map((p) => p.name).join(', ')}</p> : null}
        {uploadError ? <p className="text-sm text-out">{uploadError}</p> : null}
        {state.fieldErrors?.photoIds ? <p className="text-sm text-out">{state.fieldErrors.photoIds.join(' ')}</p> : null}
      </div>
      <div>
        <SubmitButton size="lg" pendingLabel="Saving…" disabled={uploading}>
          Save receipt
        </SubmitButton>
      </div>
    </form>
  );
}
