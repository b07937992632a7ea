// Demo quotes, work orders and plating runs for the invented shop, made through the same business
// functions the app uses (so the numbers, prices and states are what the app would produce).
// Idempotent: an audit-log marker says the set is loaded.
import { sql, type Kysely } from 'kysely';
import type { Database, PricingBasis } from '@/db/types';
import type { Actor } from '@/lib/quotes/access';
import { acceptQuote, declineQuote, markQuoteSent, reviseQuote } from '@/lib/quotes/lifecycle';
import { addQuoteLine, createQuote } from '@/lib/quotes/mutations';
import type { LinePrice } from '@/lib/quotes/pricing';
import { recordReceipt } from '@/lib/dock/receiving';
import { advanceWorkOrder } from '@/lib/orders/mutations';
import { findTanksForFinish, getWorkOrder } from '@/lib/orders/queries';
import { familyParams, getFamily } from '@/lib/families';
import { logPlatingRun } from '@/lib/orders/runs';

const MARKER = 'seed.quotes';
const DAY = 86_400_000;

type Line = { part: string; finish: string; quantity: number; basis: PricingBasis };

export async function actor(db: Kysely<Database>, email: string): Promise<Actor> {
  const u = await db.selectFrom('users').select(['id', 'role', 'customer_id', 'name', 'email']).where('email', '=', email).executeTakeFirstOrThrow();
  return { id: u.id, role: u.role, customerId: u.customer_id, name: u.name, email: u.email };
}

export async function draftQuote(db: Kysely<Database>, estimator: Actor, customerCode: string, lines: Line[], opts: { isRush?: boolean; notes?: string } = {}) {
  const customer = await db.selectFrom('customers').select('id').where('code', '=', customerCode).executeTakeFirstOrThrow();
  const q = await createQuote(estimator, { customerId: customer.id, isRush: opts.isRush ?? false, notes: opts.notes ?? '' }, db);
  for (const l of lines) {
    const part = await db.selectFrom('parts').select('id').where('customer_id', '=', customer.id).where('part_number', '=', l.part).executeTakeFirstOrThrow();
    const finish = await db.selectFrom('finishes').select('id').where('code', '=', l.finish).executeTakeFirstOrThrow();
    await addQuoteLine(estimator, { quoteId: q.id, partId: part.id, finishId: finish.id, quantity: l.quantity, basis: l.basis }, db);
  }
  return q;
}

/**
 * Receives the parts and logs runs that cover them, at the quoted current and a little more or
 * less time than quoted (`timeFactor`), so the job-cost report has real variance to show.
 */
export async function runOrder(db: Kysely<Database>, woId: string, people: { plater: Actor; supervisor: Actor }, opts: { timeFactor: number; endedAt: Date; toPlated: boolean }) {
  const wo = await getWorkOrder(woId, db);
  if (!wo) return;
  if (wo.state === 'accepted') {
    await recordReceipt(
      people.supervisor,
      {
        workOrderId: woId, quantity: wo.quantity_ordered, containers: Math.max(1, Math.ceil(wo.quantity_ordered / 500)), weightKg: wo.weight_g ? Math.round((wo.weight_g * wo.quantity_ordered) / 10) / 100 : undefined,
        customerPartNumber: `${wo.customer_code}-${wo.part_number}`, customerLot: `L${wo.number.slice(-4)}`, conditionNote: 'Counted at the dock', discrepancy: 'none', discrepancyNote: '', photoIds: [],
      },
      db,
    );
  }
  const cost = wo.quoted_cost as LinePrice;
  const [tank] = await findTanksForFinish(wo, db);
  if (!tank || !cost.job) return;
  const perLoad = cost.job.partsPerLoad;
  const loads = Math.ceil(wo.quantity_ordered / perLoad);
  const family = getFamily(wo.family);
  const params = familyParams(family.id, wo.family_params);
  const currentA = Math.round((wo.current_density_adm2 ?? 0) * perLoad * wo.area_dm2);
  // A run without current reads the bath as the finish sets it (the plater's thermometer and the latest titration).
  const conditions = { temperature: typeof params.temperatureC === 'number' ? params.temperatureC : 88, concentration: typeof params.concentration === 'number' ? params.concentration : undefined };
  for (let i = 0; i < loads; i++) {
    const parts = Math.min(perLoad, wo.quantity_ordered - i * perLoad);
    await logPlatingRun(
      people.plater,
      {
        workOrderId: woId, tankId: tank.id, mode: family.runsWithCurrent ? 'amps' : 'time', currentA: Math.max(1, Math.round((currentA * parts) / perLoad)), meterStartAh: undefined, meterStopAh: undefined,
        minutesPerLoad: Math.round(cost.job.minutesPerLoad * opts.timeFactor), loads: 1, partsPerLoad: parts,
        ...(family.runsWithCurrent ? {} : conditions),
        idempotencyKey: `seed-run-${woId}-${i}`, confirmBelowMinimum: true,
      },
      db,
      new Date(opts.endedAt.getTime() + i * 3_600_000),
    );
  }
  if (opts.toPlated) await advanceWorkOrder(people.supervisor, { workOrderId: woId, to: 'plated', quantityReceived: undefined, note: '' }, db);
}

