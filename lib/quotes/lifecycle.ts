import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { createWorkOrdersForQuote } from '@/lib/orders/create';
import { assertCan, ownCustomerId, type Actor } from './access';
import { lockQuote, requireContact } from './mutations';
import type { AcceptQuoteInput } from './schemas';
import { canRevise, effectiveQuoteStatus, expiryFrom, nextRevision, QUOTE_STATUS_LABELS, quoteLabel } from './status';

// A quote after drafting: sent (with its validity clock), revised, accepted with a PO (which
// opens the work orders) or declined. E-mails are sent by the caller after these commit.

import { quoteTurnaroundDays } from '@/lib/schedule/queries';

type Db = Kysely<Database>;

export async function markQuoteSent(
  actor: Actor,
  input: { quoteId: string; contactUserId: string },
  conn: Db = defaultDb,
  now: Date = new Date(),
): Promise<{ expiresAt: Date }> {
  assertCan(actor, 'quotes.write');
  return conn.transaction().execute(async (trx) => {
    const q = await lockQuote(trx, input.quoteId);
    if (q.status !== 'draft') throw new AppError('CONFLICT', `This quote is already ${QUOTE_STATUS_LABELS[q.status].toLowerCase()}.`);
    await requireContact(trx, q.customer_id, input.contactUserId);
    const lines = await trx.selectFrom('quote_lines').select(sql<number>`count(*)::int`.as('n')).where('quote_id', '=', q.id).executeTakeFirstOrThrow();
    if (lines.n === 0) throw new AppError('CONFLICT', 'Add at least one line before sending the quote.');
    const expiresAt = expiryFrom(now, q.valid_days);
    // The turnaround the line's load gives today, stated on the quote as sent.
    const planLines = await trx
      .selectFrom('quote_lines as l')
      .innerJoin('parts as p', 'p.id', 'l.part_id')
      .innerJoin('finishes as f', 'f.id', 'l.finish_id')
      .select(['l.finish_id', 'l.quantity', 'p.area_dm2', 'f.parts_per_load'])
      .where('l.quote_id', '=', q.id)
      .execute();
    const turnaround = await quoteTurnaroundDays(planLines.map((l) => ({ finishId: l.finish_id, quantity: l.quantity, partAreaDm2: Number(l.area_dm2), partsPerLoad: l.parts_per_load })), trx);
    await trx
      .updateTable('quotes')
      .set({ status: 'sent', contact_user_id: input.contactUserId, sent_at: now, expires_at: expiresAt, turnaround_days: turnaround, updated_at: sql`now()` })
      .where('id', '=', q.id)
      .execute();
    await trx.insertInto('audit_log').values({ actor_id: actor.id, action: 'quote.send', entity: 'quote', entity_id: q.id, detail: JSON.stringify({ to: input.contactUserId }) }).execute();
    return { expiresAt };
  });
}

