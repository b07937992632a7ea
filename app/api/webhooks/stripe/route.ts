// POST /api/webhooks/stripe — Stripe only: authenticated by the Stripe-Signature header, not a session.
import { NextResponse } from 'next/server';
import { handleStripeWebhook } from '@/lib/billing/webhook';
import { errorResponse } from '@/lib/http';

const MAX_BODY_BYTES = 512 * 1024;

export async function POST(req: Request): Promise<Response> {
  try {
    // The signature covers the exact bytes sent, so the body is read raw and never re-serialised.
    const raw = await req.text();
    if (raw.length > MAX_BODY_BYTES) return NextResponse.json({ error: { code: 'TOO_LARGE', message: 'The event is too large.' } }, { status: 413 });
    const result = await handleStripeWebhook(raw, req.headers.get('stripe-signature'));
    return NextResponse.json({ received: true, duplicate: result.duplicate, outcome: result.outcome });
  } catch (err) {
    return errorResponse(err);
  }
}
