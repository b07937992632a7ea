'use client';

import { useRouter } from 'next/navigation';
import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';
import { StatusShape } from '@/components/ui/status-shape';
import { floorQueue, useFloorOutbox } from '@/lib/floor/browser-queue';

/**
 * Entries kept on this device that the server has not confirmed yet: "waiting to send" while the
 * connection is down, "not accepted" when the server refused one (with its reason).
 */
export function OutboxPanel() {
  const entries = useFloorOutbox();
  const [online, setOnline] = useState(true);
  const router = useRouter();
  // Whatever this device sends (now, or later when the connection returns), the page's own lists
  // (recent entries, last values) are read again from the server so they show it without a reload.
  useEffect(() => floorQueue().onSent(() => router.refresh()), [router]);
  useEffect(() => {
    setOnline(navigator.onLine);
    const up = () => setOnline(true);
    const down = () => setOnline(false);
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    void floorQueue().flush();
    return () => {
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
    };
  }, []);
  const waiting = entries.filter((e) => e.state === 'waiting');
  const failed = entries.filter((e) => e.state === 'failed');
  return (
    <section aria-label="Entries on this device" aria-live="polite" className="flex flex-col gap-2 empty:hidden">
      {!online ? (
        <p className="flex items-center gap-2 rounded-md border border-near/40 bg-near-soft px-3 py-2 text-base font-medium text-ink">
          <StatusShape status="near" className="size-5 text-near" />
          No connection. Entries are kept on this device and sent when it returns.
        </p>
      ) : null}
      {waiting.length > 0 ? (
        <div className="rounded-md border border-surface-line bg-surface px-3 py-2">
          <p className="text-base font-semibold text-ink" data-testid="outbox-count">
            {waiting.length} {waiting.length === 1 ? 'entry' : 'entries'} waiting to send
          </p>
          <ul className="mt-1 flex flex-col gap-1 text-sm">
            {waiting.map((e) => (
              <li key={e.key} className="flex items-center gap-2" data-testid="outbox-entry">
                <StatusShape status="none" className="size-4 text-ink-muted" />
                <span className="min-w-0 flex-1 truncate">{e.label}</span>
                <span className="shrink-0 text-ink-muted">Waiting to send</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {failed.map((e) => (
        <div key={e.key} className="flex flex-col gap-2 rounded-md border border-out/40 bg-out-soft px-3 py-2 text-sm text-ink" role="alert">
          <p className="flex items-start gap-2 font-medium">
            <StatusShape status="out" className="mt-0.5 size-4 text-out" />
            <span>
              Not accepted: {e.label}. {e.message}
            </span>
          </p>
          <div className="flex gap-2">
            <Button size="lg" variant="secondary" onClick={() => void floorQueue().retry(e.key)}>
              Try again
            </Button>
            <Button size="lg" variant="ghost" onClick={() => floorQueue().discard(e.key)}>
              Discard
            </Button>
          </div>
        </div>
      ))}
    </section>
  );
}
