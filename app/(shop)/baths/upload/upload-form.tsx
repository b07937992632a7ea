'use client';

import { useActionState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { initialFormState } from '@/lib/action-state';
import { uploadLabCsvAction } from './actions';

export function UploadForm() {
  const [state, action] = useActionState(uploadLabCsvAction, initialFormState);
  const rows = Object.entries(state.fieldErrors ?? {})
    .filter(([k]) => k.startsWith('row:'))
    .flatMap(([k, messages]) => {
      const [, row, column] = k.split(':');
      return messages.map((m) => ({ row: Number(row), column: column ?? '', message: m }));
    })
    .sort((a, b) => a.row - b.row);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <div className="flex flex-col gap-1">
        <label htmlFor="lab-file" className="text-sm font-medium text-ink">CSV file from the laboratory</label>
        <input id="lab-file" name="file" type="file" accept=".csv,text/csv" className="text-sm" required />
        {state.fieldErrors?.file ? <p className="text-sm text-out">{state.fieldErrors.file[0]}</p> : null}
      </div>
      <div>
        <SubmitButton pendingLabel="Checking and saving…">Check and save</SubmitButton>
      </div>
      {rows.length > 0 ? (
        <Table caption="Problems by row and column" dense data-testid="lab-errors">
          <THead>
            <tr>
              <Th numeric>Row</Th>
              <Th>Column</Th>
              <Th>Problem</Th>
            </tr>
          </THead>
          <TBody>
            {rows.map((r, i) => (
              <Tr key={`${r.row}-${r.column}-${i}`}>
                <Td numeric>{r.row}</Td>
                <Td>{r.column}</Td>
                <Td>{r.message}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      ) : null}
    </form>
  );
}
