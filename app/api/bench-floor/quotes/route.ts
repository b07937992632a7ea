// GET /api/bench-floor/quotes — the benchmark's floor for GET /api/quotes (lib/bench/floor.ts): the
// same session and permission check, the same bytes from memory; 404 outside `npm run bench`.
import { floorResponse } from '@/lib/bench/floor';
import { withPermission } from '@/lib/http';

export const dynamic = 'force-dynamic';

export const GET = withPermission('quotes.read', async () => floorResponse('quotes'));
