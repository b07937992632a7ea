import 'server-only';
import type { Transaction } from 'kysely';
import type { Database, Quote, QuoteLine } from '@/db/types';
import { nextDocumentNumber } from '@/lib/quotes/numbering';
import type { LinePrice } from '@/lib/quotes/pricing';

type Trx = Transaction<Database>;

// Lead times when the customer gives no date: our own defaults, not a published figure.
export const DEFAULT_LEAD_DAYS = { normal: 10, rush: 4 } as const;

function addDays(day: Date, days: number): string {
  return new Date(day.getTime() + days * 86_400_000).toISOString().slice(0, 10);
}

/** One work order per accepted line, numbered in the same transaction as the acceptance. */
export async function createWorkOrdersForQuote(
  trx: Trx,
  quote: Quote,
  lines: QuoteLine[],
  order: { poNumber: string; neededBy: string | null; actorId: string; at?: Date },
): Promise<{ id: string; number: string }[]> {
  const at = order.at ?? new Date();
  const due = order.neededBy ?? addDays(at, quote.is_rush ? DEFAULT_LEAD_DAYS.rush : DEFAULT_LEAD_DAYS.normal);
  const created: { id: string; number: string }[] = [];
  for (const l of [...lines].sort((a, b) => a.line_no - b.line_no)) {
    const cost = l.cost as LinePrice;
    const number = await nextDocumentNumber(trx, 'work_order', at);
    const wo = await trx
      .insertInto('work_orders')
      .values({
        number,
        customer_id: quote.customer_id,
        quote_line_id: l.id,
        part_id: l.part_id,
        finish_id: l.finish_id,
        po_number: order.poNumber,
        due_date: due,
        quantity_ordered: l.quantity,
        bake_required: cost.bake.applies,
        is_rush: quote.is_rush,
        unit_price_cents: l.unit_price_cents,
        pricing_basis: l.pricing_basis,
        total_cents: l.total_cents,
        quoted_cost: JSON.stringify(cost),
      })
      .returning(['id', 'number'])
      .executeTakeFirstOrThrow();
    await trx
      .insertInto('work_order_events')
      .values({ work_order_id: wo.id, from_state: null, to_state: 'accepted', actor_id: order.actorId, note: `Quote ${quote.number} rev ${quote.revision} accepted, PO ${order.poNumber}` })
      .execute();
    created.push(wo);
  }
  return created;
}
