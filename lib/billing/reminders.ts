import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { sendEmail } from '@/lib/email/mailer';
import { daysBetweenIso, isoDate, todayIso } from './dates';
import { reminderText } from './email-texts';
import { getInvoiceDetail, shopDetails } from './queries';
import { reminderStageFor } from './reminder-stages';

// Overdue reminders, run daily by the background worker. Each stage is sent at most once per
// invoice: the invoice_reminders row is written in the same transaction as the send, and its key
// (invoice, stage) makes a second row impossible, even when two workers run at once.

export type ReminderRun = { asOf: string; sent: string[]; skipped: number; failed: string[] };

class ReminderNotSent extends Error {}

export async function sendOverdueReminders(asOf: string = todayIso(), database: Kysely<Database> = defaultDb): Promise<ReminderRun> {
  const run: ReminderRun = { asOf, sent: [], skipped: 0, failed: [] };
  const due = await database
    .selectFrom('invoices')
    .select(['id', 'number', 'due_on', 'billing_email'])
    .where('status', 'in', ['issued', 'partly_paid'])
    .where('due_on', '<', sql<Date>`${asOf}::date`)
    .where('billing_email', 'is not', null)
    .orderBy('due_on')
    .execute();
  const shop = await shopDetails(database);
  for (const inv of due) {
    const days = daysBetweenIso(isoDate(inv.due_on), asOf);
    const stage = reminderStageFor(days);
    if (!stage) continue;
    try {
      const sent = await database.transaction().execute(async (trx) => {
        const claimed = await trx
          .insertInto('invoice_reminders')
          .values({ invoice_id: inv.id, stage, sent_to: inv.billing_email! })
          .onConflict((oc) => oc.columns(['invoice_id', 'stage']).doNothing())
          .returning('stage')
          .executeTakeFirst();
        if (!claimed) return false;
        const detail = await getInvoiceDetail('staff', inv.id, trx);
        if (!detail || detail.summary.openCents <= 0) throw new ReminderNotSent('paid meanwhile');
        const { subject, text } = reminderText(detail, days, shop.name);
        const mail = await sendEmail({ to: inv.billing_email!, subject, text, template: `invoice-reminder-${stage}` });
        // Undo the claim so the next run tries again; the mailer has logged the failure.
        if (!mail.ok) throw new ReminderNotSent('mail failed');
        return true;
      });
      if (sent) run.sent.push(`${inv.number} (${stage})`);
      else run.skipped += 1;
    } catch (err) {
      if (!(err instanceof ReminderNotSent) && !(err instanceof AppError)) throw err;
      if (err.message === 'paid meanwhile') run.skipped += 1;
      else run.failed.push(inv.number);
    }
  }
  return run;
}
