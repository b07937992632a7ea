// The device's outbox bound to the browser: localStorage, fetch to POST /api/floor/entries, Web Locks
// so two open tabs never send at once, and a retry when the connection returns and every few seconds.
import { useEffect, useState, useSyncExternalStore } from 'react';
import type { FloorEntryPayload } from '@/lib/bath/schemas';
import { classifyResponse, FloorQueue, parseStoredQueue, type QueuedEntry, type SendResult } from './offline-queue';

const STORAGE_KEY = 'ampwright.floor.outbox.v1';
const RETRY_EVERY_MS = 5000;
const SEND_TIMEOUT_MS = 15_000;

async function sendToServer(payload: FloorEntryPayload): Promise<SendResult> {
  let res: Response;
  try {
    res = await fetch('/api/floor/entries', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(payload),
      credentials: 'same-origin',
      signal: AbortSignal.timeout(SEND_TIMEOUT_MS),
    });
  } catch {
    return { status: 'retry', message: 'No connection: waiting to send.' };
  }
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // A proxy's HTML error page: treated by status below.
  }
  const status = classifyResponse(res.status);
  if (status === 'stored') return { status, answer: body };
  const message =
    (body as { error?: { message?: string } } | null)?.error?.message ??
    (res.status === 401 ? 'Signed out: sign in again to send.' : `The server answered ${res.status}.`);
  return status === 'retry' ? { status, message: res.status === 401 ? 'Signed out: sign in again to send.' : message } : { status, message };
}

function exclusive(work: () => Promise<void>): Promise<void> {
  const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined;
  return locks ? locks.request('ampwright-floor-outbox', () => work()).then(() => undefined) : work();
}

let queue: FloorQueue | null = null;

/** The tab's one outbox (created on first use in the browser). */
export function floorQueue(): FloorQueue {
  if (queue) return queue;
  const q = new FloorQueue(
    {
      load: () => parseStoredQueue(window.localStorage.getItem(STORAGE_KEY)),
      save: (entries) => window.localStorage.setItem(STORAGE_KEY, JSON.stringify(entries)),
    },
    sendToServer,
    exclusive,
  );
  window.addEventListener('online', () => void q.flush());
  window.addEventListener('storage', (e) => {
    if (e.key === STORAGE_KEY) q.reload();
  });
  window.setInterval(() => {
    if (q.list().some((e) => e.state === 'waiting')) void q.flush();
  }, RETRY_EVERY_MS);
  queue = q;
  void q.flush();
  return q;
}

const EMPTY: readonly QueuedEntry[] = [];

/** The outbox's entries, re-rendering when they change. */
export function useFloorOutbox(): readonly QueuedEntry[] {
  return useSyncExternalStore(
    (onChange) => floorQueue().subscribe(onChange),
    () => floorQueue().list(),
    () => EMPTY,
  );
}

/**
 * A fresh key for one entry, made on the device so a resend carries the same one. getRandomValues
 * works on plain http too (a tablet on the shop network), where randomUUID is not offered.
 */
export function newEntryKey(): string {
  const b = crypto.getRandomValues(new Uint8Array(16));
  const hex = Array.from(b, (x) => x.toString(16).padStart(2, '0')).join('');
  return `floor-${hex}`;
}

export type EntryFate = { state: 'none' } | { state: 'waiting' | 'failed'; message?: string } | { state: 'sent'; answer: unknown };

/** What became of one entry this screen made: still waiting, refused, or stored (with the answer). */
export function useEntryFate(key: string | null): EntryFate {
  const entries = useFloorOutbox();
  const [sent, setSent] = useState<{ key: string; answer: unknown } | null>(null);
  useEffect(() => {
    if (!key) return;
    return floorQueue().onSent((entry, answer) => {
      if (entry.key === key) setSent({ key, answer });
    });
  }, [key]);
  if (!key) return { state: 'none' };
  if (sent?.key === key) return { state: 'sent', answer: sent.answer };
  const queued = entries.find((e) => e.key === key);
  if (queued) return { state: queued.state, message: queued.message };
  // Gone from the outbox: sent before this screen listened (answer remembered), or by another tab.
  return { state: 'sent', answer: floorQueue().answerFor(key) ?? null };
}
