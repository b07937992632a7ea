// Parses and checks the grid's query string (see components/data-grid/grid-query.ts):
//   offset, limit, sort=colId:asc|desc, filter=<ag-grid filter model JSON>, q, format=csv.
// Pure: no database, so the rules can be tested on their own. Every refusal is AppError('BAD_INPUT').
import { z } from 'zod';
import { AppError } from '@/lib/errors';

export type GridColumnType = 'text' | 'number' | 'date';

/**
 * Counting stops here: beyond it a grid answer's `total` is GRID_COUNT_CAP + 1 and the grid reads
 * "More than 1,000 rows". Counting a busy shop's ten years through a list's joins costs more than
 * the page itself, and past a thousand rows no one reads on by scrolling: they filter or search
 * (and the grid's scroll bar grows as the pages come). Paging by key never needs the count.
 */
export const GRID_COUNT_CAP = 1_000;
export const GRID_MAX_LIMIT = 500;
export const GRID_DEFAULT_LIMIT = 100;
const MAX_OFFSET = 100_000_000;
const MAX_FILTER_CHARS = 10_000;
const MAX_Q_CHARS = 200;
const MAX_CONDITIONS = 4;

const TEXT_OPS = ['equals', 'notEqual', 'contains', 'notContains', 'startsWith', 'endsWith', 'blank', 'notBlank'] as const;
const SCALAR_OPS = ['equals', 'notEqual', 'lessThan', 'lessThanOrEqual', 'greaterThan', 'greaterThanOrEqual', 'inRange', 'blank', 'notBlank'] as const;

export type TextOp = (typeof TEXT_OPS)[number];
export type ScalarOp = (typeof SCALAR_OPS)[number];

export type TextCondition = { kind: 'text'; op: TextOp; value: string };
export type NumberCondition = { kind: 'number'; op: ScalarOp; value: number | null; to: number | null };
/** Dates are calendar days 'YYYY-MM-DD'; a day covers [day, day + 1). */
export type DateCondition = { kind: 'date'; op: ScalarOp; value: string | null; to: string | null };
export type GridCondition = TextCondition | NumberCondition | DateCondition;
export type ColumnFilter = { colId: string; join: 'AND' | 'OR'; conditions: GridCondition[] };

export type GridQuery = {
  offset: number;
  /**
   * Where the page starts by key: the `next` cursor of the page before it (opaque to the client).
   * When set, `offset` is only the grid's row number and the database seeks instead of counting
   * its way down, so a deep page costs what the first one does.
   */
  after: GridCursor | null;
  limit: number;
  sort: { colId: string; dir: 'asc' | 'desc' } | null;
  filters: ColumnFilter[];
  /** Words of the quick search; each must match some searchable column. */
  words: string[];
  format: 'json' | 'csv';
};

/** The last row of a page: its sort column and direction, that column's value as text (null when empty) and the unique key as text. */
export type GridCursor = { colId: string | null; dir: 'asc' | 'desc'; value: string | null; key: string };

const MAX_CURSOR_CHARS = 2_000;
const cursorSchema = z.object({
  c: z.string().max(64).nullable(),
  d: z.enum(['asc', 'desc']),
  v: z.string().max(1_000).nullable(),
  k: z.string().min(1).max(200),
});

export function encodeCursor(c: GridCursor): string {
  return Buffer.from(JSON.stringify({ c: c.colId, d: c.dir, v: c.value, k: c.key }), 'utf8').toString('base64url');
}