/** Copies the quote to the next revision letter as a draft; the old one becomes read-only. */
export async function reviseQuote(actor: Actor, quoteId: string, conn: Db = defaultDb, now: Date = new Date()): Promise<{ id: string; revision: string }> {
  assertCan(actor, 'quotes.write');
  return conn.transaction().execute(async (trx) => {
    const q = await lockQuote(trx, quoteId);
    const status = effectiveQuoteStatus(q, now);
    if (!canRevise(status)) {
      throw new AppError('CONFLICT', `A ${QUOTE_STATUS_LABELS[status].toLowerCase()} quote cannot be revised${status === 'draft' ? ': edit it directly' : ''}.`);
    }
    const revision = nextRevision(q.revision);
    if (!revision) throw new AppError('CONFLICT', `${quoteLabel(q)} has used every revision letter. Start a new quote.`);
    const copy = await trx
      .insertInto('quotes')
      .values({
        number: q.number,
        revision,
        customer_id: q.customer_id,
        contact_user_id: q.contact_user_id,
        rate_set_id: q.rate_set_id,
        valid_days: q.valid_days,
        is_rush: q.is_rush,
        notes: q.notes,
        total_cents: q.total_cents,
        previous_revision_id: q.id,
        created_by: actor.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await sql`
      insert into quote_lines (quote_id, line_no, part_id, finish_id, quantity, pricing_basis, calculation, cost,
        computed_total_cents, override_total_cents, override_reason, override_by, override_at, total_cents, unit_price_cents)
      select ${copy.id}, line_no, part_id, finish_id, quantity, pricing_basis, calculation, cost,
        computed_total_cents, override_total_cents, override_reason, override_by, override_at, total_cents, unit_price_cents
      from quote_lines where quote_id = ${q.id}
    `.execute(trx);
    await trx.updateTable('quotes').set({ status: 'superseded', updated_at: sql`now()` }).where('id', '=', q.id).execute();
    await trx.insertInto('audit_log').values({ actor_id: actor.id, action: 'quote.revise', entity: 'quote', entity_id: copy.id, detail: JSON.stringify({ from: q.id, revision }) }).execute();
    return { id: copy.id, revision };
  });
}

/** Rewrites sent quotes whose date has passed as expired (reads already treat them so). */
export async function expireOverdueQuotes(conn: Db = defaultDb, now: Date = new Date()): Promise<number> {
  const r = await conn
    .updateTable('quotes')
    .set({ status: 'expired', updated_at: sql`now()` })
    .where('status', '=', 'sent')
    .where('expires_at', '<=', now)
    .executeTakeFirst();
  return Number(r.numUpdatedRows);
}

async function lockOwnOpenQuote(trx: Parameters<typeof lockQuote>[0], actor: Actor, quoteId: string, now: Date) {
  const customerId = ownCustomerId(actor);
  // Scoped by the contact's own company: another company's quote id finds nothing.
  const q = await trx.selectFrom('quotes').selectAll().where('id', '=', quoteId).where('customer_id', '=', customerId).forUpdate().executeTakeFirst();
  if (!q || q.status === 'draft' || q.status === 'superseded') throw new AppError('NOT_FOUND', 'That quote does not exist.');
  const status = effectiveQuoteStatus(q, now);
  if (status === 'expired') throw new AppError('CONFLICT', `This quote expired on ${q.expires_at?.toISOString().slice(0, 10)}. Ask us for a new revision.`);
  if (status !== 'sent') throw new AppError('CONFLICT', `This quote is already ${QUOTE_STATUS_LABELS[status].toLowerCase()}.`);
  return q;
}

export type Acceptance = { quoteId: string; label: string; estimatorId: string | null; workOrders: { id: string; number: string }[] };

export async function acceptQuote(actor: Actor, input: AcceptQuoteInput, conn: Db = defaultDb, now: Date = new Date()): Promise<Acceptance> {
  return conn.transaction().execute(async (trx) => {
    const q = await lockOwnOpenQuote(trx, actor, input.quoteId, now);
    if (input.neededBy !== null && input.neededBy < now.toISOString().slice(0, 10)) {
      throw new AppError('BAD_INPUT', 'The date you need the parts by is in the past.', { neededBy: ['Choose today or a later date.'] });
    }
    const lines = await trx.selectFrom('quote_lines').selectAll().where('quote_id', '=', q.id).execute();
    await trx
      .updateTable('quotes')
      .set({ status: 'accepted', po_number: input.poNumber, decided_at: now, decided_by: actor.id, updated_at: sql`now()` })
      .where('id', '=', q.id)
      .execute();
    const workOrders = await createWorkOrdersForQuote(trx, q, lines, { poNumber: input.poNumber, neededBy: input.neededBy, actorId: actor.id, at: now });
    await trx
      .insertInto('audit_log')
      .values({ actor_id: actor.id, action: 'quote.accept', entity: 'quote', entity_id: q.id, detail: JSON.stringify({ po: input.poNumber, workOrders: workOrders.map((w) => w.number) }) })
      .execute();
    return { quoteId: q.id, label: quoteLabel(q), estimatorId: q.created_by, workOrders };
  });
}

export async function declineQuote(actor: Actor, input: { quoteId: string; reason: string }, conn: Db = defaultDb, now: Date = new Date()): Promise<{ label: string; estimatorId: string | null }> {
  return conn.transaction().execute(async (trx) => {
    const q = await lockOwnOpenQuote(trx, actor, input.quoteId, now);
    await trx
      .updateTable('quotes')
      .set({ status: 'declined', decline_reason: input.reason, decided_at: now, decided_by: actor.id, updated_at: sql`now()` })
      .where('id', '=', q.id)
      .execute();
    await trx.insertInto('audit_log').values({ actor_id: actor.id, action: 'quote.decline', entity: 'quote', entity_id: q.id, detail: JSON.stringify({ reason: input.reason }) }).execute();
    return { label: quoteLabel(q), estimatorId: q.created_by };
  });
}
