// Demo invoices from the demo shop's shipped work orders: one paid, one overdue and one recently
// issued, so receivables show more than one age. Needs the orders seed to have shipped some work
// orders first; without any it does nothing. Runs once per database (a settings row records it).
import { sql, type Kysely } from 'kysely';
import type { Database } from '@/db/types';
import { addDaysIso, todayIso } from '@/lib/billing/dates';
import { issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { AppError } from '@/lib/errors';

const DONE_KEY = 'seed.billing';

type Plan = { label: 'overdue' | 'paid' | 'current'; issuedDaysAgo: number };

// Issued 75 days ago on net-30 terms is 45 days past due; 40 days ago and paid; 3 days ago, current.
const PLANS: Plan[] = [
  { label: 'overdue', issuedDaysAgo: 75 },
  { label: 'paid', issuedDaysAgo: 40 },
  { label: 'current', issuedDaysAgo: 3 },
];

export async function seedBilling(db: Kysely<Database>): Promise<void> {
  const done = await db.selectFrom('settings').select('key').where('key', '=', DONE_KEY).executeTakeFirst();
  if (done) return;
  const owner = await db.selectFrom('users').select('id').where('role', '=', 'owner').orderBy('created_at').executeTakeFirst();
  // Only orders that came from demo quotes: test fixtures made without a quote are left alone.
  const shipped = await db
    .selectFrom('work_orders')
    .select(['id', 'customer_id'])
    .where('state', '=', 'shipped')
    .where('quote_line_id', 'is not', null)
    .orderBy('number')
    .execute();
  if (!owner || shipped.length === 0) return; // nothing shipped yet: try again on the next seed

  const made: string[] = [];
  for (const [i, plan] of PLANS.entries()) {
    const order = shipped[i];
    if (!order) break;
    const issuedOn = addDaysIso(todayIso(), -plan.issuedDaysAgo);
    try {
      const inv = await issueInvoice(
        owner.id,
        {
          customerId: order.customer_id,
          orderIds: [order.id],
          extras: plan.label === 'current' ? [{ kind: 'expedite', description: 'Expedited return freight', quantity: 1, unitPriceCents: 4800 }] : [],
          issuedOn,
          notes: 'Thank you for your business.',
        },
        db,
      );
      if (plan.label === 'paid') {
        const total = (await db.selectFrom('invoices').select('total_cents').where('id', '=', inv.id).executeTakeFirstOrThrow()).total_cents;
        await recordManualPayment(owner.id, { invoiceId: inv.id, amount: total, method: 'check', reference: 'Check 20418', receivedOn: addDaysIso(issuedOn, 26) }, db);
      }
      made.push(`${inv.number} (${plan.label})`);
    } catch (err) {
      // An order the demo data cannot bill (no weight for a per-kg price, a quality hold) is skipped.
      if (!(err instanceof AppError)) throw err;
    }
  }
  if (made.length) {
    await db
      .insertInto('settings')
      .values({ key: DONE_KEY, value: JSON.stringify({ invoices: made }) })
      .onConflict((oc) => oc.column('key').doUpdateSet({ value: JSON.stringify({ invoices: made }), updated_at: sql`now()` }))
      .execute();
  }
}
