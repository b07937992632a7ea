// When overdue reminders go out. Pure.
import type { ReminderStage } from '@/db/types';

/** Days past due at which each reminder goes out; our own cadence, not a published rule. */
export const REMINDER_STAGES: readonly { stage: ReminderStage; days: number }[] = [
  { stage: 'overdue_1', days: 1 },
  { stage: 'overdue_15', days: 15 },
  { stage: 'overdue_30', days: 30 },
  { stage: 'overdue_60', days: 60 },
];

/** The latest stage reached; earlier stages missed (worker down) are not sent late. Pure. */
export function reminderStageFor(daysPastDue: number): ReminderStage | null {
  let reached: ReminderStage | null = null;
  for (const s of REMINDER_STAGES) if (daysPastDue >= s.days) reached = s.stage;
  return reached;
}
