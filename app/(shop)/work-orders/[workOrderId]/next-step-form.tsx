'use client';

import { useActionState } from 'react';
import type { WorkOrderState } from '@/db/types';
import { LinkButton } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { advanceAction } from '../actions';

const VERBS: Record<WorkOrderState, string> = {
  accepted: 'Reopen',
  received: 'Mark received',
  in_process: 'Start processing',
  plated: 'Mark plated',
  baked: 'Mark baked',
  inspected: 'Mark inspected',
  shipped: 'Ship',
  invoiced: 'Mark invoiced',
};

type Props = { workOrderId: string; next: WorkOrderState | null };

/** The one next step with the input it needs; refusals come back with their reason. */
export function NextStepForm({ workOrderId, next }: Props) {
  const [state, action] = useActionState(advanceAction, initialFormState);
  if (!next) return <p className="text-sm text-ink-muted">This order has taken its last step.</p>;
  // Parts come in on a receipt and leave on a shipment: both steps happen at the dock.
  if (next === 'received' || next === 'shipped') {
    return (
      <div className="flex flex-col gap-2 text-sm">
        <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
        <p>{next === 'received' ? 'Next: receive the parts at the dock, with their count, containers and lot.' : 'Next: ship the parts, in one shipment or several, each with its packing slip.'}</p>
        <div>
          <LinkButton href={`/work-orders/${workOrderId}/${next === 'received' ? 'receive' : 'ship'}`} size="lg">
            {next === 'received' ? 'Receive parts' : 'Ship parts'}
          </LinkButton>
        </div>
      </div>
    );
  }
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="to" value={next} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextField label="Note (optional)" name="note" defaultValue={state.ok ? '' : state.values?.note} errors={state.fieldErrors?.note} />
      <div>
        <SubmitButton size="lg" pendingLabel="Saving…">
          {VERBS[next]}
        </SubmitButton>
      </div>
    </form>
  );
}

/** Any other step, for the rare case it is needed: the state machine still checks every rule. */
export function OtherStepForm({ workOrderId, options }: { workOrderId: string; options: { value: WorkOrderState; label: string }[] }) {
  const [state, action] = useActionState(advanceAction, initialFormState);
  return (
    <form action={action} className="flex flex-wrap items-end gap-3" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <FormMessage className="w-full" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField label="Move to" name="to" options={options} defaultValue={state.values?.to} errors={state.fieldErrors?.to} />
      <SubmitButton variant="secondary" pendingLabel="Checking…">
        Try this step
      </SubmitButton>
    </form>
  );
}
