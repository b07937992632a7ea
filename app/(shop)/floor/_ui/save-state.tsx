'use client';

import { StatusShape } from '@/components/ui/status-shape';
import type { EntryFate } from '@/lib/floor/browser-queue';

/** The fate of an entry just saved, in words and shape: stored, waiting to send, or refused. */
export function SaveState({ fate, what }: { fate: EntryFate; what: string }) {
  if (fate.state === 'none') return null;
  if (fate.state === 'sent') {
    return (
      <p role="status" className="flex items-center gap-2 rounded-md bg-ok-soft px-3 py-3 text-lg font-semibold text-ok" data-testid="save-state">
        <StatusShape status="ok" className="size-6" />
        {what} saved.
      </p>
    );
  }
  if (fate.state === 'waiting') {
    return (
      <p role="status" className="flex items-center gap-2 rounded-md bg-near-soft px-3 py-3 text-lg font-semibold text-ink" data-testid="save-state">
        <StatusShape status="none" className="size-6 text-near" />
        {what} kept on this device — waiting to send.
      </p>
    );
  }
  return (
    <p role="alert" className="flex items-start gap-2 rounded-md bg-out-soft px-3 py-3 text-lg font-semibold text-out" data-testid="save-state">
      <StatusShape status="out" className="mt-1 size-6" />
      <span>
        {what} not accepted. {fate.message}
      </span>
    </p>
  );
}
