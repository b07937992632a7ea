import 'server-only';
// A repeated read of an office list, answered without its query. list_data_version counts the
// committed changes to every table the lists read (migration 2026_12_04_1830); each app process
// keeps recent answers under (list, query, that count, the next instant the clock changes the
// list) and checks the count, one single-row read, before every answer. Another process's write,
// a script's, a migration's: each moves the count at its commit, so no process serves a list
// older than what is committed. The count is read before the rows, so an answer kept under a count
// is never older than that count.
//
// The ETag names the same things, so a browser revalidating a list it holds gets 304 after that
// one read: no list query, no JSON. Only for lists whose rows are the same for every reader allowed
// to see them (the staff lists); AMPWRIGHT_LIST_CACHE=off turns the keeping off (the ten-year
// benchmark times the queries themselves).
import { type Kysely, type RawBuilder, sql } from 'kysely';
import { LRUCache } from 'lru-cache';
import { etagForKey } from '@/lib/http-etag';

export type ListCache = {
  /** The list's name, e.g. "quotes". */
  name: string;
  /** The next instant at which the list changes with no write (e.g. a sent quote's expiry), or none. */
  clock?: RawBuilder<unknown>;
};

// Recent answers, at most 500 of them and 32 MB of JSON per process.
const kept = new LRUCache<string, string>({ max: 500, maxSize: 32 * 1024 * 1024, sizeCalculation: (body) => Math.max(1, body.length) });

export function listCacheEnabled(): boolean {
  return process.env.AMPWRIGHT_LIST_CACHE !== 'off';
}

/** The list data's count of committed changes and the clock's next instant, as one text. */
export async function listDataVersion(conn: Kysely<any>, clock?: RawBuilder<unknown>): Promise<string> {
  const row = await sql<{ v: string }>`select v.version::text || '|' || coalesce((${clock ?? sql`null`})::text, '') as v from list_data_version v`.execute(conn);
  const v = row.rows[0]?.v;
  if (v === undefined) throw new Error('list_data_version has no row: run the migrations.');
  return v;
}

/** The key and validator of one list answer. */
export function listKey(cache: ListCache, version: string, query: unknown): { key: string; etag: string } {
  const key = `${cache.name}\n${version}\n${JSON.stringify(query)}`;
  return { key, etag: etagForKey('l', key) };
}

export function keptAnswer(key: string): string | undefined {
  return kept.get(key);
}

export function keepAnswer(key: string, body: string): void {
  kept.set(key, body);
}
