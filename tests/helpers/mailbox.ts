// Reads what the local SMTP fake received (the same fake the demo uses, on the test ports).
export type FakeMessage = { id: string; date: string; to: string[]; subject: string; text: string };

export const MAILBOX_URL = process.env.MAILBOX_URL ?? `http://127.0.0.1:${process.env.MAILBOX_PORT ?? 2581}`;

export async function messagesTo(address: string): Promise<FakeMessage[]> {
  const res = await fetch(`${MAILBOX_URL}/messages?to=${encodeURIComponent(address)}`);
  if (!res.ok) throw new Error(`mailbox answered ${res.status}`);
  const body = (await res.json()) as FakeMessage[] | { messages: FakeMessage[] };
  return Array.isArray(body) ? body : body.messages;
}

// Waits for a message whose subject matches, newer than `since`.
export async function waitForMessage(address: string, subject: RegExp, since: number, timeoutMs = 10_000): Promise<FakeMessage> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    const m = (await messagesTo(address)).find((x) => subject.test(x.subject) && new Date(x.date).getTime() >= since - 1000);
    if (m) return m;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no message "${subject}" to ${address} within ${timeoutMs} ms`);
}

// Holds the fake's reply to messages for `address` (mail-holds.ts), so a test can stop the sender
// in the middle of an SMTP conversation; when released, they are accepted or refused (451).
export async function holdMail(address: string, options: { ms?: number; outcome?: 'accept' | 'reject' } = {}): Promise<void> {
  const res = await fetch(`${MAILBOX_URL}/holds`, { method: 'POST', body: JSON.stringify({ to: address, ...options }) });
  if (res.status !== 201) throw new Error(`mailbox refused the hold: ${res.status} ${await res.text()}`);
}

/** How many messages wait on each held address. */
export async function heldMail(): Promise<Map<string, number>> {
  const res = await fetch(`${MAILBOX_URL}/holds`);
  if (!res.ok) throw new Error(`mailbox answered ${res.status}`);
  return new Map(((await res.json()) as { to: string; waiting: number }[]).map((h) => [h.to, h.waiting]));
}

export async function releaseMail(address?: string): Promise<void> {
  const res = await fetch(`${MAILBOX_URL}/holds${address ? `?to=${encodeURIComponent(address)}` : ''}`, { method: 'DELETE' });
  if (!res.ok) throw new Error(`mailbox answered ${res.status}`);
}

export function firstLink(text: string): string {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error('message has no link');
  return m[0];
}
