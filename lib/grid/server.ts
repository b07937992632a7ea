import 'server-only';
// Server side of the data grid. A route handler passes a Kysely select and a column whitelist:
//
//   export const GET = withPermission('customers.read', (req) =>
//     gridResponse(req, db.selectFrom('customers').select(['id', 'code', 'name']), {
//       columns: { code: { expr: 'customers.code', type: 'text', searchable: true }, … },
//       key: 'customers.id', defaultSort: { colId: 'code', dir: 'asc' }, fileName: 'customers' }));
//
// The select must name each column's value with its column id (for the CSV), and must not use
// GROUP BY or DISTINCT (the count reuses its FROM and WHERE); wrap such a query as a subquery:
// `db.selectFrom(grouped.as('t')).selectAll()` with expressions `t.<col>`.
import { conditionalByValidator, conditionalJson } from '@/lib/http-etag';
import { AppError } from '@/lib/errors';
import type { Expression, Kysely, SelectQueryBuilder } from 'kysely';
import { db as defaultDb } from '@/db';
import { sql } from 'kysely';
import { contentDisposition, csvLine } from './csv';
import { keepAnswer, keptAnswer, type ListCache, listCacheEnabled, listDataVersion, listKey } from './list-cache';
import { encodeCursor, GRID_COUNT_CAP, type GridColumnInfo, type GridCursor, type GridQuery, parseGridQuery } from './query';
import { afterSql, columnExpr, type GridColumns, type GridSearch, keyExpr, orderSql, whereSql } from './sql';

export type { GridColumn, GridColumns, GridSearch } from './sql';
export type { GridQuery, GridColumnType } from './query';
export { parseGridQuery, GRID_COUNT_CAP, GRID_MAX_LIMIT } from './query';

export type GridOptions<O> = {
  columns: GridColumns;
  /** A unique column (usually the primary key), added to every ORDER BY so paging is stable. */
  key: string | Expression<unknown>;
  defaultSort?: { colId: string; dir: 'asc' | 'desc' };
  /** The CSV download's name without extension, e.g. "customers". */
  fileName?: string;
  /** Shapes each row after it is read (both JSON and CSV), e.g. to convert units. */
  mapRow?: (row: O) => Record<string, unknown>;
  /** Where the count runs: the connection or transaction the select was built on (default: the app's). */
  db?: Kysely<any>;
  /** The list's own quick search for one word (see GridSearch), when its searchable columns span tables. */
  search?: GridSearch;
  /**
   * Keep answers in this process under the list data's count of changes (lib/grid/list-cache.ts).
   * Only for a list whose rows and shape are the same for every reader allowed to see it, that reads
   * only tables the count follows (migration 2026_12_04_1830), with no `mapRow` depending on the reader.
   */
  cache?: ListCache;
};

/**
 * `total` is exact up to GRID_COUNT_CAP; GRID_COUNT_CAP + 1 means more. `next` is the cursor of the
 * page's last row, to ask for the page after it by key (`after=`); null after a short page.
 */
export type GridResult = { rows: Record<string, unknown>[]; total: number; next: string | null };

const CSV_BATCH = 1000;

function columnInfo(columns: GridColumns): Record<string, GridColumnInfo> {
  return Object.fromEntries(Object.entries(columns).map(([id, c]) => [id, { type: c.type, sortable: c.sortable }]));
}

function filtered<DB, TB extends keyof DB, O>(qb: SelectQueryBuilder<DB, TB, O>, opts: GridOptions<O>, query: GridQuery) {
  const where = whereSql(opts.columns, query, opts.search);
  return where ? qb.where(where) : qb;
}

function ordered<DB, TB extends keyof DB, O>(qb: SelectQueryBuilder<DB, TB, O>, opts: GridOptions<O>, query: GridQuery) {
  return orderSql(opts.columns, query.sort, opts.defaultSort ?? null, opts.key).reduce((q, term) => q.orderBy(term), qb);
}

const SORT_TEXT = '__grid_sort';
const KEY_TEXT = '__grid_key';
type Keyed = { [SORT_TEXT]?: string | null; [KEY_TEXT]?: string };

/**
 * The query's order as a cursor's frame, and a select that also reads each row's sort value and key
 * as text (exact: a timestamp keeps its microseconds, a numeric its digits) for the next cursor.
 */
function keyed<DB, TB extends keyof DB, O>(qb: SelectQueryBuilder<DB, TB, O>, opts: GridOptions<O>, query: GridQuery) {
  const chosen = query.sort ?? opts.defaultSort ?? null;
  const frame = { colId: chosen?.colId ?? null, dir: chosen?.dir ?? ('asc' as const) };
  if (query.after && (query.after.colId !== frame.colId || query.after.dir !== frame.dir)) {
    throw new AppError('BAD_INPUT', 'after belongs to another sort order; ask for the page by offset.');
  }
  const sortText = chosen ? sql<string | null>`(${columnExpr(opts.columns[chosen.colId])})::text` : sql<null>`null`;
  const select = qb.select([sortText.as(SORT_TEXT), sql<string>`(${keyExpr(opts.key)})::text`.as(KEY_TEXT)]) as unknown as SelectQueryBuilder<DB, TB, O & Keyed>;
  return { frame, select };
}

function cursorOf(frame: { colId: string | null; dir: 'asc' | 'desc' }, row: Keyed): GridCursor {
  return { ...frame, value: row[SORT_TEXT] ?? null, key: String(row[KEY_TEXT]) };
}

function withoutKeys<O>(row: O & Keyed): O {
  const { [SORT_TEXT]: _s, [KEY_TEXT]: _k, ...rest } = row;
  return rest as O;
}

