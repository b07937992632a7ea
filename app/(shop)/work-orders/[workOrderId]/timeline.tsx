import type { WorkOrderState } from '@/db/types';
import { formatDateTime } from '@/lib/quotes/format';

type Event = { id: number; from_state: WorkOrderState | null; to_state: WorkOrderState; note: string; created_at: Date; actor_name: string | null };

/** Each state change with when and who, oldest first; an event that keeps the state is a dock record (more parts in, part of the lot out). */
export function Timeline({ events, labels }: { events: Event[]; labels: Record<WorkOrderState, string> }) {
  return (
    <ol className="flex flex-col gap-0 border-l-2 border-surface-line pl-4">
      {events.map((e) => (
        <li key={e.id} className="relative pb-3">
          <span aria-hidden="true" className="absolute -left-[1.4rem] top-1.5 size-2.5 rounded-full bg-action" />
          <p className="text-sm font-medium">{e.from_state === e.to_state ? (e.note.startsWith('Shipment') ? 'Part shipped' : 'More parts received') : labels[e.to_state]}</p>
          <p className="text-xs text-ink-muted">
            {formatDateTime(e.created_at)} · {e.actor_name ?? 'system'}
            {e.note ? ` · ${e.note}` : ''}
          </p>
        </li>
      ))}
    </ol>
  );
}
