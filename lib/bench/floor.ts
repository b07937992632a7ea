import 'server-only';
// The list benchmark's floor (`npm run bench`, tests/bench/api-lists.bench.ts): a Next.js route on
// the same server that validates the same session and permission as a list route and answers the
// same bytes from memory, with no query. The benchmark starts the server with BENCH_FLOOR_BODIES
// (the bodies it fetched from the real routes); without it these routes answer 404.
import { AppError } from '@/lib/errors';

let bodies: Record<string, string> | null | undefined;

export function floorResponse(list: 'quotes' | 'work-orders'): Response {
  if (bodies === undefined) {
    const raw = process.env.BENCH_FLOOR_BODIES;
    bodies = raw ? (JSON.parse(raw) as Record<string, string>) : null;
  }
  const body = bodies?.[list];
  if (body === undefined) throw new AppError('NOT_FOUND', 'Not found.');
  return new Response(body, { headers: { 'content-type': 'application/json', 'cache-control': 'no-store' } });
}
