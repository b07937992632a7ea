'use client';

import { useActionState } from 'react';
import { NumberField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { shipAction } from '../../dock-actions';

export function ShipForm({ workOrderId, available }: { workOrderId: string; available: number }) {
  const [state, action] = useActionState(shipAction, initialFormState);
  const v = state.ok ? undefined : state.values;
  return (
    <form action={action} className="flex flex-col gap-4" noValidate key={state.ok ? state.message : 'form'}>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <div className="grid gap-4 sm:grid-cols-3">
        <NumberField label="Parts in this shipment" name="quantity" unit="pc" size="lg" defaultValue={v?.quantity ?? String(available)} errors={state.fieldErrors?.quantity} required hint={`${available.toLocaleString('en-US')} ready to ship.`} />
        <NumberField label="Containers" name="containers" size="lg" defaultValue={v?.containers ?? '1'} errors={state.fieldErrors?.containers} required />
        <NumberField label="Gross weight" name="weightKg" unit="kg" size="lg" step="any" defaultValue={v?.weightKg} errors={state.fieldErrors?.weightKg} />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Carrier" name="carrier" defaultValue={v?.carrier} errors={state.fieldErrors?.carrier} required hint='Or "Customer pickup".' />
        <TextField label="Tracking or pro number" name="trackingNumber" defaultValue={v?.trackingNumber} errors={state.fieldErrors?.trackingNumber} />
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="emailCustomer" defaultChecked={v ? v.emailCustomer === 'on' : true} />
        E-mail the customer the packing slip and the certificate
      </label>
      <div>
        <SubmitButton size="lg" pendingLabel="Making the packing slip…">
          Ship and print the slip
        </SubmitButton>
      </div>
    </form>
  );
}