/**
 * The business functions stamp records with the real time; the story above happened over weeks.
 * Move creation and state-change times back to match the quote and run dates (demo data only).
 */
export async function backdate(db: Kysely<Database>, quoteIds: string[]): Promise<void> {
  await sql`update quotes set created_at = coalesce(sent_at, now()) - interval '1 day', updated_at = coalesce(decided_at, sent_at, now())
            where id = any(${quoteIds}::uuid[])`.execute(db);
  await sql`
    update work_order_events e
    set created_at = case e.to_state
      when 'accepted' then q.decided_at
      when 'received' then coalesce(r.first_start - interval '1 hour', q.decided_at + interval '1 day')
      when 'in_process' then coalesce(r.first_start, q.decided_at + interval '1 day')
      else coalesce(r.last_end + interval '10 minutes', e.created_at) end
    from work_orders w
    join quote_lines l on l.id = w.quote_line_id
    join quotes q on q.id = l.quote_id
    left join lateral (select min(started_at) as first_start, max(ended_at) as last_end from plating_runs where work_order_id = w.id) r on true
    where e.work_order_id = w.id and q.id = any(${quoteIds}::uuid[])`.execute(db);
  await sql`update work_orders w set created_at = q.decided_at, updated_at = q.decided_at
            from quote_lines l join quotes q on q.id = l.quote_id
            where l.id = w.quote_line_id and q.decided_at is not null and q.id = any(${quoteIds}::uuid[])`.execute(db);
}

