// Reads an import CSV and checks every row before anything is written. Pure.
// Row numbers are the spreadsheet's: the header is row 1, the first record row 2.
import Papa from 'papaparse';
import type { z } from 'zod';
import { csvLine } from '@/lib/grid/csv';

export type ImportColumn = { column: string; field: string; required: boolean; example: string; hint: string };
export type RowProblem = { row: number; column: string; message: string };
export type CsvRow = { row: number; values: Record<string, string> };

export const MAX_IMPORT_ROWS = 5000;

export function parseImportCsv(text: string, columns: readonly ImportColumn[]): { rows: CsvRow[]; problems: RowProblem[] } {
  const problems: RowProblem[] = [];
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\ufeff/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const headers = parsed.meta.fields ?? [];
  const known = new Set(columns.map((c) => c.column));
  for (const h of headers) if (!known.has(h)) problems.push({ row: 1, column: h || '(blank)', message: `Unknown column. Use the template's columns: ${columns.map((c) => c.column).join(', ')}.` });
  for (const c of columns) if (c.required && !headers.includes(c.column)) problems.push({ row: 1, column: c.column, message: 'This column is missing.' });
  for (const e of parsed.errors) {
    // Papa's row index counts records from 0 after the header.
    problems.push({ row: e.row === undefined ? 1 : e.row + 2, column: '—', message: e.code === 'TooManyFields' ? 'This row has more cells than the header.' : e.code === 'TooFewFields' ? 'This row has fewer cells than the header.' : e.message });
  }
  if (parsed.data.length === 0 && problems.length === 0) problems.push({ row: 2, column: '—', message: 'The file has a header but no rows.' });
  if (parsed.data.length > MAX_IMPORT_ROWS) problems.push({ row: MAX_IMPORT_ROWS + 2, column: '—', message: `Import at most ${MAX_IMPORT_ROWS} rows at a time.` });
  const rows = parsed.data.slice(0, MAX_IMPORT_ROWS).map((values, i) => ({ row: i + 2, values }));
  return { rows, problems };
}

/** Checks each row with `schema` (keyed by field); every issue is reported with its row and CSV column. */
export function validateRows<T>(rows: readonly CsvRow[], columns: readonly ImportColumn[], schema: z.ZodType<T>): { valid: { row: number; data: T }[]; problems: RowProblem[] } {
  const columnOf = new Map(columns.map((c) => [c.field, c.column]));
  const valid: { row: number; data: T }[] = [];
  const problems: RowProblem[] = [];
  for (const r of rows) {
    const input = Object.fromEntries(columns.map((c) => [c.field, (r.values[c.column] ?? '').trim()]));
    const result = schema.safeParse(input);
    if (result.success) valid.push({ row: r.row, data: result.data });
    else for (const issue of result.error.issues) problems.push({ row: r.row, column: columnOf.get(String(issue.path[0])) ?? '—', message: issue.message });
  }
  return { valid, problems };
}

/** Reports every repeat of a key within the file, naming the row it repeats. */
export function duplicateKeys<T>(rows: readonly { row: number; data: T }[], key: (d: T) => string, column: string, describe: (d: T) => string): RowProblem[] {
  const first = new Map<string, number>();
  const problems: RowProblem[] = [];
  for (const r of rows) {
    const k = key(r.data);
    const seen = first.get(k);
    if (seen === undefined) first.set(k, r.row);
    else problems.push({ row: r.row, column, message: `${describe(r.data)} is also on row ${seen}.` });
  }
  return problems;
}

export function sortProblems(problems: RowProblem[]): RowProblem[] {
  return [...problems].sort((a, b) => a.row - b.row || a.column.localeCompare(b.column));
}

/** The template: the header and one example row. */
export function templateCsv(columns: readonly ImportColumn[]): string {
  return csvLine(columns.map((c) => c.column)) + csvLine(columns.map((c) => c.example));
}

export type ImportOutcome = { ok: true; written: number } | { ok: false; problems: RowProblem[] };
