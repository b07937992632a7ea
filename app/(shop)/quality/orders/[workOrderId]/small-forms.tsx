'use client';

import { useActionState, useState } from 'react';
import { SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { DISPOSITION_LABELS, DISPOSITIONS_LIST } from '@/lib/quality/lot-types';
import { dispositionAction, dispositionBakeAction, issueCertificateAction, openNonconformanceAction, voidReadingAction } from './actions';

export function IssueCertificateForm({ workOrderId, ready }: { workOrderId: string; ready: boolean }) {
  const [state, action] = useActionState(issueCertificateAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-2" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <div>
        <SubmitButton size="lg" pendingLabel="Rendering and signing…" variant={ready ? 'primary' : 'secondary'}>
          Sign and issue the certificate
        </SubmitButton>
      </div>
      <p className="text-xs text-ink-muted">Issuing signs it in your name. Once issued it cannot be changed, and the customer can download it.</p>
    </form>
  );
}

export function BakeDispositionForm({ workOrderId, bakeId }: { workOrderId: string; bakeId: string }) {
  const [state, action] = useActionState(dispositionBakeAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-2" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="bakeId" value={bakeId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextareaField
        label="Supervisor's disposition: why this bake is accepted"
        name="reason"
        rows={2}
        hint="For example the customer's written concession and its reference. To bake again instead, record the new bake."
        defaultValue={state.values?.reason}
        errors={state.fieldErrors?.reason}
        required
      />
      <div>
        <SubmitButton variant="danger" pendingLabel="Recording…">
          Accept with this disposition
        </SubmitButton>
      </div>
    </form>
  );
}

export function OpenNonconformanceForm({ workOrderId }: { workOrderId: string }) {
  const [state, action] = useActionState(openNonconformanceAction, initialFormState);
  return (
    <form action={action} className="grid gap-3 sm:grid-cols-[12rem_1fr]" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <FormMessage className="sm:col-span-2" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField
        label="What failed"
        name="source"
        defaultValue={state.values?.source ?? 'other'}
        options={[
          { value: 'thickness', label: 'Thickness' },
          { value: 'bake', label: 'Relief bake' },
          { value: 'other', label: 'Something else' },
        ]}
        errors={state.fieldErrors?.source}
      />
      <TextField label="What does not conform" name="description" defaultValue={state.ok ? '' : state.values?.description} errors={state.fieldErrors?.description} required />
      <div className="sm:col-span-2">
        <SubmitButton variant="secondary" pendingLabel="Opening…">
          Open a nonconformance
        </SubmitButton>
      </div>
    </form>
  );
}

export function DispositionForm({ workOrderId, nonconformanceId }: { workOrderId: string; nonconformanceId: string }) {
  const [state, action] = useActionState(dispositionAction, initialFormState);
  const [choice, setChoice] = useState(state.values?.disposition ?? '');
  return (
    <form action={action} className="grid gap-3 sm:grid-cols-2" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="nonconformanceId" value={nonconformanceId} />
      <FormMessage className="sm:col-span-2" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField
        label="Disposition"
        name="disposition"
        value={choice}
        onChange={(e) => setChoice(e.target.value)}
        placeholder="Choose…"
        options={DISPOSITIONS_LIST.map((d) => ({ value: d, label: DISPOSITION_LABELS[d] }))}
        errors={state.fieldErrors?.disposition}
        required
      />
      <TextField
        label="Customer's approval reference"
        name="customerApprovalRef"
        hint={choice === 'use_as_is' ? 'Required for use as is.' : 'Only for use as is.'}
        defaultValue={state.values?.customerApprovalRef}
        errors={state.fieldErrors?.customerApprovalRef}
        required={choice === 'use_as_is'}
      />
      <TextField className="sm:col-span-2" label="Note (optional)" name="note" defaultValue={state.values?.note} errors={state.fieldErrors?.note} />
      {choice === 'rework' || choice === 'strip_and_replate' ? (
        <p className="text-sm text-ink-muted sm:col-span-2">The lot's present thickness readings will be voided (kept on record) so that it is measured again.</p>
      ) : null}
      <div className="sm:col-span-2">
        <SubmitButton pendingLabel="Closing…">Disposition and close</SubmitButton>
      </div>
    </form>
  );
}

export function VoidReadingForm({ workOrderId, readingId }: { workOrderId: string; readingId: string }) {
  const [state, action] = useActionState(voidReadingAction, initialFormState);
  return (
    <form action={action} className="flex flex-wrap items-center gap-2" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="readingId" value={readingId} />
      <input name="reason" aria-label="Why the reading is void" placeholder="Why void?" className="min-h-8 w-36 rounded-md border border-surface-line px-2 text-sm" />
      <SubmitButton size="sm" variant="ghost">
        Void
      </SubmitButton>
      {state.message ? <span className={state.ok ? 'text-xs text-ok' : 'text-xs text-out'}>{state.fieldErrors?.reason?.[0] ?? state.message}</span> : null}
    </form>
  );
}
