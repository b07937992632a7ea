'use client';

import { useActionState, useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { StatusShape } from '@/components/ui/status-shape';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { THICKNESS_METHODS } from '@/lib/quality/methods';
import { recordReadingsAction } from './actions';

type Row = { partNo: string; location: string; thickness: string };

const MAX_ROWS = 200;
const inputClass = 'min-h-target w-full rounded-md border border-surface-line bg-surface px-2 text-lg tabular';

/**
 * Hand entry at the bench: one row per sampled part, already numbered, big enough for gloves.
 * The rows travel as one JSON field; the server checks each and answers per row.
 */
export function ReadingsForm(props: { workOrderId: string; firstPartNo: number; rows: number; unit: string; minimumText: string; defaultMethod: string }) {
  const [state, action] = useActionState(recordReadingsAction, initialFormState);
  const [rows, setRows] = useState<Row[]>(() =>
    Array.from({ length: Math.max(1, Math.min(props.rows, MAX_ROWS)) }, (_, i) => ({ partNo: String(props.firstPartNo + i), location: 'significant surface', thickness: '' })),
  );
  const [method, setMethod] = useState(props.defaultMethod);
  // Once a batch is saved (passing or not), clear the values and number on from the last part. A
  // refusal comes back with the submitted `values` (lib/action.ts) and keeps what was typed.
  useEffect(() => {
    if (state.message && !state.fieldErrors && !state.values) {
      setRows((rs) => {
        const next = Math.max(...rs.map((r) => Number(r.partNo) || 0)) + 1;
        return rs.map((r, i) => ({ ...r, partNo: String(next + i), thickness: '' }));
      });
    }
  }, [state]);
  const set = (i: number, key: keyof Row, value: string) => setRows((rs) => rs.map((r, j) => (j === i ? { ...r, [key]: value } : r)));
  const errorsOf = (i: number) => ['partNo', 'location', 'thickness'].flatMap((k) => state.fieldErrors?.[`rows.${i}.${k}`] ?? []);
  const filled = rows.filter((r) => r.thickness.trim() !== '');

  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="workOrderId" value={props.workOrderId} />
      <input type="hidden" name="rows" value={JSON.stringify(filled)} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField
        label="Method"
        name="method"
        value={method}
        onChange={(e) => setMethod(e.target.value)}
        options={THICKNESS_METHODS.map((m) => ({ value: m.code, label: `ASTM ${m.code} · ${m.name}` }))}
        hint={THICKNESS_METHODS.find((m) => m.code === method)?.note}
        errors={state.fieldErrors?.method}
        className="max-w-md"
      />
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Readings, one row per sampled part</caption>
          <thead className="text-left text-ink-muted">
            <tr>
              <th className="w-24 py-1 pr-2 font-medium">Part no.</th>
              <th className="py-1 pr-2 font-medium">Location on the part</th>
              <th className="w-44 py-1 pr-2 font-medium">Thickness ({props.unit})</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i} className="align-top">
                <td className="py-1 pr-2">
                  <input aria-label={`Part number, row ${i + 1}`} className={inputClass} inputMode="numeric" value={r.partNo} onChange={(e) => set(i, 'partNo', e.target.value)} />
                </td>
                <td className="py-1 pr-2">
                  <input aria-label={`Location, row ${i + 1}`} className={inputClass} value={r.location} onChange={(e) => set(i, 'location', e.target.value)} />
                </td>
                <td className="py-1 pr-2">
                  <input
                    aria-label={`Thickness in ${props.unit}, part ${r.partNo}`}
                    className={inputClass}
                    inputMode="decimal"
                    autoComplete="off"
                    value={r.thickness}
                    onChange={(e) => set(i, 'thickness', e.target.value)}
                  />
                  {errorsOf(i).length ? (
                    <p className="mt-1 flex items-start gap-1 text-sm text-out" aria-live="polite">
                      <StatusShape status="out" className="mt-0.5 size-3.5" />
                      {errorsOf(i).join(' ')}
                    </p>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-ink-muted">
        Minimum {props.minimumText} on significant surfaces. Rows left empty are not saved. {filled.length} of {rows.length} filled.
      </p>
      <div className="flex flex-wrap gap-2">
        <SubmitButton size="lg" pendingLabel="Saving…" disabled={filled.length === 0}>
          Save {filled.length || ''} readings
        </SubmitButton>
        <Button
          variant="secondary"
          size="lg"
          disabled={rows.length >= MAX_ROWS}
          onClick={() => setRows((rs) => [...rs, { partNo: String(Number(rs.at(-1)?.partNo ?? 0) + 1 || rs.length + 1), location: rs.at(-1)?.location ?? '', thickness: '' }])}
        >
          Add a row
        </Button>
      </div>
    </form>
  );
}