/** One page: the rows after the cursor (reading its ranges in turn until the page is full), or from the offset when there is none. */
async function readPage<DB, TB extends keyof DB, O>(sorted: SelectQueryBuilder<DB, TB, O>, opts: GridOptions<O>, after: GridCursor | null, offset: number, limit: number): Promise<O[]> {
  if (!after) return sorted.offset(offset).limit(limit).execute();
  const rows: O[] = [];
  try {
    for (const range of afterSql(opts.columns, after, opts.key)) {
      rows.push(...(await sorted.where(range).limit(limit - rows.length).execute()));
      if (rows.length >= limit) break;
    }
  } catch (err) {
    // A cursor edited by hand can carry a value the column's type does not read (class 22, data exception).
    if (/^22/.test(String((err as { code?: unknown }).code ?? ''))) throw new AppError('BAD_INPUT', 'after is not a page cursor this list gave out.');
    throw err;
  }
  return rows;
}

/** Parses the request's query string against the options' whitelist (AppError BAD_INPUT on anything wrong). */
export function gridQueryFrom(req: Request | URL, columns: GridColumns): GridQuery {
  const url = req instanceof URL ? req : new URL(req.url);
  return parseGridQuery(url.searchParams, columnInfo(columns));
}

/** One page of rows and the total matching the filters: two queries, the page and one count. */
export async function runGridQuery<DB, TB extends keyof DB, O>(
  qb: SelectQueryBuilder<DB, TB, O>,
  opts: GridOptions<O>,
  query: GridQuery,
): Promise<GridResult> {
  const base = filtered(qb, opts, query);
  const conn: Kysely<any> = opts.db ?? (defaultDb as Kysely<any>);
  const upTo = base.clearSelect().clearOrderBy().select(sql<number>`1`.as('one')).limit(GRID_COUNT_CAP + 1);
  const { frame, select } = keyed(base, opts, query);
  const [rows, count] = await Promise.all([
    readPage(ordered(select, opts, query), opts, query.after, query.offset, query.limit),
    conn.selectFrom(upTo.as('counted')).select(sql<number>`count(*)::int`.as('total')).executeTakeFirst() as Promise<{ total: number } | undefined>,
  ]);
  const map = opts.mapRow ?? ((r: O) => r as Record<string, unknown>);
  const last = rows.at(-1) as (O & Keyed) | undefined;
  return {
    rows: rows.map((r) => map(withoutKeys(r as O & Keyed))),
    total: count?.total ?? 0,
    next: last && rows.length === query.limit ? encodeCursor(cursorOf(frame, last)) : null,
  };
}

/** The filtered, sorted rows as CSV, read in batches so a large export never sits in memory at once. */
export function gridCsvStream<DB, TB extends keyof DB, O>(
  qb: SelectQueryBuilder<DB, TB, O>,
  opts: GridOptions<O>,
  query: GridQuery,
): ReadableStream<Uint8Array> {
  const exported = Object.entries(opts.columns).filter(([, c]) => c.csv !== false);
  // Batches follow one another by key, so the thousandth batch costs what the first does.
  const { frame, select } = keyed(filtered(qb, opts, { ...query, after: null }), opts, { ...query, after: null });
  const sorted = ordered(select, opts, query);
  const map = opts.mapRow ?? ((r: O) => r as Record<string, unknown>);
  const encoder = new TextEncoder();
  let after: GridCursor | null = null;
  let headerSent = false;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!headerSent) {
        headerSent = true;
        controller.enqueue(encoder.encode(csvLine(exported.map(([id, c]) => c.header ?? id))));
        return;
      }
      try {
        const batch = await readPage(sorted, opts, after, 0, CSV_BATCH);
        const last = batch.at(-1) as (O & Keyed) | undefined;
        if (last) after = cursorOf(frame, last);
        if (batch.length > 0) {
          const text = batch.map((r) => {
            const row = map(withoutKeys(r as O & Keyed));
            return csvLine(exported.map(([id]) => row[id]));
          });
          controller.enqueue(encoder.encode(text.join('')));
        }
        if (batch.length < CSV_BATCH) controller.close();
      } catch (err) {
        console.error('[grid] CSV export failed:', err);
        controller.error(err);
      }
    },
  });
}

/** Answers a grid request: `{ rows, total }` as JSON, or the CSV download when `format=csv`. */
export async function gridResponse<DB, TB extends keyof DB, O>(
  req: Request,
  qb: SelectQueryBuilder<DB, TB, O>,
  opts: GridOptions<O>,
): Promise<Response> {
  const query = gridQueryFrom(req, opts.columns);
  if (query.format === 'csv') {
    const stamp = new Date().toISOString().slice(0, 10);
    return new Response(gridCsvStream(qb, opts, query), {
      headers: {
        'content-type': 'text/csv; charset=utf-8',
        'content-disposition': contentDisposition('attachment', `${opts.fileName ?? 'export'}-${stamp}.csv`),
        'cache-control': 'no-store',
        'x-content-type-options': 'nosniff',
      },
    });
  }
  if (opts.cache && listCacheEnabled()) {
    // The count is read before the rows, so what is kept under it is never older than it.
    const { key, etag } = listKey(opts.cache, await listDataVersion(opts.db ?? (defaultDb as Kysely<any>), opts.cache.clock), query);
    return conditionalByValidator(req, etag, async () => {
      let body = keptAnswer(key);
      if (body === undefined) {
        body = JSON.stringify(await runGridQuery(qb, opts, query));
        keepAnswer(key, body);
      }
      return body;
    });
  }
  const page = await runGridQuery(qb, opts, query);
  // A revalidation that finds the same page answers 304 without a body (lib/http-etag.ts).
  return conditionalJson(req, page);
}
