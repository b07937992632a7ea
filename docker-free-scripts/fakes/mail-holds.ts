// Holds for the mail fake: the reply to a message for a held recipient waits until the hold is
// released or times out, so a test can stop the sender in the middle of an SMTP conversation.
// When the hold ends, the message is accepted (250, stored) or refused with a temporary failure
// (451); a message whose client went away meanwhile was never accepted and is not stored.
import { z } from 'zod';

export const holdSchema = z.object({
  to: z.email('to must be an e-mail address').transform((s) => s.toLowerCase()),
  ms: z.number().int().min(1).max(600_000).default(60_000),
  outcome: z.enum(['accept', 'reject']).default('accept'),
});
export type HoldRequest = z.input<typeof holdSchema>;
export type Outcome = 'accept' | 'reject' | 'client-gone';

type Waiter = { sessionId: string; done: (outcome: Outcome) => void };
type Hold = { to: string; outcome: 'accept' | 'reject'; endsAt: number; timer: NodeJS.Timeout; waiters: Waiter[] };

export class MailHolds {
  private readonly holds = new Map<string, Hold>();

  add(input: z.output<typeof holdSchema>): { to: string; ms: number; outcome: string } {
    this.release(input.to);
    const timer = setTimeout(() => this.release(input.to), input.ms);
    timer.unref();
    this.holds.set(input.to, { to: input.to, outcome: input.outcome, endsAt: Date.now() + input.ms, timer, waiters: [] });
    return input;
  }

  list(): { to: string; outcome: string; endsAt: string; waiting: number }[] {
    return [...this.holds.values()].map((h) => ({ to: h.to, outcome: h.outcome, endsAt: new Date(h.endsAt).toISOString(), waiting: h.waiters.length }));
  }

  /** Ends the hold on `to` (every hold when omitted); the waiting messages get its outcome. */
  release(to?: string): number {
    let released = 0;
    for (const hold of [...this.holds.values()]) {
      if (to !== undefined && hold.to !== to.toLowerCase()) continue;
      clearTimeout(hold.timer);
      this.holds.delete(hold.to);
      for (const w of hold.waiters) w.done(hold.outcome);
      released += 1;
    }
    return released;
  }

  /** Waits while any recipient is held; resolves at once when none is. */
  wait(sessionId: string, recipients: string[]): Promise<Outcome> {
    const hold = recipients.map((r) => this.holds.get(r.toLowerCase())).find((h) => h !== undefined);
    if (!hold) return Promise.resolve('accept');
    return new Promise((resolve) => {
      const waiter: Waiter = {
        sessionId,
        done: (outcome) => {
          hold.waiters = hold.waiters.filter((w) => w !== waiter);
          resolve(outcome);
        },
      };
      hold.waiters.push(waiter);
    });
  }

  /** The SMTP client of this session disconnected: its held message ends unaccepted. */
  clientGone(sessionId: string): void {
    for (const hold of this.holds.values()) for (const w of hold.waiters.filter((x) => x.sessionId === sessionId)) w.done('client-gone');
  }
}
