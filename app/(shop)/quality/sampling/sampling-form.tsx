'use client';

import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import type { SamplingRow } from '@/lib/quality/sampling';
import { saveSamplingPlanAction } from './actions';

type EditRow = { minLot: string; maxLot: string; codeLetter: string; sampleSize: string };

const toEdit = (rows: readonly SamplingRow[]): EditRow[] =>
  rows.map((r) => ({ minLot: String(r.minLot), maxLot: r.maxLot === null ? '' : String(r.maxLot), codeLetter: r.codeLetter, sampleSize: String(r.sampleSize) }));

const cell = 'min-h-10 w-full rounded-md border border-surface-line bg-surface px-2 text-sm tabular';

/** The supervisor's table: lot size range → sample size. Saved as a new plan, never edited in place. */
export function SamplingForm({ rows, name, source, published }: { rows: SamplingRow[]; name: string; source: string; published: SamplingRow[] }) {
  const [state, action] = useActionState(saveSamplingPlanAction, initialFormState);
  const [edit, setEdit] = useState<EditRow[]>(() => toEdit(rows));
  const set = (i: number, k: keyof EditRow, v: string) => setEdit((rs) => rs.map((r, j) => (j === i ? { ...r, [k]: v } : r)));
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="rows" value={JSON.stringify(edit)} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      {state.fieldErrors?.rows ? (
        <ul className="list-disc pl-5 text-sm text-out" aria-live="polite">
          {state.fieldErrors.rows.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Plan name" name="name" defaultValue={state.values?.name ?? name} errors={state.fieldErrors?.name} required />
        <TextField label="Source" name="source" hint="Name the published plan or the customer requirement it follows." defaultValue={state.values?.source ?? source} errors={state.fieldErrors?.source} />
      </div>
      <table className="w-full max-w-2xl text-sm">
        <caption className="sr-only">Sampling rows</caption>
        <thead className="text-left text-ink-muted">
          <tr>
            <th className="py-1 pr-2 font-medium">Lot from</th>
            <th className="py-1 pr-2 font-medium">Lot to (blank: and over)</th>
            <th className="py-1 pr-2 font-medium">Code letter</th>
            <th className="py-1 pr-2 font-medium">Sample size</th>
            <th className="py-1 font-medium"><span className="sr-only">Remove</span></th>
          </tr>
        </thead>
        <tbody>
          {edit.map((r, i) => (
            <tr key={i}>
              {(['minLot', 'maxLot', 'codeLetter', 'sampleSize'] as const).map((k) => (
                <td key={k} className="py-0.5 pr-2">
                  <input aria-label={`${k} row ${i + 1}`} className={cell} value={r[k]} onChange={(e) => set(i, k, e.target.value)} inputMode={k === 'codeLetter' ? 'text' : 'numeric'} />
                </td>
              ))}
              <td>
                <Button size="sm" variant="ghost" onClick={() => setEdit((rs) => rs.filter((_, j) => j !== i))} aria-label={`Remove row ${i + 1}`}>
                  Remove
                </Button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex flex-wrap gap-2">
        <SubmitButton pendingLabel="Saving…">Save as the new plan</SubmitButton>
        <Button variant="secondary" onClick={() => setEdit((rs) => [...rs, { minLot: '', maxLot: '', codeLetter: '', sampleSize: '' }])}>
          Add a row
        </Button>
        <Button variant="ghost" onClick={() => setEdit(toEdit(published))}>
          Fill in ANSI/ASQ Z1.4 level II
        </Button>
      </div>
    </form>
  );
}