function parseCursor(text: string | null, sort: GridQuery['sort']): GridCursor | null {
  if (text === null || text === '') return null;
  if (text.length > MAX_CURSOR_CHARS || !/^[A-Za-z0-9_-]+$/.test(text)) bad('after is not a page cursor this list gave out.');
  let raw: unknown;
  try {
    raw = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch {
    bad('after is not a page cursor this list gave out.');
  }
  const r = cursorSchema.safeParse(raw);
  if (!r.success) bad('after is not a page cursor this list gave out.');
  // A cursor only means something in the order it was made in; the default order is checked by the server.
  if (sort && (r.data.c !== sort.colId || r.data.d !== sort.dir)) bad('after belongs to another sort order; ask for the page by offset.');
  return { colId: r.data.c, dir: r.data.d, value: r.data.v, key: r.data.k };
}

/** What the parser needs to know of each column: its type, and whether it may be sorted. */
export type GridColumnInfo = { type: GridColumnType; sortable?: boolean };

function bad(message: string): never {
  throw new AppError('BAD_INPUT', message);
}

const wholeNumber = (name: string, max: number) =>
  z
    .string()
    .regex(/^\d{1,10}$/, `${name} must be a whole number ≥ 0.`)
    .transform(Number)
    .refine((n) => n <= max, `${name} must be at most ${max}.`);

const pageSchema = z.object({
  offset: wholeNumber('offset', MAX_OFFSET).default(0),
  // Larger requests are cut to the cap rather than refused: the grid copes with a shorter block.
  limit: wholeNumber('limit', Number.MAX_SAFE_INTEGER)
    .refine((n) => n >= 1, 'limit must be at least 1.')
    .transform((n) => Math.min(n, GRID_MAX_LIMIT))
    .default(GRID_DEFAULT_LIMIT),
  format: z.enum(['json', 'csv'], { message: 'format must be csv (or left out for JSON).' }).default('json'),
  q: z.string().max(MAX_Q_CHARS, `The search text must be at most ${MAX_Q_CHARS} characters.`).default(''),
});

const finite = z.number().refine(Number.isFinite, 'must be a finite number');
// ag-grid sends 'YYYY-MM-DD hh:mm:ss', 'YYYY-MM-DDThh:mm:ss' or 'YYYY-MM-DD'; only the day is used.
const day = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}([ T]\d{2}:\d{2}(:\d{2})?)?$/, 'must be a date YYYY-MM-DD')
  .transform((s) => s.slice(0, 10))
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'is not a real calendar date');

const textModel = z.object({
  filterType: z.literal('text').optional(),
  type: z.enum(TEXT_OPS),
  filter: z.union([z.string().max(MAX_Q_CHARS), z.number()]).nullish(),
});
const numberModel = z.object({
  filterType: z.literal('number').optional(),
  type: z.enum(SCALAR_OPS),
  filter: finite.nullish(),
  filterTo: finite.nullish(),
});
const dateModel = z.object({
  filterType: z.literal('date').optional(),
  type: z.enum(SCALAR_OPS),
  dateFrom: day.nullish(),
  dateTo: day.nullish(),
});

const NEEDS_NO_VALUE = new Set(['blank', 'notBlank']);

function condition(colId: string, type: GridColumnType, raw: unknown): GridCondition {
  const where = `Filter on "${colId}"`;
  if (type === 'text') {
    const r = textModel.safeParse(raw);
    if (!r.success) bad(`${where}: not a valid text filter (${r.error.issues[0]?.message}).`);
    const value = r.data.filter == null ? '' : String(r.data.filter);
    if (!NEEDS_NO_VALUE.has(r.data.type) && value === '') bad(`${where}: the text to compare with is missing.`);
    return { kind: 'text', op: r.data.type, value };
  }
  if (type === 'number') {
    const r = numberModel.safeParse(raw);
    if (!r.success) bad(`${where}: not a valid number filter (${r.error.issues[0]?.message}).`);
    const { type: op, filter, filterTo } = r.data;
    if (!NEEDS_NO_VALUE.has(op) && filter == null) bad(`${where}: the number to compare with is missing.`);
    if (op === 'inRange' && filterTo == null) bad(`${where}: the upper end of the range is missing.`);
    return { kind: 'number', op, value: filter ?? null, to: op === 'inRange' ? (filterTo ?? null) : null };
  }
  const r = dateModel.safeParse(raw);
  if (!r.success) bad(`${where}: not a valid date filter (${r.error.issues[0]?.message}).`);
  const { type: op, dateFrom, dateTo } = r.data;
  if (!NEEDS_NO_VALUE.has(op) && dateFrom == null) bad(`${where}: the date to compare with is missing.`);
  if (op === 'inRange' && dateTo == null) bad(`${where}: the end date of the range is missing.`);
  return { kind: 'date', op, value: dateFrom ?? null, to: op === 'inRange' ? (dateTo ?? null) : null };
}

