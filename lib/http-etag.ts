import 'server-only';
// Conditional reads for JSON answers: each carries a validator (an ETag) computed from the exact
// bytes sent; a request that brings the same validator back in
// If-None-Match gets 304 and no body. The browser's own HTTP cache does the bringing back (the
// answers are `private, no-cache`: kept by this browser only, and asked again every time), so SWR
// and the grid revalidate with If-None-Match without code of their own.
import { createHash } from 'node:crypto';

export const CONDITIONAL_CACHE_CONTROL = 'private, no-cache';

/**
 * A weak validator of the exact bytes. It names content, not a reader: a browser that brings back
 * another user's validator gets 304 only for the very bytes this reader would be sent anyway.
 */
export function etagFor(body: string): string {
  return `W/"${createHash('sha1').update(body).digest('base64url')}"`;
}

/** A weak validator named by what an answer was made from (a kept answer's key), not by its bytes. */
export function etagForKey(kind: string, key: string): string {
  return `W/"${kind}${createHash('sha1').update(key).digest('base64url')}"`;
}

/** Whether If-None-Match names this validator (a list, "*", or weak/strong forms alike). */
export function matches(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  const bare = (t: string) => t.trim().replace(/^W\//, '');
  const want = bare(etag);
  return ifNoneMatch.split(',').some((t) => t.trim() === '*' || bare(t) === want);
}

/** The headers every conditional answer carries: its validator, kept by this browser only and asked again each time. */
function validated(etag: string): Record<string, string> {
  return { etag, 'cache-control': CONDITIONAL_CACHE_CONTROL, vary: 'cookie' };
}

/** 200 with the JSON and its ETag, or 304 when the reader already holds exactly these bytes. */
export function conditionalJson(req: Request, data: unknown, init: { status?: number; headers?: Record<string, string> } = {}): Response {
  return conditionalJsonText(req, JSON.stringify(data), init);
}

/** The same, for JSON already serialised (e.g. kept in the database). */
export function conditionalJsonText(req: Request, body: string, init: { status?: number; headers?: Record<string, string> } = {}): Response {
  const etag = etagFor(body);
  const headers = { ...init.headers, ...validated(etag) };
  if (matches(req.headers.get('if-none-match'), etag)) return new Response(null, { status: 304, headers });
  return new Response(body, { status: init.status ?? 200, headers: { ...headers, 'content-type': 'application/json' } });
}

/**
 * 200 with a body made only when needed, or 304, for an answer whose validator is known before its
 * bytes (a kept list: lib/grid/list-cache.ts; a kept chart: lib/bath/chart-cache.ts). The body goes
 * out as text: the server's own compression encodes it for readers that take gzip.
 */
export async function conditionalByValidator(req: Request, etag: string, body: () => Promise<string>): Promise<Response> {
  const headers = validated(etag);
  if (matches(req.headers.get('if-none-match'), etag)) return new Response(null, { status: 304, headers });
  return new Response(await body(), { headers: { ...headers, 'content-type': 'application/json' } });
}
