import 'server-only';
import Stripe from 'stripe';
import { AppError } from '@/lib/errors';

// The one Stripe client, built from the environment:
//   STRIPE_SECRET_KEY      the secret key (sk_test_… locally)
//   STRIPE_API_BASE        e.g. http://127.0.0.1:12111 for the local fake; empty or unset = api.stripe.com
//   STRIPE_WEBHOOK_SECRET  the endpoint's signing secret (whsec_…), used by the webhook route
let cached: { key: string; stripe: Stripe } | undefined;

export function isStripeConfigured(): boolean {
  return !!process.env.STRIPE_SECRET_KEY;
}

function clientOptions(base: string): Stripe.StripeConfig {
  // The local fake answers at once and keeps no idempotency keys, so retries would only hide bugs.
  if (!base) return { maxNetworkRetries: 2, telemetry: false };
  let url: URL;
  try {
    url = new URL(base);
  } catch {
    throw new AppError('UNAVAILABLE', `Online payment is misconfigured: STRIPE_API_BASE "${base}" is not a URL.`);
  }
  const protocol = url.protocol === 'https:' ? 'https' : 'http';
  return {
    host: url.hostname,
    port: Number(url.port || (protocol === 'https' ? 443 : 80)),
    protocol,
    maxNetworkRetries: 0,
    telemetry: false,
  };
}

export function stripeClient(): Stripe {
  const key = process.env.STRIPE_SECRET_KEY ?? '';
  if (!key) throw new AppError('UNAVAILABLE', 'Online payment is not set up (STRIPE_SECRET_KEY is missing). Nothing was charged.');
  const base = (process.env.STRIPE_API_BASE ?? '').trim();
  const cacheKey = `${key}|${base}`;
  if (cached?.key !== cacheKey) cached = { key: cacheKey, stripe: new Stripe(key, clientOptions(base)) };
  return cached.stripe;
}

/** Stripe's own signature check: HMAC of the raw body with the endpoint secret, and a 5-minute timestamp window. */
export function verifyStripeSignature(rawBody: string, signature: string | null): Stripe.Event {
  const secret = process.env.STRIPE_WEBHOOK_SECRET ?? '';
  if (!secret) throw new AppError('UNAVAILABLE', 'Stripe webhooks are not set up (STRIPE_WEBHOOK_SECRET is missing).');
  if (!signature) throw new AppError('BAD_INPUT', 'The Stripe-Signature header is missing.');
  try {
    return Stripe.webhooks.constructEvent(rawBody, signature, secret);
  } catch (err) {
    const detail = err instanceof Error ? err.message.split('\n')[0] : 'unreadable signature';
    throw new AppError('BAD_INPUT', `The Stripe signature could not be verified: ${detail}`);
  }
}

/** A payment-service failure as the customer should see it: nothing charged, try again. */
export function paymentServiceError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  const message = err instanceof Error ? err.message : String(err);
  console.error('[stripe] request failed:', message);
  return new AppError('UNAVAILABLE', 'The payment service could not be reached. Nothing was charged; please try again in a moment.');
}
