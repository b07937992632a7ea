'use client';

import { useActionState } from 'react';
import { Field, SelectField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { THICKNESS_METHODS } from '@/lib/quality/methods';
import { uploadReadingsCsvAction } from './actions';

/** An instrument's export: every row is checked first, and nothing is saved unless all rows pass. */
export function CsvForm({ workOrderId }: { workOrderId: string }) {
  const [state, action] = useActionState(uploadReadingsCsvAction, initialFormState);
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="CSV file" name="file" errors={state.fieldErrors?.file} hint="Columns: part, location, method (optional below), and thickness_um or thickness_mil. Up to 5000 rows.">
          {(control) => <input type="file" accept=".csv,text/csv,text/plain" {...control} className="block w-full text-sm file:mr-3 file:rounded-md file:border file:border-surface-line file:bg-surface-muted file:px-3 file:py-2" />}
        </Field>
        <SelectField
          label="Method for rows without one"
          name="method"
          defaultValue=""
          placeholder="Each row names its method"
          options={THICKNESS_METHODS.map((m) => ({ value: m.code, label: `ASTM ${m.code} · ${m.name}` }))}
          errors={state.fieldErrors?.method}
        />
      </div>
      <div>
        <SubmitButton variant="secondary" pendingLabel="Checking every row…">
          Check and upload
        </SubmitButton>
      </div>
    </form>
  );
}
