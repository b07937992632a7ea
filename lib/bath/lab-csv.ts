// Results from an outside laboratory as CSV: tank_code, analyte_key, value, unit, taken_at.
// Pure: every row is checked against the shop's tanks and analytes first, and the errors are
// listed by row and column; the caller writes nothing unless the list is empty.
import Papa from 'papaparse';
import { canConvert, convertSymbol } from './display';

export const LAB_COLUMNS = ['tank_code', 'analyte_key', 'value', 'unit', 'taken_at'] as const;
export type LabColumn = (typeof LAB_COLUMNS)[number];

export type LabRowError = { row: number; column: LabColumn | 'file'; message: string };

export type LabContext = {
  /** Tanks by code, each with its analytes by key. */
  tanks: ReadonlyMap<string, { id: string; analytes: ReadonlyMap<string, { id: string; unit: string; name: string }> }>;
  now: Date;
};

export type LabRow = { row: number; tankId: string; analyteId: string; value: number; takenAt: Date };

export type LabCheck = { ok: true; rows: LabRow[] } | { ok: false; errors: LabRowError[] };

export const LAB_MAX_ROWS = 5000;
const EARLIEST = Date.UTC(2000, 0, 1);

const normalise = (h: string) => h.trim().toLowerCase().replace(/[\s-]+/g, '_');

function parseTime(s: string): Date | null {
  const t = s.trim();
  // "2026-11-30", "2026-11-30 07:45", or full ISO with a zone; a time without a zone is UTC.
  const m = /^(\d{4}-\d{2}-\d{2})(?:[ T](\d{2}:\d{2}(?::\d{2})?))?$/.exec(t);
  const d = m ? new Date(`${m[1]}T${m[2] ?? '00:00'}Z`) : /^\d{4}-\d{2}-\d{2}T.+(Z|[+-]\d{2}:?\d{2})$/.test(t) ? new Date(t) : null;
  return d && !Number.isNaN(d.getTime()) ? d : null;
}

export function checkLabCsv(text: string, context: LabContext): LabCheck {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy', transformHeader: normalise });
  const errors: LabRowError[] = [];
  const headers = parsed.meta.fields ?? [];
  const missing = LAB_COLUMNS.filter((c) => !headers.includes(c));
  if (missing.length > 0) {
    return { ok: false, errors: [{ row: 1, column: 'file', message: `The header row must name these columns: ${LAB_COLUMNS.join(', ')}. Missing: ${missing.join(', ')}.` }] };
  }
  if (parsed.data.length === 0) return { ok: false, errors: [{ row: 1, column: 'file', message: 'The file has a header but no results.' }] };
  if (parsed.data.length > LAB_MAX_ROWS) {
    return { ok: false, errors: [{ row: 1, column: 'file', message: `At most ${LAB_MAX_ROWS} results per file; this one has ${parsed.data.length}.` }] };
  }
  for (const e of parsed.errors) {
    if (e.row !== undefined) errors.push({ row: e.row + 2, column: 'file', message: `This line could not be read (${e.message}).` });
  }
  const rows: LabRow[] = [];
  const seen = new Map<string, number>();
  parsed.data.forEach((raw, i) => {
    const row = i + 2; // line 1 is the header
    const err = (column: LabColumn, message: string) => errors.push({ row, column, message });
    const code = (raw.tank_code ?? '').trim().toUpperCase();
    const key = (raw.analyte_key ?? '').trim();
    const tank = context.tanks.get(code);
    if (!code) err('tank_code', 'The tank code is empty.');
    else if (!tank) err('tank_code', `No tank "${code}".`);
    const analyte = tank?.analytes.get(key);
    if (tank && !key) err('analyte_key', 'The analyte key is empty.');
    else if (tank && !analyte) err('analyte_key', `Tank ${code} has no analyte "${key}".`);
    const valueText = (raw.value ?? '').trim();
    const value = /^-?\d+(\.\d+)?$/.test(valueText) ? Number(valueText) : NaN;
    if (!Number.isFinite(value)) err('value', valueText ? `"${valueText}" is not a number (use a point for decimals).` : 'The value is empty.');
    const unit = (raw.unit ?? '').trim();
    if (analyte && !canConvert(unit, analyte.unit)) {
      err('unit', unit ? `${analyte.name} is kept in ${analyte.unit}; "${unit}" cannot be converted to it.` : `Give the unit (${analyte.unit}).`);
    }
    const takenAt = parseTime(raw.taken_at ?? '');
    if (!takenAt) err('taken_at', 'Give the date and time as YYYY-MM-DD HH:MM (UTC) or ISO 8601 with a zone.');
    else if (takenAt.getTime() > context.now.getTime()) err('taken_at', 'The time is in the future.');
    else if (takenAt.getTime() < EARLIEST) err('taken_at', 'The time is before the year 2000.');
    if (tank && analyte && takenAt && Number.isFinite(value) && canConvert(unit, analyte.unit)) {
      const dupKey = `${analyte.id}|${takenAt.getTime()}`;
      const first = seen.get(dupKey);
      if (first !== undefined) err('taken_at', `The same analyte at the same time is already on row ${first}.`);
      else {
        seen.set(dupKey, row);
        try {
          rows.push({ row, tankId: tank.id, analyteId: analyte.id, value: convertSymbol(value, unit, analyte.unit), takenAt });
        } catch (e) {
          err('value', e instanceof Error ? e.message : 'The value could not be converted.');
        }
      }
    }
  });
  if (errors.length > 0) return { ok: false, errors: errors.sort((a, b) => a.row - b.row) };
  return { ok: true, rows: rows.sort((a, b) => a.takenAt.getTime() - b.takenAt.getTime()) };
}
