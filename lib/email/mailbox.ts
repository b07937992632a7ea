import 'server-only';

// The demo mailbox: what the local SMTP fake received. Only used when DEMO_MODE=1.
export type MailboxMessage = {
  id: string;
  date: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  attachments: { filename: string; contentType: string; size: number }[];
};

export function isDemoMode(): boolean {
  return process.env.DEMO_MODE === '1';
}

export async function fetchMailbox(): Promise<{ messages: MailboxMessage[]; error?: string }> {
  const base = process.env.MAILBOX_URL ?? 'http://127.0.0.1:2580';
  try {
    const res = await fetch(`${base}/messages`, { cache: 'no-store', signal: AbortSignal.timeout(3000) });
    if (!res.ok) return { messages: [], error: `The demo mailbox answered ${res.status}.` };
    const body = (await res.json()) as MailboxMessage[] | { messages: MailboxMessage[] };
    return { messages: Array.isArray(body) ? body : body.messages };
  } catch {
    return { messages: [], error: 'The demo mailbox is not running. Start the app with the demo command to see sent messages.' };
  }
}
