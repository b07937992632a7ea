// Overdue reminders as the background worker sends them: each stage once per invoice, even when
// the job runs again or twice at the same time, and never for an invoice that is paid.
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { addDaysIso, todayIso } from '@/lib/billing/dates';
import { issueInvoice, recordManualPayment } from '@/lib/billing/mutations';
import { sendOverdueReminders } from '@/lib/billing/reminders';
import { customerId, makeOrder, OWNER, sessionUser } from './fixtures';

process.env.SMTP_PORT ??= '2526'; // the test mail fake
afterAll(() => db.destroy());

async function overdueInvoice(daysAgo: number) {
  const owner = await sessionUser(OWNER);
  const o = await makeOrder({ customer: 'HVI' });
  return issueInvoice(owner.id, { customerId: await customerId('HVI'), orderIds: [o.id], extras: [], issuedOn: addDaysIso(todayIso(), -daysAgo) });
}

const remindersOf = (invoiceId: string) => db.selectFrom('invoice_reminders').select(['stage', 'sent_to']).where('invoice_id', '=', invoiceId).execute();

describe('overdue reminders', () => {
  it('sends the stage reached once, and nothing on the next run', async () => {
    // Issued 100 days ago on HVI's net 45 terms: due 55 days ago, so the 30-day stage applies.
    const inv = await overdueInvoice(100);
    const first = await sendOverdueReminders();
    expect(first.sent).toContain(`${inv.number} (overdue_30)`);
    expect(await remindersOf(inv.id)).toEqual([{ stage: 'overdue_30', sent_to: 'payables@halvorsen-valve.test' }]);
    const mail = await db.selectFrom('emails').select(['subject', 'status']).where('template', '=', 'invoice-reminder-overdue_30').where('subject', 'like', `%${inv.number}%`).execute();
    expect(mail).toHaveLength(1);
    expect(mail[0]!.subject).toMatch(new RegExp(`^Reminder: invoice ${inv.number} is 55 days past due`));

    const second = await sendOverdueReminders();
    expect(second.sent.join()).not.toContain(inv.number);
    expect(await remindersOf(inv.id)).toHaveLength(1);
  });

  it('sends once when two runs overlap', async () => {
    const inv = await overdueInvoice(50); // due 5 days ago: the first stage
    const runs = await Promise.all([sendOverdueReminders(), sendOverdueReminders()]);
    expect(runs.flatMap((r) => r.sent).filter((s) => s.startsWith(inv.number))).toEqual([`${inv.number} (overdue_1)`]);
    expect(await remindersOf(inv.id)).toHaveLength(1);
  });

  it('skips invoices not yet due and invoices already paid', async () => {
    const owner = await sessionUser(OWNER);
    const notDue = await overdueInvoice(45); // due today: not late yet
    const paid = await overdueInvoice(80);
    const open = (await db.selectFrom('invoices').select('total_cents').where('id', '=', paid.id).executeTakeFirstOrThrow()).total_cents;
    await recordManualPayment(owner.id, { invoiceId: paid.id, amount: open, method: 'check', reference: 'Check 5', receivedOn: todayIso() });
    const run = await sendOverdueReminders();
    expect(run.sent.join()).not.toMatch(new RegExp(`${notDue.number}|${paid.number}`));
    expect(await remindersOf(notDue.id)).toEqual([]);
    expect(await remindersOf(paid.id)).toEqual([]);
  });
});
