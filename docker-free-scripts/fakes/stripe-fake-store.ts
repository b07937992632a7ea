// State of the Stripe fake: the object shapes it serves, kept in memory and saved to state.json.
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

type Base = { id: string; created: number; livemode: false; metadata: Record<string, string> };

export type Customer = Base & {
  object: 'customer';
  email: string | null;
  name: string | null;
  phone: string | null;
  description: string | null;
};

export type LineItem = {
  id: string;
  object: 'item';
  description: string;
  quantity: number;
  currency: string;
  amount_subtotal: number;
  amount_total: number;
  price: { id: string; object: 'price'; currency: string; unit_amount: number; product: string };
};

export type CheckoutSession = Base & {
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  customer: string | null;
  customer_email: string | null;
  customer_details: { email: string | null } | null;
  client_reference_id: string | null;
  success_url: string | null;
  cancel_url: string | null;
  url: string | null;
  payment_intent: string | null;
  expires_at: number;
};

export type PaymentError = { type: 'card_error'; code: string; decline_code: string; message: string };

export type PaymentIntent = Base & {
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  customer: string | null;
  description: string | null;
  status: 'requires_payment_method' | 'succeeded' | 'canceled';
  payment_method_types: string[];
  latest_charge: string | null;
  last_payment_error: PaymentError | null;
  receipt_email: string | null;
};

export type Charge = Base & {
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  currency: string;
  customer: string | null;
  payment_intent: string;
  paid: boolean;
  captured: boolean;
  refunded: boolean;
  status: 'succeeded';
  description: string | null;
};

export type Refund = Base & {
  object: 'refund';
  amount: number;
  currency: string;
  charge: string;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
};

export type StripeObject = Customer | CheckoutSession | PaymentIntent | Charge | Refund;

export type FakeEvent = {
  id: string;
  object: 'event';
  type: string;
  created: number;
  api_version: string;
  livemode: false;
  pending_webhooks: number;
  request: { id: null; idempotency_key: null };
  data: { object: StripeObject };
};

export type DeliveryAttempt = { at: string; status: number | null; error: string | null };

export type Delivery = {
  status: 'pending' | 'delivered' | 'failed' | 'no_endpoint';
  url: string | null;
  attempts: DeliveryAttempt[];
};

export type StripeState = {
  customers: Record<string, Customer>;
  sessions: Record<string, CheckoutSession>;
  lineItems: Record<string, LineItem[]>;
  /** `payment_intent_data` given with a session, used when its payment intent is created. */
  sessionIntentData: Record<string, { metadata: Record<string, string>; description: string | null }>;
  paymentIntents: Record<string, PaymentIntent>;
  charges: Record<string, Charge>;
  refunds: Record<string, Refund>;
  events: FakeEvent[];
  deliveries: Record<string, Delivery>;
};

/** Older events (and their delivery logs) are dropped past this many, to bound state.json. */
export const EVENT_CAP = 1000;

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}_${out}`;
}

export const nowSeconds = () => Math.floor(Date.now() / 1000);

export function emptyState(): StripeState {
  return {
    customers: {},
    sessions: {},
    lineItems: {},
    sessionIntentData: {},
    paymentIntents: {},
    charges: {},
    refunds: {},
    events: [],
    deliveries: {},
  };
}

export class StripeStore {
  readonly state: StripeState;
  private readonly file: string;

  constructor(
    stateDir: string,
    private readonly log: (line: string) => void,
  ) {
    fs.mkdirSync(stateDir, { recursive: true });
    this.file = path.join(stateDir, 'state.json');
    this.state = this.load();
  }

  /** Writes the whole state atomically; called after every change (the data set is small). */
  save(): void {
    const { events, deliveries } = this.state;
    if (events.length > EVENT_CAP) {
      for (const dropped of events.splice(0, events.length - EVENT_CAP)) delete deliveries[dropped.id];
    }
    const tmp = `${this.file}.tmp`;
    fs.writeFileSync(tmp, JSON.stringify(this.state));
    fs.renameSync(tmp, this.file);
  }

  private load(): StripeState {
    if (!fs.existsSync(this.file)) return emptyState();
    try {
      const loaded = JSON.parse(fs.readFileSync(this.file, 'utf8')) as Partial<StripeState>;
      return { ...emptyState(), ...loaded };
    } catch (err) {
      const aside = `${this.file}.unreadable-${Date.now()}`;
      fs.renameSync(this.file, aside);
      this.log(`[stripe-fake] state file was unreadable (${String(err)}); moved to ${aside}, starting empty`);
      return emptyState();
    }
  }
}
