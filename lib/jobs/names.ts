// Queue names of the background worker (pg-boss). One constant per job; handlers and schedules
// are listed in ./registry.ts.
export const JOB = {
  bathOverdueCheck: 'bath-overdue-check',
  bathEscalation: 'bath-alert-escalation',
  bathAdditionCheck: 'bath-addition-check',
  bathAlertEmails: 'bath-alert-emails',
  invoiceReminders: 'invoice-overdue-reminders',
  bakeWindowAlerts: 'quality-bake-window-alerts',
  quoteExpiry: 'quote-expiry',
} as const;

export type JobName = (typeof JOB)[keyof typeof JOB];
