// Local stand-in for the part of the Stripe API Ampwright calls, reached through the real SDK.
// Run: npx tsx docker-free-scripts/fakes/stripe-fake.ts
//   (STRIPE_FAKE_PORT, STRIPE_WEBHOOK_URL, STRIPE_WEBHOOK_SECRET, FAKES_STATE_DIR)
import http from 'node:http';
import Stripe from 'stripe';
import {
  BodyTooLargeError,
  closeHttpServer,
  exitOnSignals,
  isMainModule,
  listenLocal,
  portFromEnv,
  readBody,
  resolveStateDir,
  sendHtml,
  sendJson,
} from './fake-http';
import {
  DECLINE_MESSAGE,
  createCheckoutSession,
  getCheckoutSession,
  payCheckoutSession,
  presentSession,
  sessionLineItems,
  successRedirect,
} from './stripe-fake-checkout';
import { renderDonePage, renderNotFoundPage, renderPayPage } from './stripe-fake-page';
import { StripeFakeError, expandList, limitParam, optString, parseFormParams, type Params } from './stripe-fake-params';
import * as r from './stripe-fake-resources';
import { newId, StripeStore } from './stripe-fake-store';
import { DEFAULT_RETRY_DELAYS_MS, WebhookSender } from './stripe-fake-webhooks';

export const DEFAULT_WEBHOOK_URL = 'http://127.0.0.1:3000/api/webhooks/stripe';
export const DEFAULT_WEBHOOK_SECRET = 'whsec_ampwright_local_fake';

export type StripeFakeOptions = {
  port?: number;
  stateDir?: string;
  /** null or '' records events without sending them. */
  webhookUrl?: string | null;
  webhookSecret?: string;
  retryDelaysMs?: number[];
  webhookTimeoutMs?: number;
  log?: (line: string) => void;
};

export type StripeFake = { port: number; url: string; close(): Promise<void> };

type Handler = (ctx: r.FakeContext, p: Params, id: string) => unknown;
type Route = { method: string; path: RegExp; handler: Handler };

const ID = '([A-Za-z0-9_]+)';
const route = (method: string, path: string, handler: Handler): Route => ({
  method,
  path: new RegExp(`^${path.replace(':id', ID)}$`),
  handler,
});

const API_ROUTES: Route[] = [
  route('POST', '/v1/customers', (ctx, p) => r.createCustomer(ctx, p)),
  route('GET', '/v1/customers', (ctx, p) => r.listCustomers(ctx, p)),
  route('GET', '/v1/customers/:id', (ctx, _p, id) => r.getCustomer(ctx, id)),
  route('POST', '/v1/customers/:id', (ctx, p, id) => r.updateCustomer(ctx, id, p)),
  route('POST', '/v1/checkout/sessions', (ctx, p) => presentSession(ctx, createCheckoutSession(ctx, p), p)),
  route('GET', '/v1/checkout/sessions/:id', (ctx, p, id) => presentSession(ctx, getCheckoutSession(ctx, id), p)),
  route('GET', '/v1/checkout/sessions/:id/line_items', (ctx, p, id) =>
    r.listOf(`/v1/checkout/sessions/${id}/line_items`, sessionLineItems(ctx, getCheckoutSession(ctx, id).id),
      limitParam(p))),
  route('POST', '/v1/payment_intents', (ctx, p) => r.createPaymentIntent(ctx, p)),
  route('GET', '/v1/payment_intents', (ctx, p) => r.listPaymentIntents(ctx, p)),
  route('GET', '/v1/payment_intents/:id', (ctx, p, id) =>
    r.expand(r.getPaymentIntent(ctx, id), expandList(p), {
      customer: (cid) => ctx.store.state.customers[cid],
      latest_charge: (chid) => ctx.store.state.charges[chid],
    })),
  route('POST', '/v1/payment_intents/:id', (ctx, p, id) => r.updatePaymentIntent(ctx, id, p)),
  route('GET', '/v1/charges/:id', (ctx, _p, id) => r.getCharge(ctx, id)),
  route('POST', '/v1/refunds', (ctx, p) => r.createRefund(ctx, p)),
  route('GET', '/v1/refunds/:id', (ctx, _p, id) => r.getRefund(ctx, id)),
  route('GET', '/v1/events/:id', (ctx, _p, id) => {
    const event = ctx.store.state.events.find((e) => e.id === id);
    if (!event) throw new StripeFakeError(404, `No such event: '${id}'`, 'id', 'invalid_request_error', 'resource_missing');
    return event;
  }),
];

