import 'server-only';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, PricingBasis, Quote } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertCan, type Actor } from './access';
import { unitPriceCents, type BasisFacts } from './basis';
import { nextDocumentNumber } from './numbering';
import type { LinePrice, PricingInput } from './pricing';
import { asFormError, priceRequest, rateSetInForce } from './pricing-context';
import type { AddLineInput, CreateQuoteInput, OverrideInput, QuoteHeaderInput } from './schemas';
import { isEditable, QUOTE_STATUS_LABELS } from './status';

// Drafting a quote: create it, set its header, add and remove lines, override a line's price.
// Only drafts change; everything else is a record of what the customer was sent.

type Db = Kysely<Database>;
type Trx = Transaction<Database>;

export type StoredCalculation = { input: PricingInput; tankCode: string };

export async function lockQuote(trx: Trx, quoteId: string): Promise<Quote> {
  const q = await trx.selectFrom('quotes').selectAll().where('id', '=', quoteId).forUpdate().executeTakeFirst();
  if (!q) throw new AppError('NOT_FOUND', 'That quote does not exist.');
  return q;
}

async function lockDraft(trx: Trx, quoteId: string): Promise<Quote> {
  const q = await lockQuote(trx, quoteId);
  if (!isEditable(q.status)) {
    throw new AppError('CONFLICT', `This quote is ${QUOTE_STATUS_LABELS[q.status].toLowerCase()} and can no longer be changed. Revise it to make a new revision.`);
  }
  return q;
}

export async function refreshQuoteTotal(trx: Trx, quoteId: string): Promise<void> {
  await trx
    .updateTable('quotes')
    .set({
      total_cents: sql<number>`(select coalesce(sum(total_cents), 0) from quote_lines where quote_id = ${quoteId})`,
      updated_at: sql`now()`,
    })
    .where('id', '=', quoteId)
    .execute();
}

export async function requireContact(conn: Db, customerId: string, userId: string): Promise<void> {
  const u = await conn
    .selectFrom('users')
    .select('id')
    .where('id', '=', userId)
    .where('role', '=', 'customer')
    .where('customer_id', '=', customerId)
    .where('is_active', '=', true)
    .executeTakeFirst();
  if (!u) throw new AppError('BAD_INPUT', 'Choose a contact of this customer.', { contactUserId: ['Choose a contact who can sign in for this customer.'] });
}

export async function createQuote(actor: Actor, input: CreateQuoteInput, conn: Db = defaultDb): Promise<{ id: string; number: string }> {
  assertCan(actor, 'quotes.write');
  const customer = await conn.selectFrom('customers').select('id').where('id', '=', input.customerId).executeTakeFirst();
  if (!customer) throw new AppError('BAD_INPUT', 'That customer does not exist.', { customerId: ['Choose a customer.'] });
  const rates = await rateSetInForce(conn);
  const contact = await conn
    .selectFrom('users')
    .select('id')
    .where('role', '=', 'customer')
    .where('customer_id', '=', customer.id)
    .where('is_active', '=', true)
    .orderBy('created_at')
    .limit(1)
    .executeTakeFirst();
  return conn.transaction().execute(async (trx) => {
    const number = await nextDocumentNumber(trx, 'quote');
    const q = await trx
      .insertInto('quotes')
      .values({
        number,
        customer_id: customer.id,
        contact_user_id: contact?.id ?? null,
        rate_set_id: rates.id,
        valid_days: rates.quote_valid_days,
        is_rush: input.isRush,
        notes: input.notes,
        created_by: actor.id,
      })
      .returning(['id', 'number'])
      .executeTakeFirstOrThrow();
    await trx.insertInto('audit_log').values({ actor_id: actor.id, action: 'quote.create', entity: 'quote', entity_id: q.id, detail: JSON.stringify({ number }) }).execute();
    return q;
  });
}

function factsOf(calc: StoredCalculation, price: LinePrice): BasisFacts {
  return { quantity: calc.input.quantity, areaPerPartDm2: calc.input.part.areaDm2, weightPerPartG: calc.input.part.weightG, loads: price.job.loads };
}

function unitPriceOrFormError(total: number, basis: PricingBasis, facts: BasisFacts): number {
  try {
    return unitPriceCents(total, basis, facts);
  } catch (err) {
    return asFormError(err);
  }
}

/** Prices every line again, e.g. after the rush flag changed; overridden prices stay as set. */
async function repriceLines(trx: Trx, q: Quote): Promise<void> {
  const lines = await trx.selectFrom('quote_lines').selectAll().where('quote_id', '=', q.id).execute();
  for (const l of lines) {
    const priced = await priceRequest(trx, {
      customerId: q.customer_id, partId: l.part_id, finishId: l.finish_id, quantity: l.quantity, basis: l.pricing_basis, isRush: q.is_rush, rateSetId: q.rate_set_id,
    });
    const total = l.override_total_cents ?? priced.price.totalCents;
    const calc: StoredCalculation = { input: priced.input, tankCode: priced.tankCode };
    await trx
      .updateTable('quote_lines')
      .set({
        calculation: JSON.stringify(calc),
        cost: JSON.stringify(priced.price),
        computed_total_cents: priced.price.totalCents,
        total_cents: total,
        unit_price_cents: unitPriceOrFormError(total, l.pricing_basis, factsOf(calc, priced.price)),
      })
      .where('id', '=', l.id)
      .execute();
  }
  await refreshQuoteTotal(trx, q.id);
}

