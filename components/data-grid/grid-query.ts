// Builds the query string the grid's JSON routes read, and checks what they send back.
// Contract: GET url?offset=&limit=&sort=field:asc|desc&filter=<json>&q=[&after=]  →  { rows, total, next }
//           (`after` is the `next` of the page before: the server then seeks by key, not by offset)
//           GET url?format=csv&sort=&filter=&q=                         →  text/csv
import { GRID_COUNT_CAP } from '@/lib/grid/query';

export type GridSortItem = { colId: string; sort: 'asc' | 'desc' };

export type GridView = {
  /** The grid's sort model; only the first entry is sent (the grid allows one sort column). */
  sort?: readonly GridSortItem[];
  /** The grid's filter model, keyed by column id; sent as JSON. */
  filter?: Record<string, unknown> | null;
  /** Quick search text. */
  q?: string;
};

/** `next` is the cursor of the page's last row (null after a short page, or from a route that pages by offset only). */
export type GridPage<T> = { rows: T[]; total: number; next: string | null };

export { GRID_COUNT_CAP };

/** The grid's last row when it is known: the total, or where a short page ends past the cap; else undefined (more to scroll). */
export function lastRowOf(total: number, startRow: number, received: number, asked: number): number | undefined {
  if (total <= GRID_COUNT_CAP) return total;
  return received < asked ? startRow + received : undefined;
}

export class GridFetchError extends Error {
  readonly status: number | null;
  constructor(message: string, status: number | null = null) {
    super(message);
    this.name = 'GridFetchError';
    this.status = status;
  }
}

export function sortParam(sort: readonly GridSortItem[] | undefined): string | null {
  const first = sort?.[0];
  return first ? `${first.colId}:${first.sort}` : null;
}

const PLACEHOLDER_ORIGIN = 'http://grid.invalid';

/**
 * Adds the grid's parameters to `url`, keeping any it already has (e.g. `/api/analyses?tankId=4`).
 * The order is fixed so equal requests give equal strings, which SWR uses as cache keys.
 */
export function buildGridUrl(
  url: string,
  view: GridView,
  page: { offset: number; limit: number; after?: string | null } | { format: 'csv' },
): string {
  const target = new URL(url, PLACEHOLDER_ORIGIN);
  const params = target.searchParams;
  for (const key of ['offset', 'limit', 'after', 'sort', 'filter', 'q', 'format']) params.delete(key);
  if ('format' in page) {
    params.set('format', page.format);
  } else {
    if (!Number.isInteger(page.offset) || page.offset < 0) throw new RangeError(`offset must be a whole number ≥ 0; got ${page.offset}.`);
    if (!Number.isInteger(page.limit) || page.limit < 1) throw new RangeError(`limit must be a whole number ≥ 1; got ${page.limit}.`);
    params.set('offset', String(page.offset));
    params.set('limit', String(page.limit));
    if (page.after) params.set('after', page.after);
  }
  const sort = sortParam(view.sort);
  if (sort) params.set('sort', sort);
  if (view.filter && Object.keys(view.filter).length > 0) params.set('filter', JSON.stringify(view.filter));
  const q = view.q?.trim();
  if (q) params.set('q', q);
  const path = `${target.pathname}?${params.toString()}${target.hash}`;
  return target.origin === PLACEHOLDER_ORIGIN ? path : `${target.origin}${path}`;
}

/** Checks a page's shape so a wrong route fails with a message rather than a blank grid. */
export function parseGridPage<T>(body: unknown): GridPage<T> {
  if (typeof body !== 'object' || body === null) throw new GridFetchError('The list answered with something other than JSON data.');
  const { rows, total, next } = body as { rows?: unknown; total?: unknown; next?: unknown };
  if (!Array.isArray(rows)) throw new GridFetchError('The list answered without a "rows" array.');
  if (typeof total !== 'number' || !Number.isInteger(total) || total < 0) {
    throw new GridFetchError('The list answered without a whole-number "total".');
  }
  return { rows: rows as T[], total, next: typeof next === 'string' && next !== '' ? next : null };
}

/** The house error body is `{ error: { code, message } }`; fall back to the status text. */
async function errorMessage(res: Response): Promise<string> {
  try {
    const body = (await res.json()) as { error?: { message?: unknown } };
    if (typeof body.error?.message === 'string' && body.error.message) return body.error.message;
  } catch {
    // Not JSON: use the generic message below.
  }
  if (res.status === 401) return 'Your session has ended. Sign in again to see this list.';
  if (res.status === 403) return 'You do not have access to this list.';
  return `The list could not be loaded (${res.status} ${res.statusText || 'error'}).`;
}

export async function fetchGridPage<T>(key: string): Promise<GridPage<T>> {
  let res: Response;
  try {
    res = await fetch(key, { headers: { accept: 'application/json' }, credentials: 'same-origin' });
  } catch {
    throw new GridFetchError('The server could not be reached. Check the connection and try again.');
  }
  if (!res.ok) throw new GridFetchError(await errorMessage(res), res.status);
  let body: unknown;
  try {
    body = await res.json();
  } catch {
    throw new GridFetchError('The list answered with something other than JSON data.', res.status);
  }
  return parseGridPage<T>(body);
}

/** Picks the file name from Content-Disposition, else derives one from the route. */
export function csvFileName(disposition: string | null, url: string): string {
  const star = disposition?.match(/filename\*\s*=\s*(?:UTF-8'')?([^;]+)/i)?.[1];
  if (star) {
    try {
      return decodeURIComponent(star.trim().replace(/^"|"$/g, ''));
    } catch {
      // Badly encoded: fall through to the plain form.
    }
  }
  const plain = disposition?.match(/filename\s*=\s*"?([^";]+)"?/i)?.[1];
  if (plain) return plain.trim();
  const last = new URL(url, PLACEHOLDER_ORIGIN).pathname.split('/').filter(Boolean).pop() ?? 'export';
  return `${last}.csv`;
}

/** Fetches the CSV for the current view and hands it to the browser as a download. */
export async function downloadGridCsv(url: string, view: GridView): Promise<void> {
  const key = buildGridUrl(url, view, { format: 'csv' });
  let res: Response;
  try {
    res = await fetch(key, { headers: { accept: 'text/csv' }, credentials: 'same-origin' });
  } catch {
    throw new GridFetchError('The server could not be reached. Check the connection and try again.');
  }
  if (!res.ok) throw new GridFetchError(await errorMessage(res), res.status);
  const blob = await res.blob();
  const href = URL.createObjectURL(blob);
  try {
    const a = document.createElement('a');
    a.href = href;
    a.download = csvFileName(res.headers.get('content-disposition'), url);
    document.body.append(a);
    a.click();
    a.remove();
  } finally {
    // Let the click start the download before the object URL goes away.
    setTimeout(() => URL.revokeObjectURL(href), 1000);
  }
}
