import 'server-only';
// The scheduled check that warns supervisors before an order's relief-bake window closes. Each
// order is claimed in bake_window_alerts in the transaction that sends its one message to all the
// supervisors, so however often the job runs, and however many workers run it, they are e-mailed
// once; a send that fails, or a worker that dies before the commit, leaves it for the next run.
import { type Kysely, sql } from 'kysely';
import { db as appDb } from '@/db';
import type { Database } from '@/db/types';
import { cautionTexts, SAFETY_DEFERRAL } from '@/components/ui/caution';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { inTransaction } from '@/lib/records/transaction';
import { formatShopTime, shopTimeZone } from '../shop-time';

/** Warn this long before the window closes; the job (lib/jobs/registry.ts) runs every 5 min. */
export const BAKE_ALERT_LEAD_MINUTES = 60;

export type OpenBakeWindow = { workOrderId: string; number: string; platingEndedAt: Date; deadlineAt: Date; finishName: string; partNumber: string };

/** Orders that need a bake, have plated, and have no bake recorded yet, with their deadlines. */
export async function findOpenBakeWindows(db: Kysely<Database> = appDb): Promise<OpenBakeWindow[]> {
  const rows = await db
    .selectFrom('work_orders as w')
    .innerJoin('finishes as f', 'f.id', 'w.finish_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .innerJoin('plating_runs as r', 'r.work_order_id', 'w.id')
    .select(['w.id', 'w.number', 'f.name as finish_name', 'p.part_number', 'f.bake_window_hours'])
    .select(sql<Date>`max(r.ended_at)`.as('plating_ended_at'))
    .where('w.bake_required', '=', true)
    .where('w.state', 'in', ['in_process', 'plated'])
    .where(({ not, exists, selectFrom }) => not(exists(selectFrom('bake_records as b').select('b.id').whereRef('b.work_order_id', '=', 'w.id'))))
    .groupBy(['w.id', 'w.number', 'f.name', 'p.part_number', 'f.bake_window_hours'])
    .execute();
  return rows
    .map((r) => ({
      workOrderId: r.id,
      number: r.number,
      finishName: r.finish_name,
      partNumber: r.part_number,
      platingEndedAt: new Date(r.plating_ended_at),
      deadlineAt: new Date(new Date(r.plating_ended_at).getTime() + Number(r.bake_window_hours) * 3_600_000),
    }))
    .sort((a, b) => a.deadlineAt.getTime() - b.deadlineAt.getTime());
}

type Mailer = typeof sendEmail;

class BakeAlertNotSent extends Error {}

export async function alertClosingBakeWindows(
  opts: { db?: Kysely<Database>; now?: Date; leadMinutes?: number; send?: Mailer } = {},
): Promise<{ alerted: string[] }> {
  const db = opts.db ?? appDb;
  const now = opts.now ?? new Date();
  const lead = (opts.leadMinutes ?? BAKE_ALERT_LEAD_MINUTES) * 60_000;
  const send = opts.send ?? sendEmail;
  const due = (await findOpenBakeWindows(db)).filter((w) => w.deadlineAt.getTime() - now.getTime() <= lead);
  if (due.length === 0) return { alerted: [] };
  const supervisors = await db.selectFrom('users').select('email').where('role', '=', 'supervisor').where('is_active', '=', true).execute();
  const to = supervisors.map((s) => s.email);
  const tz = shopTimeZone();
  const alerted: string[] = [];
  for (const w of due) {
    const minutes = Math.round((w.deadlineAt.getTime() - now.getTime()) / 60_000);
    const when = minutes >= 0 ? `closes in ${minutes} min` : `closed ${-minutes} min ago`;
    const caution = cautionTexts['high-strength-steel-bake'];
    const claimed = await inTransaction(db, async (trx) => {
      const row = await trx
        .insertInto('bake_window_alerts')
        .values({ work_order_id: w.workOrderId, deadline_at: w.deadlineAt, sent_to: to })
        .onConflict((oc) => oc.column('work_order_id').doNothing())
        .returning('work_order_id')
        .executeTakeFirst();
      if (!row || to.length === 0) return !!row;
      // One message to every supervisor: one acceptance by the relay, so no partial send to undo.
      const mail = await send({
        to: to.join(', '),
        subject: `Bake window ${when}: ${w.number}`,
        template: 'quality.bake-window',
        text: [
          `Work order ${w.number} (${w.partNumber}, ${w.finishName}) finished plating at ${formatShopTime(w.platingEndedAt, tz)}.`,
          `Its embrittlement-relief bake must start by ${formatShopTime(w.deadlineAt, tz)}: the window ${when}.`,
          '',
          `Record the bake: ${appUrl(`/quality/orders/${w.workOrderId}`)}`,
          '',
          `${caution.title}. ${caution.text} ${SAFETY_DEFERRAL}`,
        ].join('\n'),
      });
      // Undo the claim so the next run tries again; the mailer has logged the failure.
      if (!mail.ok) throw new BakeAlertNotSent();
      return true;
    }).catch((err: unknown) => {
      if (err instanceof BakeAlertNotSent) return false;
      throw err;
    });
    if (claimed) alerted.push(w.workOrderId);
  }
  return { alerted };
}
