import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { AlertEmailKind, Database, Role } from '@/db/types';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { inTransaction } from '@/lib/records/transaction';
import { ALERT_KIND_LABEL } from './alerts';
import { formatWhen } from './display';

// E-mail about bath alerts: supervisors when one is raised, owners when it escalates. Each
// (alert, kind, recipient) is claimed in bath_alert_emails in the transaction that sends it: a job
// or request that runs twice, or at once, sends the message once (the second waits on the first's
// claim), and a sender that dies before the commit leaves no claim, so the next run sends it.

const RECIPIENT_ROLE: Record<AlertEmailKind, Role> = { raised: 'supervisor', escalated: 'owner' };

async function recipients(executor: Kysely<Database>, role: Role): Promise<string[]> {
  const rows = await executor.selectFrom('users').select('email').where('role', '=', role).where('is_active', '=', true).execute();
  return rows.map((r) => r.email);
}

/** Sends the alert's message of this kind to everyone who has not had it yet; returns how many were sent. */
export async function notifyAlert(alertId: string, kind: AlertEmailKind, executor: Kysely<Database> = defaultDb): Promise<number> {
  const alert = await executor
    .selectFrom('bath_alerts as al')
    .innerJoin('tanks as t', 't.id', 'al.tank_id')
    .leftJoin('tank_analytes as a', 'a.id', 'al.analyte_id')
    .select(['al.id', 'al.kind', 'al.message', 'al.raised_at', 'al.state', 't.code', 't.name as tank_name', 'a.name as analyte_name'])
    .where('al.id', '=', alertId)
    .executeTakeFirst();
  if (!alert || alert.state === 'acknowledged') return 0;
  const what = `${alert.code} ${alert.tank_name}${alert.analyte_name ? `: ${alert.analyte_name}` : ''}`;
  const subject = `${kind === 'escalated' ? 'Escalated, not yet acknowledged' : ALERT_KIND_LABEL[alert.kind]} — ${what}`;
  const text = [
    kind === 'escalated'
      ? `This bath alert has not been acknowledged since ${formatWhen(alert.raised_at)} and has been escalated to you.`
      : 'A bath alert was raised.',
    '',
    `Tank: ${alert.code} ${alert.tank_name}`,
    ...(alert.analyte_name ? [`Analyte: ${alert.analyte_name}`] : []),
    `What: ${ALERT_KIND_LABEL[alert.kind]}`,
    alert.message,
    '',
    `Acknowledge it with the corrective action taken: ${appUrl('/baths/alerts')}`,
  ].join('\n');
  let sent = 0;
  for (const to of await recipients(executor, RECIPIENT_ROLE[kind])) {
    const ok = await inTransaction(executor, async (trx) => {
      const claimed = await trx
        .insertInto('bath_alert_emails')
        .values({ alert_id: alertId, kind, recipient: to, status: 'sent', sent_at: sql`now()` })
        .onConflict((oc) =>
          // A message that failed (mail server down), or was left pending by an older version, is claimed again.
          oc.columns(['alert_id', 'kind', 'recipient']).doUpdateSet({ status: 'sent', sent_at: sql`now()` }).where('bath_alert_emails.status', '<>', 'sent'),
        )
        .returning('alert_id')
        .executeTakeFirst();
      if (!claimed) return false;
      const result = await sendEmail({ to, subject, text, template: `bath-alert-${kind}` });
      if (!result.ok) {
        await trx
          .updateTable('bath_alert_emails')
          .set({ status: 'failed', sent_at: null })
          .where('alert_id', '=', alertId)
          .where('kind', '=', kind)
          .where('recipient', '=', to)
          .execute();
      }
      return result.ok;
    });
    if (ok) sent++;
  }
  return sent;
}

/** Sends whatever is still owed for recent open alerts (a request that raised one may have died before mailing). */
export async function sendOwedAlertEmails(executor: Kysely<Database> = defaultDb): Promise<number> {
  const alerts = await executor
    .selectFrom('bath_alerts')
    .select(['id', 'state'])
    .where('state', '<>', 'acknowledged')
    .where(sql<boolean>`raised_at > now() - interval '7 days'`)
    .execute();
  let sent = 0;
  for (const a of alerts) {
    sent += await notifyAlert(a.id, 'raised', executor);
    if (a.state === 'escalated') sent += await notifyAlert(a.id, 'escalated', executor);
  }
  return sent;
}
