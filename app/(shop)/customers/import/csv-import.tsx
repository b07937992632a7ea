'use client';

import Link from 'next/link';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';

type Problem = { row: number; column: string; message: string };
type Props = { kind: 'customers' | 'parts'; listHref: string };

/** Uploads a CSV to POST /api/imports/[kind] and lists every problem by row and column. */
export function CsvImport({ kind, listHref }: Props) {
  const [file, setFile] = useState<File | null>(null);
  const [pending, setPending] = useState(false);
  const [result, setResult] = useState<{ tone: 'error' | 'success'; message: string; problems: Problem[] } | null>(null);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    if (!file) return setResult({ tone: 'error', message: 'Choose a CSV file first.', problems: [] });
    setPending(true);
    setResult(null);
    try {
      const res = await fetch(`/api/imports/${kind}`, {
        method: 'POST',
        body: file,
        headers: { 'x-file-name': encodeURIComponent(file.name), 'content-type': file.type || 'text/csv' },
        credentials: 'same-origin',
      });
      const body = (await res.json().catch(() => null)) as { written?: number; error?: { message?: string }; problems?: Problem[] } | null;
      if (res.ok && body?.written !== undefined) setResult({ tone: 'success', message: `Imported ${body.written} ${kind}.`, problems: [] });
      else setResult({ tone: 'error', message: body?.error?.message ?? `The import failed (${res.status}).`, problems: body?.problems ?? [] });
    } catch {
      setResult({ tone: 'error', message: 'The server could not be reached. Nothing was imported.', problems: [] });
    } finally {
      setPending(false);
    }
  }

  return (
    <div className="flex flex-col gap-4">
      <form onSubmit={onSubmit} className="flex flex-wrap items-end gap-4">
        <div className="flex flex-col gap-1">
          <label htmlFor="import-file" className="text-sm font-medium">
            CSV file (UTF-8, up to 5 MB)
          </label>
          <input id="import-file" type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="text-sm" />
        </div>
        <Button type="submit" pending={pending} pendingLabel="Checking…">
          Check and import
        </Button>
      </form>
      {result ? <FormMessage tone={result.tone} message={result.message} /> : null}
      {result?.tone === 'success' ? <Link href={listHref}>Open the list →</Link> : null}
      {result?.problems.length ? (
        <Table caption={`Problems found (${result.problems.length})`} dense>
          <THead>
            <Tr>
              <Th numeric>Row</Th>
              <Th>Column</Th>
              <Th>Problem</Th>
            </Tr>
          </THead>
          <TBody>
            {result.problems.map((p, i) => (
              <Tr key={`${p.row}-${p.column}-${i}`}>
                <Td numeric>{p.row}</Td>
                <Td className="font-mono">{p.column}</Td>
                <Td>{p.message}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      ) : null}
    </div>
  );
}