function columnFilter(colId: string, type: GridColumnType, raw: unknown): ColumnFilter {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) bad(`Filter on "${colId}" must be an object.`);
  const model = raw as Record<string, unknown>;
  if (model.filterType !== undefined && model.filterType !== type) {
    bad(`Filter on "${colId}": this column holds ${type} values, not ${String(model.filterType)}.`);
  }
  if ('conditions' in model) {
    const join = model.operator;
    if (join !== 'AND' && join !== 'OR') bad(`Filter on "${colId}": operator must be AND or OR.`);
    if (!Array.isArray(model.conditions) || model.conditions.length === 0 || model.conditions.length > MAX_CONDITIONS) {
      bad(`Filter on "${colId}": conditions must be a list of 1 to ${MAX_CONDITIONS} conditions.`);
    }
    return { colId, join, conditions: model.conditions.map((c) => condition(colId, type, c)) };
  }
  return { colId, join: 'AND', conditions: [condition(colId, type, model)] };
}

function parseFilter(text: string | null, columns: Record<string, GridColumnInfo>): ColumnFilter[] {
  if (text === null || text.trim() === '') return [];
  if (text.length > MAX_FILTER_CHARS) bad('The filter is too long.');
  let model: unknown;
  try {
    model = JSON.parse(text);
  } catch {
    bad('The filter is not valid JSON.');
  }
  if (model === null) return [];
  if (typeof model !== 'object' || Array.isArray(model)) bad('The filter must be a JSON object keyed by column.');
  return Object.entries(model as Record<string, unknown>).map(([colId, raw]) => {
    const col = Object.hasOwn(columns, colId) ? columns[colId] : undefined;
    if (!col) bad(`Unknown filter column "${colId}".`);
    return columnFilter(colId, col.type, raw);
  });
}

function parseSort(text: string | null, columns: Record<string, GridColumnInfo>): GridQuery['sort'] {
  if (text === null || text === '') return null;
  const m = /^([A-Za-z0-9_.]{1,64}):(asc|desc)$/.exec(text);
  if (!m) bad('sort must look like column:asc or column:desc.');
  const colId = m[1] as string;
  const dir = m[2] as 'asc' | 'desc';
  const col = Object.hasOwn(columns, colId) ? columns[colId] : undefined;
  if (!col) bad(`Unknown sort column "${colId}".`);
  if (col.sortable === false) bad(`The list cannot be sorted by "${colId}".`);
  return { colId, dir };
}

export function parseGridQuery(params: URLSearchParams, columns: Record<string, GridColumnInfo>): GridQuery {
  const get = (k: string) => params.get(k) ?? undefined;
  const page = pageSchema.safeParse({ offset: get('offset'), limit: get('limit'), format: get('format'), q: get('q') });
  if (!page.success) bad(page.error.issues[0]?.message ?? 'The list request is not valid.');
  const words = page.data.q.trim().split(/\s+/).filter(Boolean).slice(0, 8);
  const sort = parseSort(params.get('sort'), columns);
  return {
    offset: page.data.offset,
    after: parseCursor(params.get('after'), sort),
    limit: page.data.limit,
    format: page.data.format,
    sort,
    filters: parseFilter(params.get('filter'), columns),
    words,
  };
}
