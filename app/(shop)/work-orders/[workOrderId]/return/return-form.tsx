'use client';

import { useActionState } from 'react';
import { NumberField, SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { reworkReturnAction } from '../../dock-actions';

export function ReturnForm({ workOrderId, nonconformances, left }: { workOrderId: string; nonconformances: { value: string; label: string }[]; left: number }) {
  const [state, action] = useActionState(reworkReturnAction, initialFormState);
  const v = state.ok ? undefined : state.values;
  return (
    <form action={action} className="flex flex-col gap-4" noValidate key={state.ok ? state.message : 'form'}>
      <input type="hidden" name="originalWorkOrderId" value={workOrderId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField label="Nonconformance" name="nonconformanceId" placeholder="None recorded" options={nonconformances} defaultValue={v?.nonconformanceId} errors={state.fieldErrors?.nonconformanceId} />
      <div className="grid gap-4 sm:grid-cols-3">
        <NumberField label="Parts returned" name="quantity" unit="pc" size="lg" defaultValue={v?.quantity} errors={state.fieldErrors?.quantity} required hint={`Up to ${left.toLocaleString('en-US')}.`} />
        <NumberField label="Containers" name="containers" size="lg" defaultValue={v?.containers ?? '1'} errors={state.fieldErrors?.containers} required />
        <NumberField label="Gross weight" name="weightKg" unit="kg" size="lg" step="any" defaultValue={v?.weightKg} errors={state.fieldErrors?.weightKg} />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Return or PO reference" name="poNumber" defaultValue={v?.poNumber} errors={state.fieldErrors?.poNumber} required />
        <TextField label="Customer's lot" name="customerLot" defaultValue={v?.customerLot} errors={state.fieldErrors?.customerLot} />
      </div>
      <TextareaField label="Why they came back" name="reason" rows={2} required defaultValue={v?.reason} errors={state.fieldErrors?.reason} />
      <TextareaField label="Condition" name="conditionNote" rows={2} defaultValue={v?.conditionNote} errors={state.fieldErrors?.conditionNote} />
      <div>
        <SubmitButton size="lg" pendingLabel="Saving…">
          Receive for rework
        </SubmitButton>
      </div>
    </form>
  );
}
