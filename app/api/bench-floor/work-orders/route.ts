// GET /api/bench-floor/work-orders — the benchmark's floor for GET /api/work-orders
// (lib/bench/floor.ts): the same session and permission check, the same bytes from memory; 404
// outside `npm run bench`.
import { floorResponse } from '@/lib/bench/floor';
import { withPermission } from '@/lib/http';

export const dynamic = 'force-dynamic';

export const GET = withPermission('orders.read', async () => floorResponse('work-orders'));
