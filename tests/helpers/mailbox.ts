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

export function firstLink(text: string): string {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error('message has no link');
  return m[0];
}