export async function updateQuoteHeader(actor: Actor, input: QuoteHeaderInput, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'quotes.write');
  await conn.transaction().execute(async (trx) => {
    const q = await lockDraft(trx, input.quoteId);
    if (input.contactUserId) await requireContact(trx, q.customer_id, input.contactUserId);
    const updated = await trx
      .updateTable('quotes')
      .set({ contact_user_id: input.contactUserId, is_rush: input.isRush, notes: input.notes, updated_at: sql`now()` })
      .where('id', '=', q.id)
      .returningAll()
      .executeTakeFirstOrThrow();
    if (updated.is_rush !== q.is_rush) await repriceLines(trx, updated);
  });
}

export async function addQuoteLine(actor: Actor, input: AddLineInput, conn: Db = defaultDb): Promise<{ lineId: string; totalCents: number }> {
  assertCan(actor, 'quotes.price');
  return conn.transaction().execute(async (trx) => {
    const q = await lockDraft(trx, input.quoteId);
    const priced = await priceRequest(trx, { ...input, customerId: q.customer_id, isRush: q.is_rush, rateSetId: q.rate_set_id });
    const next = await trx
      .selectFrom('quote_lines')
      .select(sql<number>`coalesce(max(line_no), 0)::int + 1`.as('n'))
      .where('quote_id', '=', q.id)
      .executeTakeFirstOrThrow();
    const calc: StoredCalculation = { input: priced.input, tankCode: priced.tankCode };
    const line = await trx
      .insertInto('quote_lines')
      .values({
        quote_id: q.id,
        line_no: next.n,
        part_id: input.partId,
        finish_id: input.finishId,
        quantity: input.quantity,
        pricing_basis: input.basis,
        calculation: JSON.stringify(calc),
        cost: JSON.stringify(priced.price),
        computed_total_cents: priced.price.totalCents,
        total_cents: priced.price.totalCents,
        unit_price_cents: priced.price.unitPriceCents,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await refreshQuoteTotal(trx, q.id);
    return { lineId: line.id, totalCents: priced.price.totalCents };
  });
}

export async function removeQuoteLine(actor: Actor, input: { quoteId: string; lineId: string }, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'quotes.price');
  await conn.transaction().execute(async (trx) => {
    const q = await lockDraft(trx, input.quoteId);
    const gone = await trx.deleteFrom('quote_lines').where('id', '=', input.lineId).where('quote_id', '=', q.id).executeTakeFirst();
    if (Number(gone.numDeletedRows) === 0) throw new AppError('NOT_FOUND', 'That line is not on this quote.');
    await refreshQuoteTotal(trx, q.id);
  });
}

/** Sets a line's price by hand; the reason, who and when are kept beside the computed price. */
export async function overrideLinePrice(actor: Actor, input: OverrideInput, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'quotes.price');
  await conn.transaction().execute(async (trx) => {
    const q = await lockDraft(trx, input.quoteId);
    const l = await trx.selectFrom('quote_lines').selectAll().where('id', '=', input.lineId).where('quote_id', '=', q.id).executeTakeFirst();
    if (!l) throw new AppError('NOT_FOUND', 'That line is not on this quote.');
    const unit = unitPriceOrFormError(input.price, l.pricing_basis, factsOf(l.calculation as StoredCalculation, l.cost as LinePrice));
    await trx
      .updateTable('quote_lines')
      .set({ override_total_cents: input.price, override_reason: input.reason, override_by: actor.id, override_at: sql`now()`, total_cents: input.price, unit_price_cents: unit })
      .where('id', '=', l.id)
      .execute();
    await trx
      .insertInto('audit_log')
      .values({
        actor_id: actor.id, action: 'quote.line.override', entity: 'quote', entity_id: q.id,
        detail: JSON.stringify({ lineNo: l.line_no, computedCents: l.computed_total_cents, previousCents: l.total_cents, newCents: input.price, reason: input.reason }),
      })
      .execute();
    await refreshQuoteTotal(trx, q.id);
  });
}

export async function clearLineOverride(actor: Actor, input: { quoteId: string; lineId: string }, conn: Db = defaultDb): Promise<void> {
  assertCan(actor, 'quotes.price');
  await conn.transaction().execute(async (trx) => {
    const q = await lockDraft(trx, input.quoteId);
    const l = await trx.selectFrom('quote_lines').selectAll().where('id', '=', input.lineId).where('quote_id', '=', q.id).executeTakeFirst();
    if (!l) throw new AppError('NOT_FOUND', 'That line is not on this quote.');
    const price = l.cost as LinePrice;
    await trx
      .updateTable('quote_lines')
      .set({ override_total_cents: null, override_reason: null, override_by: null, override_at: null, total_cents: l.computed_total_cents, unit_price_cents: price.unitPriceCents })
      .where('id', '=', l.id)
      .execute();
    await trx.insertInto('audit_log').values({ actor_id: actor.id, action: 'quote.line.override.clear', entity: 'quote', entity_id: q.id, detail: JSON.stringify({ lineNo: l.line_no }) }).execute();
    await refreshQuoteTotal(trx, q.id);
  });
}
