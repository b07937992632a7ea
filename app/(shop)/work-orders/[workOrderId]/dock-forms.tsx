'use client';

import { useActionState } from 'react';
import { NumberField, SelectField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { MOVE_LABELS } from '@/lib/dock/counts';
import { countMoveAction, resendDiscrepancyAction, resendShipmentAction } from '../dock-actions';

/** Scrap, hold or release parts, each with a reason; the counts must still add up. */
export function CountMoveForm({ workOrderId, held }: { workOrderId: string; held: number }) {
  const [state, action] = useActionState(countMoveAction, initialFormState);
  const v = state.ok ? undefined : state.values;
  const kinds = (['scrap', 'hold', ...(held > 0 ? (['release', 'scrap_held'] as const) : [])] as const).map((k) => ({ value: k, label: MOVE_LABELS[k] }));
  return (
    <form action={action} className="flex flex-wrap items-end gap-3" noValidate key={state.ok ? state.message : 'form'}>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <SelectField label="Parts" name="kind" options={kinds} defaultValue={v?.kind} errors={state.fieldErrors?.kind} />
      <NumberField label="How many" name="quantity" unit="pc" className="w-32" defaultValue={v?.quantity} errors={state.fieldErrors?.quantity} />
      <TextField label="Reason" name="reason" className="min-w-56 flex-1" defaultValue={v?.reason} errors={state.fieldErrors?.reason} />
      <SubmitButton variant="secondary" pendingLabel="Saving…">
        Record
      </SubmitButton>
      <FormMessage className="w-full" tone={state.ok ? 'success' : 'error'} message={state.message} />
    </form>
  );
}

export function ResendButton({ kind, id, workOrderId, label }: { kind: 'discrepancy' | 'shipment'; id: string; workOrderId: string; label: string }) {
  const [state, action] = useActionState(kind === 'discrepancy' ? resendDiscrepancyAction : resendShipmentAction, initialFormState);
  return (
    <form action={action} className="inline-flex flex-col gap-1">
      <input type="hidden" name="id" value={id} />
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <SubmitButton variant="secondary" size="sm" pendingLabel="Sending…">
        {label}
      </SubmitButton>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
    </form>
  );
}
