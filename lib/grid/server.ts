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
import { conditionalJson } from '@/lib/http-etag';
import type { Expression, Kysely, SelectQueryBuilder } from 'kysely';
import { db as defaultDb } from '@/db';
import { sql } from 'kysely';
import { contentDisposition, csvLine } from './csv';
import { GRID_COUNT_CAP, type GridColumnInfo, type GridQuery, parseGridQuery } from './query';
import { type GridColumns, orderSql, whereSql } from './sql';

export type { GridColumn, GridColumns } from './sql';
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
};


/** `total` is exact up to GRID_COUNT_CAP; GRID_COUNT_CAP + 1 means more. */
export type GridResult = { rows: Record<string, unknown>[]; total: number };

const CSV_BATCH = 1000;

function columnInfo(columns: GridColumns): Record<string, GridColumnInfo> {
  return Object.fromEntries(Object.entries(columns).map(([id, c]) => [id, { type: c.type, sortable: c.sortable }]));
}

function filtered<DB, TB extends keyof DB, O>(qb: SelectQueryBuilder<DB, TB, O>, columns: GridColumns, query: GridQuery) {
  const where = whereSql(columns, query);
  return where ? qb.where(where) : qb;
}

function ordered<DB, TB extends keyof DB, O>(qb: SelectQueryBuilder<DB, TB, O>, opts: GridOptions<O>, query: GridQuery) {
  return orderSql(opts.columns, query.sort, opts.defaultSort ?? null, opts.key).reduce((q, term) => q.orderBy(term), qb);
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
  const base = filtered(qb, opts.columns, query);
  const conn: Kysely<any> = opts.db ?? (defaultDb as Kysely<any>);
  const upTo = base.clearSelect().clearOrderBy().select(sql<number>`1`.as('one')).limit(GRID_COUNT_CAP + 1);
  const [rows, count] = await Promise.all([
    ordered(base, opts, query).limit(query.limit).offset(query.offset).execute(),
    conn.selectFrom(upTo.as('counted')).select(sql<number>`count(*)::int`.as('total')).executeTakeFirst() as Promise<{ total: number } | undefined>,
  ]);
  const map = opts.mapRow ?? ((r: O) => r as Record<string, unknown>);
  return { rows: rows.map((r) => map(r as O)), total: count?.total ?? 0 };
}

/** The filtered, sorted rows as CSV, read in batches so a large export never sits in memory at once. */
export function gridCsvStream<DB, TB extends keyof DB, O>(
  qb: SelectQueryBuilder<DB, TB, O>,
  opts: GridOptions<O>,
  query: GridQuery,
): ReadableStream<Uint8Array> {
  const exported = Object.entries(opts.columns).filter(([, c]) => c.csv !== false);
  const sorted = ordered(filtered(qb, opts.columns, query), opts, query);
  const map = opts.mapRow ?? ((r: O) => r as Record<string, unknown>);
  const encoder = new TextEncoder();
  let offset = 0;
  let headerSent = false;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!headerSent) {
        headerSent = true;
        controller.enqueue(encoder.encode(csvLine(exported.map(([id, c]) => c.header ?? id))));
        return;
      }
      try {
        const batch = await sorted.limit(CSV_BATCH).offset(offset).execute();
        offset += batch.length;
        if (batch.length > 0) {
          const text = batch.map((r) => {
            const row = map(r as O);
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
  const page = await runGridQuery(qb, opts, query);
  // A revalidation that finds the same page answers 304 without a body (lib/http-etag.ts).
  return conditionalJson(req, page);
}
