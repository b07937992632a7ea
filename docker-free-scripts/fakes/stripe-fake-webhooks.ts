// Events and their delivery: signed with the SDK's own test signer, retried a bounded number of
// times with growing delays, and logged so tests and people can see what was sent.
import Stripe from 'stripe';
import {
  newId,
  nowSeconds,
  type Delivery,
  type FakeEvent,
  type StripeObject,
  type StripeStore,
} from './stripe-fake-store';

export type WebhookOptions = {
  /** Where events are POSTed; null or '' keeps them in the log without sending. */
  url: string | null;
  secret: string;
  /** Delay before each retry; its length is the number of retries after the first attempt. */
  retryDelaysMs: number[];
  timeoutMs: number;
  log: (line: string) => void;
};

export const DEFAULT_RETRY_DELAYS_MS = [500, 2000, 5000];

export class WebhookSender {
  private readonly timers = new Map<string, NodeJS.Timeout>();
  private closed = false;

  constructor(
    private readonly store: StripeStore,
    private readonly options: WebhookOptions,
  ) {}

  /**
   * Records the event and makes the first delivery attempt before resolving, so that a browser
   * redirected after payment reaches the app after the app has heard about it.
   */
  async emit(type: string, object: StripeObject): Promise<FakeEvent> {
    const url = this.options.url || null;
    const event: FakeEvent = {
      id: newId('evt'),
      object: 'event',
      type,
      created: nowSeconds(),
      api_version: Stripe.API_VERSION,
      livemode: false,
      pending_webhooks: url ? 1 : 0,
      request: { id: null, idempotency_key: null },
      // A snapshot: later changes to the object must not alter an event already sent.
      data: { object: structuredClone(object) },
    };
    this.store.state.events.push(event);
    this.store.state.deliveries[event.id] = { status: url ? 'pending' : 'no_endpoint', url, attempts: [] };
    this.store.save();
    if (url) await this.attempt(event, 0);
    else this.options.log(`[stripe-fake] event ${event.id} ${type} recorded (no STRIPE_WEBHOOK_URL set)`);
    return event;
  }

  /** Sends an event again from scratch (with its own retries), e.g. to test replay handling. */
  async resend(eventId: string): Promise<Delivery | null> {
    const event = this.store.state.events.find((e) => e.id === eventId);
    if (!event) return null;
    const url = this.options.url || null;
    const delivery = this.deliveryOf(event.id);
    delivery.url = url;
    this.clearTimer(event.id);
    if (!url) {
      delivery.status = 'no_endpoint';
      this.store.save();
      return delivery;
    }
    delivery.status = 'pending';
    this.store.save();
    await this.attempt(event, 0);
    return delivery;
  }

  close(): void {
    this.closed = true;
    for (const id of [...this.timers.keys()]) this.clearTimer(id);
  }

  private deliveryOf(eventId: string): Delivery {
    const existing = this.store.state.deliveries[eventId];
    if (existing) return existing;
    const created: Delivery = { status: 'pending', url: null, attempts: [] };
    this.store.state.deliveries[eventId] = created;
    return created;
  }

  private clearTimer(eventId: string): void {
    const timer = this.timers.get(eventId);
    if (timer) clearTimeout(timer);
    this.timers.delete(eventId);
  }

  private async attempt(event: FakeEvent, retryIndex: number): Promise<void> {
    const { url, secret, retryDelaysMs, timeoutMs, log } = this.options;
    if (!url || this.closed) return;
    const payload = JSON.stringify(event, null, 2);
    // Signed at send time, as Stripe does, so a resent event carries a fresh timestamp.
    const signature = Stripe.webhooks.generateTestHeaderString({ payload, secret });
    let status: number | null = null;
    let error: string | null = null;
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signature,
          'user-agent': 'ampwright-stripe-fake',
        },
        body: payload,
        signal: AbortSignal.timeout(timeoutMs),
      });
      status = response.status;
      await response.arrayBuffer().catch(() => undefined);
      if (!response.ok) error = `HTTP ${response.status}`;
    } catch (err) {
      error = err instanceof Error ? (err.cause instanceof Error ? err.cause.message : err.message) : String(err);
    }
    if (this.closed) return;

    const delivery = this.deliveryOf(event.id);
    delivery.attempts.push({ at: new Date().toISOString(), status, error });
    const tries = retryIndex + 1;
    if (error === null) {
      delivery.status = 'delivered';
      log(`[stripe-fake] delivered ${event.id} ${event.type} → ${url} (${status}, try ${tries})`);
    } else if (retryIndex < retryDelaysMs.length) {
      const delay = retryDelaysMs[retryIndex] ?? 1000;
      log(`[stripe-fake] delivery of ${event.id} ${event.type} failed (${error}); retry in ${delay} ms`);
      const timer = setTimeout(() => {
        this.timers.delete(event.id);
        void this.attempt(event, retryIndex + 1);
      }, delay);
      timer.unref();
      this.timers.set(event.id, timer);
    } else {
      delivery.status = 'failed';
      log(`[stripe-fake] gave up on ${event.id} ${event.type} after ${tries} tries (${error})`);
    }
    this.store.save();
  }
}