/** Only test-mode secret keys are accepted, so a live key pointed here by mistake is refused. */
function checkApiKey(header: string | undefined): StripeFakeError | null {
  if (!header) {
    return new StripeFakeError(401, 'No API key given. Send the header "Authorization: Bearer sk_test_...".');
  }
  const bearer = /^Bearer (\S+)$/i.exec(header)?.[1];
  // curl -u sk_test_...: sends the key as the Basic-auth user name, which Stripe also accepts.
  const basic = /^Basic (\S+)$/i.exec(header)?.[1];
  const key = bearer ?? (basic ? Buffer.from(basic, 'base64').toString('utf8').split(':')[0] : '') ?? '';
  if (!/^sk_test_\w+$/.test(key)) {
    const shown = key ? `${key.slice(0, 8)}****` : '(unreadable)';
    return new StripeFakeError(401, `Invalid API key ${shown}: the local fake takes test secret keys (sk_test_...) only.`);
  }
  return null;
}

async function handleApi(ctx: r.FakeContext, req: http.IncomingMessage, res: http.ServerResponse, url: URL) {
  const headers = { 'request-id': newId('req', 14), 'stripe-version': Stripe.API_VERSION };
  for (const [k, v] of Object.entries(headers)) res.setHeader(k, v);
  const authError = checkApiKey(req.headers.authorization);
  if (authError) return sendJson(res, 401, authError.toBody());

  const method = req.method ?? 'GET';
  const matches = API_ROUTES.map((rt) => ({ rt, m: rt.path.exec(url.pathname) })).filter((x) => x.m);
  const hit = matches.find((x) => x.rt.method === method);
  if (!hit?.m) {
    const message = matches.length
      ? `${method} is not allowed on ${url.pathname} in the local fake.`
      : `Unrecognized request URL (${method}: ${url.pathname}). The local fake serves customers, checkout sessions, payment intents, charges, refunds and events.`;
    return sendJson(res, matches.length ? 405 : 404, new StripeFakeError(404, message).toBody());
  }
  const encoded = method === 'GET' || method === 'DELETE' ? url.search.slice(1) : await readBody(req);
  const params = parseFormParams(encoded);
  const result = await hit.rt.handler(ctx, params, decodeURIComponent(hit.m[1] ?? ''));
  sendJson(res, 200, result);
}

async function handlePayPage(ctx: r.FakeContext, req: http.IncomingMessage, res: http.ServerResponse, id: string) {
  const session = ctx.store.state.sessions[id];
  if (!session) return sendHtml(res, 404, renderNotFoundPage(id));
  const lineItems = sessionLineItems(ctx, id);
  if (req.method === 'GET') {
    if (session.status !== 'open') return sendHtml(res, 200, renderDonePage(session, successRedirect(session)));
    return sendHtml(res, 200, renderPayPage({ session, lineItems }));
  }
  if (req.method !== 'POST') return sendHtml(res, 405, renderNotFoundPage(id));
  const card = optString(parseFormParams(await readBody(req, 10_000)), 'card') ?? '';
  const outcome = await payCheckoutSession(ctx, session, card);
  if (outcome.kind === 'paid' || outcome.kind === 'not_open') {
    const target = outcome.kind === 'paid' ? outcome.redirectTo : successRedirect(session);
    if (!target) return sendHtml(res, 200, renderDonePage(session, null));
    res.writeHead(303, { location: target, 'cache-control': 'no-store' });
    return res.end();
  }
  const error = outcome.kind === 'declined' ? DECLINE_MESSAGE : 'Use one of the test card numbers.';
  return sendHtml(res, outcome.kind === 'declined' ? 402 : 400, renderPayPage({ session, lineItems, error, card }));
}

