// Thickness readings exported by an instrument as CSV. Every row is checked before anything is
// kept: the result is either all rows, converted to µm, or the list of problems by row and column.
// Pure (papaparse only). Row numbers are the file's line numbers, the header being row 1.
import Papa from 'papaparse';
import type { ThicknessMethod } from '@/db/types/quality';
import { isUnitId, toStorage, UNITS, type UnitId } from '@/lib/plating';
import { parseMethod } from './methods';

export type CsvReading = { row: number; partNo: number; location: string; method: ThicknessMethod; thicknessUm: number };
export type CsvProblem = { row: number; column: string; message: string };
export type CsvResult = { ok: true; readings: CsvReading[] } | { ok: false; problems: CsvProblem[] };

export const MAX_CSV_ROWS = 5000;
const MAX_PROBLEMS = 50;

const norm = (h: string) => h.replace(/^\ufeff/, '').trim().toLowerCase().replace(/[\s-]+/g, '_');

const HEADERS = {
  part: ['part', 'part_no', 'part_number', 'sample', 'piece'],
  location: ['location', 'position', 'spot', 'site'],
  method: ['method', 'standard', 'test_method'],
  unit: ['unit', 'units'],
} as const;

// A thickness column may name its unit: thickness_um, thickness (mil), thickness_uin …
const THICKNESS_COLUMN = /^thickness(?:_?\(?(µm|um|micron|microns|mil|mils|uin|µin|microinch|mm)\)?)?$/;
const UNIT_WORDS: Record<string, UnitId> = {
  µm: 'um', um: 'um', micron: 'um', microns: 'um', mil: 'mil', mils: 'mil', uin: 'uin', µin: 'uin', microinch: 'uin', mm: 'mm',
};

function unitOf(word: string): UnitId | null {
  const w = word.trim().toLowerCase();
  const id = UNIT_WORDS[w] ?? (isUnitId(w) ? w : null);
  return id && UNITS[id].quantity === 'thickness' ? id : null;
}

export function parseThicknessCsv(text: string, options: { defaultMethod?: ThicknessMethod | null; defaultUnit?: UnitId } = {}): CsvResult {
  const parsed = Papa.parse<string[]>(String(text ?? ''), { skipEmptyLines: 'greedy' });
  const rows = parsed.data;
  if (rows.length === 0) return { ok: false, problems: [{ row: 1, column: '', message: 'The file is empty.' }] };
  const header = rows[0]!.map(norm);
  const find = (names: readonly string[]) => header.findIndex((h) => names.includes(h));
  const col = { part: find(HEADERS.part), location: find(HEADERS.location), method: find(HEADERS.method), unit: find(HEADERS.unit) };
  const thicknessCols = header.map((h, i) => ({ i, m: THICKNESS_COLUMN.exec(h) })).filter((x) => x.m);

  const problems: CsvProblem[] = [];
  if (col.part < 0) problems.push({ row: 1, column: 'part', message: 'A "part" column (the sampled part number) is needed.' });
  if (col.location < 0) problems.push({ row: 1, column: 'location', message: 'A "location" column (where on the part) is needed.' });
  if (col.method < 0 && !options.defaultMethod) problems.push({ row: 1, column: 'method', message: 'A "method" column is needed, or choose the method for the whole file.' });
  if (thicknessCols.length !== 1) {
    problems.push({ row: 1, column: 'thickness', message: 'Exactly one thickness column is needed, e.g. "thickness_um" or "thickness_mil".' });
  }
  if (rows.length - 1 > MAX_CSV_ROWS) problems.push({ row: 1, column: '', message: `At most ${MAX_CSV_ROWS} readings per file; this one has ${rows.length - 1}.` });
  if (rows.length === 1) problems.push({ row: 1, column: '', message: 'The file has a header but no readings.' });
  if (problems.length) return { ok: false, problems };

  const tCol = thicknessCols[0]!;
  const columnUnit = tCol.m![1] ? unitOf(tCol.m![1]) : null;
  const readings: CsvReading[] = [];
  for (let r = 1; r < rows.length && problems.length < MAX_PROBLEMS; r++) {
    const cells = rows[r]!;
    const line = r + 1;
    const cell = (i: number) => (i >= 0 ? String(cells[i] ?? '').trim() : '');
    const rowProblems: CsvProblem[] = [];
    const partText = cell(col.part);
    const partNo = Number(partText);
    if (!/^\d+$/.test(partText) || partNo < 1 || partNo > 100000) rowProblems.push({ row: line, column: 'part', message: `"${partText}" is not a part number from 1 to 100000.` });
    const location = cell(col.location);
    if (!location) rowProblems.push({ row: line, column: 'location', message: 'The location is empty.' });
    else if (location.length > 120) rowProblems.push({ row: line, column: 'location', message: 'The location is longer than 120 characters.' });
    const methodText = cell(col.method);
    const method = methodText ? parseMethod(methodText) : (options.defaultMethod ?? null);
    if (!method) rowProblems.push({ row: line, column: 'method', message: `"${methodText}" is not one of ASTM B568, B499, B244, B504, B487, B567.` });
    const unitText = cell(col.unit);
    const unit = columnUnit ?? (unitText ? unitOf(unitText) : (options.defaultUnit ?? 'um'));
    if (!unit) rowProblems.push({ row: line, column: 'unit', message: `"${unitText}" is not a thickness unit (µm, mil, µin, mm).` });
    const valueText = cell(tCol.i).replace(',', '.');
    const value = Number(valueText);
    if (!valueText || !/^[+]?\d*\.?\d+(e[+-]?\d+)?$/i.test(valueText) || !Number.isFinite(value)) {
      rowProblems.push({ row: line, column: header[tCol.i]!, message: `"${cell(tCol.i)}" is not a number.` });
    }
    // Rounded to 0.1 nm: far below any instrument's resolution, and free of binary noise (10.413999…).
    const um = unit && rowProblems.length === 0 ? Math.round(toStorage(value, unit) * 1e4) / 1e4 : NaN;
    if (rowProblems.length === 0 && !(um >= 0 && um < 5000)) {
      rowProblems.push({ row: line, column: header[tCol.i]!, message: `${cell(tCol.i)} is outside 0 to 5000 µm.` });
    }
    if (rowProblems.length) problems.push(...rowProblems);
    else readings.push({ row: line, partNo, location, method: method!, thicknessUm: um });
  }
  if (problems.length >= MAX_PROBLEMS) problems.push({ row: 0, column: '', message: `Stopped after ${MAX_PROBLEMS} problems; fix these and upload again.` });
  return problems.length ? { ok: false, problems: problems.slice(0, MAX_PROBLEMS + 1) } : { ok: true, readings };
}
