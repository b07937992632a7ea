import 'server-only';
import { sendOwedAlertEmails } from '@/lib/bath/alert-mail';
import { checkMissingAdditions, checkOverdueAnalyses, escalateUnacknowledged } from '@/lib/bath/scheduled-checks';
import { sendOverdueReminders } from '@/lib/billing/reminders';
import { alertClosingBakeWindows } from '@/lib/quality/bake/alerts';
import { expireOverdueQuotes } from '@/lib/quotes/lifecycle';
import { JOB } from './names';

// Every background job in one list: its queue, when it runs (cron, UTC) and what it does. Another
// area adds its jobs here (invoice reminders, bake windows …). Handlers must be idempotent: a job
// may run twice (a retry after a crash, two workers), and must then change nothing more.

export type JobDefinition = {
  name: string;
  /** Five-field cron in UTC; omit for jobs that are only sent on demand. */
  cron?: string;
  description: string;
  handler: (data: unknown) => Promise<unknown>;
  /** A run's time limit, after which a dead worker's run is retried (default DEFAULT_EXPIRE_SECONDS in ./boss). */
  expireInSeconds?: number;
};

export const JOBS: readonly JobDefinition[] = [
  {
    name: JOB.bathOverdueCheck,
    cron: '*/5 * * * *',
    description: 'Raise an alert for each analyte whose analysis is overdue for its frequency.',
    handler: () => checkOverdueAnalyses(),
  },
  {
    name: JOB.bathEscalation,
    cron: '*/5 * * * *',
    description: 'Escalate alerts left unacknowledged past the set time to the owner.',
    handler: () => escalateUnacknowledged(),
  },
  {
    name: JOB.bathAdditionCheck,
    cron: '*/10 * * * *',
    description: 'Raise an alert when a recommended correction was not recorded in time.',
    handler: () => checkMissingAdditions(),
  },
  {
    name: JOB.bathAlertEmails,
    cron: '* * * * *',
    description: 'Send alert e-mails still owed (a request that raised an alert may have died before mailing).',
    handler: () => sendOwedAlertEmails(),
  },
  {
    name: JOB.invoiceReminders,
    cron: '15 7 * * *',
    description: 'E-mail a reminder for each invoice past its due date; each reminder stage goes out once per invoice.',
    handler: () => sendOverdueReminders(),
  },
  {
    name: JOB.bakeWindowAlerts,
    cron: '*/5 * * * *',
    description: 'E-mail supervisors once when an order\'s embrittlement-relief bake window is about to close.',
    handler: () => alertClosingBakeWindows(),
  },
  {
    name: JOB.quoteExpiry,
    cron: '20 0 * * *',
    description: 'Mark sent quotes past their valid-until date as expired (pages already show them so); the customer can no longer accept them.',
    handler: async () => ({ expired: await expireOverdueQuotes() }),
  },
];
