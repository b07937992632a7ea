// The captured mailbox: in memory for reads, mirrored to a JSON-lines file so it survives restarts.
import fs from 'node:fs';
import path from 'node:path';

export type StoredAttachment = { filename: string | null; contentType: string; size: number };

export type StoredMessage = {
  id: string;
  date: string;
  receivedAt: string;
  from: string;
  to: string[];
  cc: string[];
  envelope: { from: string | null; to: string[] };
  subject: string;
  text: string;
  html: string | null;
  attachments: StoredAttachment[];
};

export const MAILBOX_CAP = 2000;

export class MailStore {
  private messages: StoredMessage[] = [];
  private linesInFile = 0;
  private readonly file: string;

  constructor(
    stateDir: string,
    private readonly cap = MAILBOX_CAP,
    private readonly warn: (msg: string) => void = console.warn,
  ) {
    fs.mkdirSync(stateDir, { recursive: true });
    this.file = path.join(stateDir, 'messages.jsonl');
    this.load();
  }

  get size(): number {
    return this.messages.length;
  }

  add(message: StoredMessage): void {
    this.messages.push(message);
    // Synchronous writes keep the file in arrival order without a write queue.
    fs.appendFileSync(this.file, JSON.stringify(message) + '\n');
    this.linesInFile += 1;
    if (this.messages.length > this.cap) this.messages.splice(0, this.messages.length - this.cap);
    // Rewrite only once the file has grown well past the cap, not on every message.
    if (this.linesInFile > this.cap + Math.ceil(this.cap / 4)) this.rewrite();
  }

  /** Newest first; `to` matches To, Cc or envelope recipients, case-insensitively. */
  list(to?: string): StoredMessage[] {
    const wanted = to?.trim().toLowerCase();
    const newestFirst = [...this.messages].reverse();
    if (!wanted) return newestFirst;
    return newestFirst.filter((m) =>
      [...m.to, ...m.cc, ...m.envelope.to].some((addr) => addr.toLowerCase() === wanted),
    );
  }

  get(id: string): StoredMessage | undefined {
    return this.messages.find((m) => m.id === id);
  }

  clear(): number {
    const count = this.messages.length;
    this.messages = [];
    this.rewrite();
    return count;
  }

  private load(): void {
    if (!fs.existsSync(this.file)) return;
    const lines = fs.readFileSync(this.file, 'utf8').split('\n').filter((l) => l.trim() !== '');
    let skipped = 0;
    for (const line of lines) {
      try {
        const parsed = JSON.parse(line) as StoredMessage;
        if (typeof parsed.id === 'string') this.messages.push(parsed);
        else skipped += 1;
      } catch {
        skipped += 1;
      }
    }
    if (skipped > 0) this.warn(`[mail-fake] skipped ${skipped} unreadable line(s) in ${this.file}`);
    if (this.messages.length > this.cap) this.messages.splice(0, this.messages.length - this.cap);
    this.rewrite();
  }

  private rewrite(): void {
    const tmp = `${this.file}.tmp`;
    fs.writeFileSync(tmp, this.messages.map((m) => JSON.stringify(m) + '\n').join(''));
    fs.renameSync(tmp, this.file);
    this.linesInFile = this.messages.length;
  }
}
