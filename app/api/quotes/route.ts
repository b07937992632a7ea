// GET /api/quotes — the quote list for the grid (JSON page or CSV); office staff with quotes.read
import { gridResponse } from '@/lib/grid/server';
import { withPermission } from '@/lib/http';
import { QUOTE_GRID, quoteGridSelect } from '@/lib/quotes/queries';

export const GET = withPermission('quotes.read', (req) => gridResponse(req, quoteGridSelect(), QUOTE_GRID));