async function handleFakeControl(ctx: r.FakeContext, req: http.IncomingMessage, res: http.ServerResponse, url: URL) {
  const { events, deliveries } = ctx.store.state;
  if (req.method === 'GET' && url.pathname === '/_fake/events') {
    const type = url.searchParams.get('type');
    const data = [...events]
      .reverse()
      .filter((e) => !type || e.type === type)
      .map((e) => ({ id: e.id, type: e.type, created: e.created, object_id: e.data.object.id, delivery: deliveries[e.id] ?? null }));
    return sendJson(res, 200, { object: 'list', data });
  }
  const resend = /^\/_fake\/events\/([A-Za-z0-9_]+)\/resend$/.exec(url.pathname);
  if (req.method === 'POST' && resend?.[1]) {
    const delivery = await ctx.webhooks.resend(resend[1]);
    if (!delivery) return sendJson(res, 404, new StripeFakeError(404, `No such event: '${resend[1]}'`, 'id').toBody());
    return sendJson(res, 200, { id: resend[1], delivery });
  }
  return sendJson(res, 404, new StripeFakeError(404, `Unknown fake control route ${req.method} ${url.pathname}`).toBody());
}

export async function startStripeFake(options: StripeFakeOptions = {}): Promise<StripeFake> {
  const log = options.log ?? ((line: string) => console.log(line));
  const store = new StripeStore(options.stateDir ?? resolveStateDir('stripe'), log);
  const webhookUrl = options.webhookUrl === undefined ? DEFAULT_WEBHOOK_URL : options.webhookUrl;
  const webhooks = new WebhookSender(store, {
    url: webhookUrl,
    secret: options.webhookSecret ?? DEFAULT_WEBHOOK_SECRET,
    retryDelaysMs: options.retryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS,
    timeoutMs: options.webhookTimeoutMs ?? 5000,
    log,
  });
  let port = options.port ?? 12111;
  const ctx: r.FakeContext = { store, webhooks, baseUrl: () => `http://127.0.0.1:${port}` };

  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    const pay = /^\/pay\/([A-Za-z0-9_]+)$/.exec(url.pathname);
    let work: Promise<unknown> | void;
    if (url.pathname === '/health') work = sendJson(res, 200, { ok: true, service: 'stripe-fake' });
    else if (pay?.[1]) work = handlePayPage(ctx, req, res, pay[1]);
    else if (url.pathname.startsWith('/_fake/')) work = handleFakeControl(ctx, req, res, url);
    else work = handleApi(ctx, req, res, url);
    Promise.resolve(work).catch((err: unknown) => {
      if (res.headersSent) return res.end();
      if (err instanceof StripeFakeError) return sendJson(res, err.status, err.toBody());
      if (err instanceof BodyTooLargeError) return sendJson(res, 413, new StripeFakeError(413, err.message).toBody());
      log(`[stripe-fake] internal error on ${req.method} ${url.pathname}: ${err instanceof Error ? err.stack : String(err)}`);
      sendJson(res, 500, new StripeFakeError(500, 'The local Stripe fake failed; see its log.', undefined, 'api_error').toBody());
    });
  });
  port = await listenLocal(server, port);

  return {
    port,
    url: ctx.baseUrl(),
    async close() {
      webhooks.close();
      await closeHttpServer(server);
    },
  };
}

if (isMainModule(import.meta.url)) {
  const main = async () => {
    const webhookUrl = process.env.STRIPE_WEBHOOK_URL ?? DEFAULT_WEBHOOK_URL;
    const fake = await startStripeFake({
      port: portFromEnv('STRIPE_FAKE_PORT', 12111),
      stateDir: resolveStateDir('stripe'),
      webhookUrl,
      webhookSecret: process.env.STRIPE_WEBHOOK_SECRET || DEFAULT_WEBHOOK_SECRET,
    });
    console.log(`[stripe-fake] API on ${fake.url} (webhooks → ${webhookUrl || 'nowhere: STRIPE_WEBHOOK_URL is empty'})`);
    exitOnSignals('stripe-fake', () => fake.close());
  };
  main().catch((err: unknown) => {
    console.error(`[stripe-fake] could not start: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}
