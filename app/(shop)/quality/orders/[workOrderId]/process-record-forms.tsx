'use client';

import { useActionState } from 'react';
import { NumberField, SelectField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { VERIFICATION_TESTS } from '@/lib/families/passivation';
import { PHOSPHORUS_METHODS, SEAL_METHODS } from '@/lib/quality/process/rules';
import { recordProcessRecordAction, voidProcessRecordAction } from './actions';

export type RecordKindForForm = 'seal_test' | 'phosphorus_content' | 'passivation_test' | 'salt_spray';

const PASS_FAIL = [
  { value: 'pass', label: 'Passed' },
  { value: 'fail', label: 'Failed' },
];

/** One family record: the result and the limit the customer's specification sets, judged on save. */
export function ProcessRecordForm({
  workOrderId,
  kind,
  phosphorusRange,
  saltSprayHours,
}: {
  workOrderId: string;
  kind: RecordKindForForm;
  phosphorusRange: { min: number; max: number } | null;
  saltSprayHours: number | null;
}) {
  const [state, action] = useActionState(recordProcessRecordAction, initialFormState);
  const v = (k: string, d = '') => (state.ok ? d : (state.values?.[k] ?? d));
  const e = (k: string) => state.fieldErrors?.[k];
  return (
    <form action={action} className="grid gap-3 border-t border-surface-line pt-3 sm:grid-cols-3" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="kind" value={kind} />
      <FormMessage className="sm:col-span-3" tone={state.ok ? 'success' : 'error'} message={state.message} />
      {kind === 'seal_test' ? (
        <>
          <SelectField label="Test" name="method" defaultValue={v('method', 'dye_spot')} options={Object.entries(SEAL_METHODS).map(([value, m]) => ({ value, label: `${m.label} (${m.unit})` }))} errors={e('method')} />
          <NumberField label="Result" name="result" defaultValue={v('result')} errors={e('result')} required />
          <NumberField label="Limit in the specification" name="limit" defaultValue={v('limit')} errors={e('limit')} hint="At most this passes." required />
        </>
      ) : kind === 'phosphorus_content' ? (
        <>
          <SelectField label="Measured by" name="method" defaultValue={v('method', 'xrf')} options={Object.entries(PHOSPHORUS_METHODS).map(([value, label]) => ({ value, label }))} errors={e('method')} />
          <NumberField label="Phosphorus" name="phosphorusWtPct" unit="%" defaultValue={v('phosphorusWtPct')} errors={e('phosphorusWtPct')} required />
          <div className="grid grid-cols-2 gap-2">
            <NumberField label="Lowest allowed" name="minPct" unit="%" defaultValue={v('minPct', phosphorusRange ? String(phosphorusRange.min) : '')} errors={e('minPct')} required />
            <NumberField label="Highest allowed" name="maxPct" unit="%" defaultValue={v('maxPct', phosphorusRange ? String(phosphorusRange.max) : '')} errors={e('maxPct')} required />
          </div>
        </>
      ) : kind === 'passivation_test' ? (
        <>
          <SelectField label="Test (ASTM A967)" name="method" defaultValue={v('method', 'water_immersion')} options={VERIFICATION_TESTS.map((t) => ({ value: t.id, label: t.label }))} errors={e('method')} />
          <SelectField label="Result" name="passed" defaultValue={v('passed', 'pass')} options={PASS_FAIL} errors={e('passed')} />
        </>
      ) : (
        <>
          <NumberField label="Hours in the cabinet" name="hours" unit="h" defaultValue={v('hours')} errors={e('hours')} required />
          <NumberField label="Hours asked" name="requiredHours" unit="h" defaultValue={v('requiredHours', saltSprayHours ? String(saltSprayHours) : '')} errors={e('requiredHours')} required />
          <SelectField label="White corrosion" name="passed" defaultValue={v('passed', 'pass')} options={[{ value: 'pass', label: 'None by then' }, { value: 'fail', label: 'Appeared' }]} errors={e('passed')} />
        </>
      )}
      <TextField className="sm:col-span-2" label="Notes" name="notes" defaultValue={v('notes')} errors={e('notes')} />
      <div className="self-end">
        <SubmitButton variant="secondary" pendingLabel="Saving…">
          Record
        </SubmitButton>
      </div>
    </form>
  );
}

export function VoidProcessRecordForm({ workOrderId, recordId }: { workOrderId: string; recordId: string }) {
  const [state, action] = useActionState(voidProcessRecordAction, initialFormState);
  return (
    <form action={action} className="flex flex-wrap items-center gap-2" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="recordId" value={recordId} />
      <input name="reason" aria-label="Why the record is void" placeholder="Why void?" className="min-h-8 w-36 rounded-md border border-surface-line px-2 text-sm" />
      <SubmitButton size="sm" variant="ghost">
        Void
      </SubmitButton>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
    </form>
  );
}
