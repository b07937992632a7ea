// How a quote states its turnaround (working days from the parts' arrival to shipping).
import type { WorkOrderState } from '@/db/types';
import { formatDay as shopDay } from '@/lib/quotes/format';

export function turnaroundText(days: number | null | undefined): string | null {
  if (days === null || days === undefined) return null;
  return `Turnaround ${days} working ${days === 1 ? 'day' : 'days'} from receipt of parts, at the line's load when quoted`;
}

/** Where an order stands on the line's plan, as the order pages write it for staff and customer alike. */
export function plannedText(planned: { start: string | null; finish: string | null } | undefined, state: WorkOrderState, formatDay: (d: string | null) => string = shopDay): string {
  if (planned?.finish) return planned.start === planned.finish ? formatDay(planned.finish) : `${formatDay(planned.start)} to ${formatDay(planned.finish)}`;
  return state === 'accepted' || state === 'received' || state === 'in_process' ? 'Not planned yet' : 'Done';
}