export async function seedQuotes(db: Kysely<Database>): Promise<void> {
  const done = await db.selectFrom('audit_log').select('id').where('action', '=', MARKER).executeTakeFirst();
  if (done) return;
  const estimator = await actor(db, 'estimator@kestrel-plating.test');
  const people = { plater: await actor(db, 'plater@kestrel-plating.test'), supervisor: await actor(db, 'supervisor@kestrel-plating.test') };
  const northgate = await actor(db, 'buyer@northgate-fastener.test');
  const halvorsen = await actor(db, 'quality@halvorsen-valve.test');
  const now = Date.now();
  const ago = (days: number) => new Date(now - days * DAY);
  const made: string[] = [];
  const draft = async (...args: Parameters<typeof draftQuote>) => {
    const q = await draftQuote(...args);
    made.push(q.id);
    return q;
  };

  // A draft still being priced (Brightline has no contact who signs in yet).
  await draft(db, estimator, 'BRL', [
    { part: 'BL-BUS-0450', finish: 'SN-B545-C', quantity: 40, basis: 'piece' },
    { part: 'BL-PIN-0102', finish: 'AG-B700-5', quantity: 20000, basis: 'hundred' },
  ]);

  // Sent, then revised with a larger quantity: rev A superseded, rev B open for the buyer.
  const open = await draft(db, estimator, 'NGF', [{ part: 'NGF-HX-0816', finish: 'ZN-B633-SC2', quantity: 20000, basis: 'lb' }]);
  await markQuoteSent(estimator, { quoteId: open.id, contactUserId: northgate.id }, db, ago(9));
  const revB = await reviseQuote(estimator, open.id, db, ago(3));
  made.push(revB.id);
  await markQuoteSent(estimator, { quoteId: revB.id, contactUserId: northgate.id }, db, ago(2));

  // Sent long ago and never answered: reads as expired.
  const stale = await draft(db, estimator, 'HVI', [{ part: 'HV-STEM-220', finish: 'NI-B689-25', quantity: 24, basis: 'piece' }]);
  await markQuoteSent(estimator, { quoteId: stale.id, contactUserId: halvorsen.id }, db, ago(45));

  // Declined with a reason.
  const declined = await draft(db, estimator, 'HVI', [{ part: 'HV-STEM-220', finish: 'NI-B689-25', quantity: 400, basis: 'piece' }], { isRush: true });
  await markQuoteSent(estimator, { quoteId: declined.id, contactUserId: halvorsen.id }, db, ago(20));
  await declineQuote(halvorsen, { quoteId: declined.id, reason: 'The rush lead time does not fit our assembly schedule; we will order again next quarter.' }, db, ago(18));

  // Accepted orders in several states, with runs over the last three months.
  const hardened = await draft(db, estimator, 'NGF', [
    { part: 'NGF-SS-1240', finish: 'ZN-B633-SC2-HS', quantity: 3000, basis: 'piece' },
    { part: 'NGF-HX-0816', finish: 'ZN-B633-SC2', quantity: 10000, basis: 'lb' },
  ]);
  await markQuoteSent(estimator, { quoteId: hardened.id, contactUserId: northgate.id }, db, ago(80));
  const a1 = await acceptQuote(northgate, { quoteId: hardened.id, poNumber: 'NGF-PO-55120', neededBy: null }, db, ago(78));
  await runOrder(db, a1.workOrders[0]!.id, people, { timeFactor: 1.1, endedAt: ago(74), toPlated: true });
  await runOrder(db, a1.workOrders[1]!.id, people, { timeFactor: 0.97, endedAt: ago(72), toPlated: true });

  const stems = await draft(db, estimator, 'HVI', [
    { part: 'HV-STEM-220', finish: 'NI-B689-25', quantity: 120, basis: 'piece' },
    { part: 'HV-STEM-220', finish: 'NI-B689-25', quantity: 60, basis: 'dm2' },
  ]);
  await markQuoteSent(estimator, { quoteId: stems.id, contactUserId: halvorsen.id }, db, ago(40));
  const a2 = await acceptQuote(halvorsen, { quoteId: stems.id, poNumber: 'HVI-2291', neededBy: null }, db, ago(38));
  await runOrder(db, a2.workOrders[0]!.id, people, { timeFactor: 1.18, endedAt: ago(33), toPlated: true });
  await runOrder(db, a2.workOrders[1]!.id, people, { timeFactor: 1.05, endedAt: ago(2), toPlated: false });

  const fresh = await draft(db, estimator, 'NGF', [{ part: 'NGF-SS-1240', finish: 'ZN-B633-SC2-HS', quantity: 1500, basis: 'piece' }], { isRush: true });
  await markQuoteSent(estimator, { quoteId: fresh.id, contactUserId: northgate.id }, db, ago(4));
  await acceptQuote(northgate, { quoteId: fresh.id, poNumber: 'NGF-PO-55391', neededBy: null }, db, ago(1));

  await backdate(db, made);
  await db.insertInto('audit_log').values({ actor_id: estimator.id, action: MARKER, entity: 'seed', entity_id: null }).execute();
}
