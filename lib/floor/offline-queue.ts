// The floor device's outbox. Every entry (analysis, addition, meter reading) is saved on the device
// first, with its own key, and then sent; while the connection is down it waits and is shown as
// waiting. Entries go out one at a time in the order they were made. A send whose answer is lost
// is simply sent again: the server stores an entry once per key and answers a resend with the
// original. No React and no browser globals here: storage and sending are passed in (tests use fakes).
import type { FloorEntryPayload } from '@/lib/bath/schemas';

export type QueuedEntry = {
  key: string;
  payload: FloorEntryPayload;
  /** What the plater sees in the list, e.g. "N-NI1 · Nickel metal 44.0 g/L". */
  label: string;
  createdAt: string;
  state: 'waiting' | 'failed';
  attempts: number;
  /** Why the last try did not go through (no connection, or the server's refusal). */
  message?: string;
};

export type SendResult =
  | { status: 'stored'; answer: unknown }
  /** The server refused the entry itself: sending it again will not help. */
  | { status: 'rejected'; message: string }
  /** No connection, a timeout, a server hiccup or an expired sign-in: try again later. */
  | { status: 'retry'; message: string };

export type QueueStorage = { load: () => QueuedEntry[]; save: (entries: QueuedEntry[]) => void };
export type Sender = (payload: FloorEntryPayload) => Promise<SendResult>;
export type SentListener = (entry: QueuedEntry, answer: unknown) => void;

export class FloorQueue {
  private entries: QueuedEntry[];
  private listeners = new Set<() => void>();
  private sentListeners = new Set<SentListener>();
  private flushing: Promise<void> | null = null;
  /** The server's answers to the last few entries sent from this tab. */
  private answers = new Map<string, unknown>();

  constructor(
    private readonly storage: QueueStorage,
    private readonly send: Sender,
    private readonly exclusive: (work: () => Promise<void>) => Promise<void> = (work) => work(),
  ) {
    this.entries = storage.load();
  }

  list(): readonly QueuedEntry[] {
    return this.entries;
  }

  /** Keeps the entry on the device (before any network), then tries to send what is waiting. */
  add(entry: Pick<QueuedEntry, 'key' | 'payload' | 'label'>): Promise<void> {
    this.reload();
    if (!this.entries.some((e) => e.key === entry.key)) {
      this.entries = [...this.entries, { ...entry, createdAt: new Date().toISOString(), state: 'waiting', attempts: 0 }];
      this.persist();
    }
    return this.flush();
  }

  /** Re-reads storage (another tab may have sent or added entries). */
  reload(): void {
    this.entries = this.storage.load();
    this.emit();
  }

  /** The server's answer to an entry this tab sent, if it is still remembered. */
  answerFor(key: string): unknown {
    return this.answers.get(key);
  }

  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  onSent(listener: SentListener): () => void {
    this.sentListeners.add(listener);
    return () => this.sentListeners.delete(listener);
  }

  discard(key: string): void {
    this.reload();
    this.entries = this.entries.filter((e) => e.key !== key);
    this.persist();
  }

  retry(key: string): Promise<void> {
    this.reload();
    this.entries = this.entries.map((e) => (e.key === key ? { ...e, state: 'waiting', message: undefined } : e));
    this.persist();
    return this.flush();
  }

  /** Sends the waiting entries in order; stops at the first that must wait for the connection. */
  flush(): Promise<void> {
    // One flush at a time in this tab; `exclusive` extends that across tabs (Web Locks).
    this.flushing ??= this.exclusive(() => this.sendWaiting()).finally(() => {
      this.flushing = null;
    });
    return this.flushing;
  }

  private async sendWaiting(): Promise<void> {
    this.reload();
    for (;;) {
      const next = this.entries.find((e) => e.state === 'waiting');
      if (!next) return;
      let result: SendResult;
      try {
        result = await this.send(next.payload);
      } catch (err) {
        result = { status: 'retry', message: err instanceof Error ? err.message : 'Not sent.' };
      }
      // Storage may have changed while the request was out (another tab): apply to the fresh list.
      this.entries = this.storage.load();
      if (result.status === 'stored') {
        this.entries = this.entries.filter((e) => e.key !== next.key);
        this.answers.set(next.key, result.answer);
        if (this.answers.size > 50) this.answers.delete(this.answers.keys().next().value as string);
        this.persist();
        for (const l of this.sentListeners) l(next, result.answer);
        continue;
      }
      this.entries = this.entries.map((e) =>
        e.key === next.key
          ? { ...e, attempts: e.attempts + 1, message: result.message, state: result.status === 'rejected' ? 'failed' : 'waiting' }
          : e,
      );
      this.persist();
      if (result.status === 'retry') return;
    }
  }

  private persist(): void {
    this.storage.save(this.entries);
    this.emit();
  }

  private emit(): void {
    for (const l of this.listeners) l();
  }
}

/** Reads a stored queue defensively: anything that is not a list of entries reads as empty. */
export function parseStoredQueue(text: string | null): QueuedEntry[] {
  if (!text) return [];
  try {
    const v = JSON.parse(text) as unknown;
    if (!Array.isArray(v)) return [];
    return v.filter(
      (e): e is QueuedEntry =>
        !!e && typeof e === 'object' && typeof (e as QueuedEntry).key === 'string' && typeof (e as QueuedEntry).payload === 'object' && (e as QueuedEntry).payload !== null,
    );
  } catch {
    return [];
  }
}

/** How an HTTP answer to POST /api/floor/entries is treated. */
export function classifyResponse(status: number): SendResult['status'] {
  if (status === 200 || status === 201) return 'stored';
  if (status === 401 || status === 408 || status === 429 || status >= 500) return 'retry';
  return 'rejected';
}
