import { describe, expect, it } from 'vitest';
import type { FloorEntryPayload } from '@/lib/bath/schemas';
import { classifyResponse, FloorQueue, parseStoredQueue, type QueuedEntry, type SendResult } from '@/lib/floor/offline-queue';

// A device's storage and a server that stores each key once, as the real endpoint does.
function harness() {
  let stored: QueuedEntry[] = [];
  const server = new Map<string, number>(); // key → times received
  let online = false;
  let loseNextAnswer = false;
  const storage = { load: () => JSON.parse(JSON.stringify(stored)) as QueuedEntry[], save: (e: QueuedEntry[]) => void (stored = JSON.parse(JSON.stringify(e))) };
  const send = async (p: FloorEntryPayload): Promise<SendResult> => {
    if (!online) throw new TypeError('Failed to fetch');
    server.set(p.key, (server.get(p.key) ?? 0) + 1);
    if (loseNextAnswer) {
      // The request reached the server, but the answer was lost when the connection flickered.
      loseNextAnswer = false;
      throw new TypeError('network connection was lost');
    }
    return { status: 'stored', answer: { key: p.key, duplicate: (server.get(p.key) ?? 0) > 1 } };
  };
  const queue = new FloorQueue(storage, send);
  return {
    queue,
    server,
    stored: () => stored,
    setOnline: (v: boolean) => void (online = v),
    loseNextAnswer: () => void (loseNextAnswer = true),
  };
}

const entry = (n: number) => ({
  key: `floor-test-${n}`,
  label: `entry ${n}`,
  payload: { kind: 'meter', key: `floor-test-${n}`, tankId: '7d7a0b8e-2f5e-4c1e-9a56-0f1b1f7c8a11', ampHours: n, readAt: new Date().toISOString() } as FloorEntryPayload,
});

describe('FloorQueue', () => {
  it('keeps entries on the device while offline, then sends each once in order', async () => {
    const h = harness();
    await h.queue.add(entry(1));
    await h.queue.add(entry(2));
    expect(h.stored().map((e) => [e.key, e.state])).toEqual([['floor-test-1', 'waiting'], ['floor-test-2', 'waiting']]);
    expect(h.server.size).toBe(0);
    h.setOnline(true);
    await h.queue.flush();
    expect(h.stored()).toEqual([]);
    expect([...h.server.entries()]).toEqual([['floor-test-1', 1], ['floor-test-2', 1]]);
  });

  it('a lost answer is resent; the server sees the key twice and stores it once', async () => {
    const h = harness();
    h.setOnline(true);
    h.loseNextAnswer();
    await h.queue.add(entry(3));
    expect(h.stored().map((e) => e.key)).toEqual(['floor-test-3']);
    const sent: unknown[] = [];
    h.queue.onSent((_e, answer) => sent.push(answer));
    await h.queue.flush();
    expect(h.stored()).toEqual([]);
    expect(h.server.get('floor-test-3')).toBe(2);
    expect(sent).toEqual([{ key: 'floor-test-3', duplicate: true }]);
    expect(h.queue.answerFor('floor-test-3')).toEqual({ key: 'floor-test-3', duplicate: true });
  });

  it('two flushes at once send each entry once', async () => {
    const h = harness();
    await h.queue.add(entry(4));
    h.setOnline(true);
    await Promise.all([h.queue.flush(), h.queue.flush(), h.queue.flush()]);
    expect(h.server.get('floor-test-4')).toBe(1);
  });

  it('an entry the server refuses is marked and the rest still go', async () => {
    let stored: QueuedEntry[] = [];
    const q = new FloorQueue(
      { load: () => stored.map((e) => ({ ...e })), save: (e) => void (stored = e.map((x) => ({ ...x }))) },
      async (p) => (p.key === 'floor-test-5' ? { status: 'rejected', message: 'Tank has no meter.' } : { status: 'stored', answer: null }),
    );
    await q.add(entry(5));
    await q.add(entry(6));
    expect(stored).toEqual([expect.objectContaining({ key: 'floor-test-5', state: 'failed', message: 'Tank has no meter.' })]);
    q.discard('floor-test-5');
    expect(stored).toEqual([]);
  });

  it('adding the same key twice keeps one entry', async () => {
    const h = harness();
    await h.queue.add(entry(7));
    await h.queue.add(entry(7));
    expect(h.stored()).toHaveLength(1);
  });
});

describe('helpers', () => {
  it('reads a damaged stored queue as empty', () => {
    expect(parseStoredQueue('{oops')).toEqual([]);
    expect(parseStoredQueue('{"a":1}')).toEqual([]);
    expect(parseStoredQueue(null)).toEqual([]);
  });

  it('retries on no answer, expired sign-in and server trouble; gives up on a refusal', () => {
    expect(classifyResponse(201)).toBe('stored');
    expect(classifyResponse(200)).toBe('stored');
    expect(classifyResponse(401)).toBe('retry');
    expect(classifyResponse(503)).toBe('retry');
    expect(classifyResponse(400)).toBe('rejected');
    expect(classifyResponse(409)).toBe('rejected');
  });
});
