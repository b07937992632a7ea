// Billing in the browser: the owner issues an invoice from a shipped order, the customer opens the
// e-mailed link, pays on the Stripe fake's page and gets a receipt; another customer is refused.
//
// The app pays through the fake at STRIPE_API_BASE. In the full test run that fake is already up
// (port 12112) and sends its webhooks to this app on 3100. Run alone on another port, set
// STRIPE_API_BASE to a free port (e.g. http://127.0.0.1:12208): this file then starts its own fake
// there, sending webhooks to APP_PORT.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { DEMO_PASSWORD } from '@/lib/seed';
import { DEFAULT_WEBHOOK_SECRET, startStripeFake, type StripeFake } from '../../docker-free-scripts/fakes/stripe-fake';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';
import { firstLink, waitForMessage } from '../helpers/mailbox';
import { customerId, makeOrder } from '../integration/billing/fixtures';

const API_BASE = process.env.STRIPE_API_BASE;
const BILLING_EMAIL = 'ap@northgate-fastener.test';

let browser: Browser;
let ownFake: StripeFake | undefined;
let stateDir: string | undefined;
let order: { id: string; number: string };
let invoice: { id: string; number: string; link: string } | undefined;
const started = Date.now();

async function answers(url: string): Promise<boolean> {
  try {
    return (await fetch(`${url}/health`, { signal: AbortSignal.timeout(1500) })).ok;
  } catch {
    return false;
  }
}

beforeAll(async () => {
  if (!API_BASE) throw new Error('Set STRIPE_API_BASE (the test command does): the app and this test must use the same Stripe fake.');
  if (!(await answers(API_BASE))) {
    stateDir = mkdtempSync(path.join(os.tmpdir(), 'ampwright-e2e-stripe-'));
    ownFake = await startStripeFake({
      port: Number(new URL(API_BASE).port),
      stateDir,
      webhookUrl: `${APP_URL}/api/webhooks/stripe`,
      webhookSecret: process.env.STRIPE_WEBHOOK_SECRET || DEFAULT_WEBHOOK_SECRET,
      log: () => undefined,
    });
  }
  order = await makeOrder({ customer: 'NGF', quantity: 800, unitPriceCents: 21.25, poNumber: 'NGF-PO-E2E' });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await ownFake?.close();
  if (stateDir) rmSync(stateDir, { recursive: true, force: true });
  await db.destroy();
});

async function newPage(): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  page.setDefaultTimeout(30_000);
  return page;
}

describe('billing', () => {
  it('[owner] issues an invoice from a shipped work order and it is e-mailed to the customer', async () => {
    const page = await newPage();
    try {
      await signInAs(page, 'owner@kestrel-plating.test', DEMO_PASSWORD);
      await page.goto(`${APP_URL}/invoices/new?customer=${await customerId('NGF')}`);
      // Bill only this test's order, whatever else the shared test database has shipped.
      for (const box of await page.getByRole('checkbox', { name: /^Bill W/ }).all()) {
        const mine = (await box.getAttribute('aria-label')) === `Bill ${order.number}`;
        if ((await box.isChecked()) !== mine && (await box.isEnabled())) await box.click();
      }
      // 800 × 21.25 ¢ = 17 000 ¢; 7.25 % tax = 1 232.5 → 1 233 ¢; total 18 233 ¢
      await page.getByText('$182.33').first().waitFor();
      await screenshot(page, 'billing-owner-new-invoice');
      await page.getByRole('button', { name: 'Issue invoice' }).click();
      await page.waitForURL(/\/invoices\/[0-9a-f-]{36}\?issued=1/);
      await page.getByText(/issued and e-mailed to ap@northgate-fastener\.test/).waitFor();
      const number = (await page.getByRole('heading', { level: 1 }).textContent())!.replace('Invoice ', '').trim();
      await screenshot(page, 'billing-owner-issued');
      const mail = await waitForMessage(BILLING_EMAIL, new RegExp(`^Invoice ${number} from .*\\$182\\.33 due`), started, 20_000);
      invoice = { id: new URL(page.url()).pathname.split('/')[2]!, number, link: firstLink(mail.text) };
      expect(invoice.link).toBe(`${APP_URL}/portal/invoices/${invoice.id}`);
    } finally {
      await page.context().close();
    }
  });

  it('[customer] opens the e-mailed link, pays with a test card on the fake\'s page and sees the invoice paid and the receipt in the demo mailbox', async () => {
    expect(invoice, 'the owner test issues the invoice first').toBeDefined();
    const { id, number, link } = invoice!;
    const page = await newPage();
    try {
      await page.goto(link);
      expect(new URL(page.url()).pathname).toBe('/sign-in');
      await page.getByLabel('E-mail').fill('buyer@northgate-fastener.test');
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL(`${APP_URL}/portal/invoices/${id}`);
      await page.getByRole('heading', { name: `Invoice ${number}` }).waitFor();
      await screenshot(page, 'billing-customer-invoice');

      await page.getByRole('button', { name: 'Pay $182.33' }).click();
      await page.waitForURL((u) => u.href.startsWith(`${API_BASE}/pay/`));
      await page.getByText('$182.33').first().waitFor();
      await page.getByLabel('Card number').fill('4000 0000 0000 0002');
      await page.getByRole('button', { name: /^Pay/ }).click();
      await page.getByText('Your card was declined.').waitFor();
      await screenshot(page, 'billing-customer-card-declined');
      await page.getByLabel('Card number').fill('4242 4242 4242 4242');
      await page.getByRole('button', { name: /^Pay/ }).click();

      await page.waitForURL((u) => u.pathname === `/portal/invoices/${id}` && u.searchParams.get('payment') === 'done');
      await page.getByText('Thank you: your payment was received').waitFor();
      expect(await page.getByText('Paid', { exact: true }).count()).toBeGreaterThan(0);
      await page.getByText('Card payment not completed').waitFor(); // the declined try, in the history
      await screenshot(page, 'billing-customer-paid');

      const receipt = await waitForMessage(BILLING_EMAIL, new RegExp(`^Receipt: \\$182\\.33 received for invoice ${number}$`), started, 20_000);
      expect(receipt.text).toContain('This invoice is now paid in full.');
      const rows = await db.selectFrom('payments').select(['kind', 'amount_cents']).where('invoice_id', '=', id).execute();
      expect(rows).toEqual([{ kind: 'payment', amount_cents: 18_233 }]);
    } finally {
      await page.context().close();
    }
    // The owner's demo mailbox shows the receipt too.
    const owner = await newPage();
    try {
      await signInAs(owner, 'owner@kestrel-plating.test', DEMO_PASSWORD);
      await owner.goto(`${APP_URL}/settings/mailbox`);
      await owner.getByText(`Receipt: $182.33 received for invoice ${number}`).first().waitFor();
      await screenshot(owner, 'billing-demo-mailbox-receipt');
    } finally {
      await owner.context().close();
    }
  });

  it("[customer] of another company gets 'not found' for that invoice, by URL and by API", async () => {
    expect(invoice).toBeDefined();
    const page = await newPage();
    try {
      await signInAs(page, 'quality@halvorsen-valve.test', DEMO_PASSWORD);
      const res = await page.goto(`${APP_URL}/portal/invoices/${invoice!.id}`);
      expect(res?.status()).toBe(404);
      expect(await page.content()).not.toContain(invoice!.number);
      const api = await page.request.get(`${APP_URL}/api/portal/invoices/${invoice!.id}`);
      expect(api.status()).toBe(404);
      expect(await api.text()).not.toContain(invoice!.number);
      const pay = await page.request.post(`${APP_URL}/api/portal/invoices/${invoice!.id}/checkout`, { headers: { origin: APP_URL } });
      expect(pay.status()).toBe(404);
      await screenshot(page, 'billing-other-customer-not-found');
    } finally {
      await page.context().close();
    }
  });

  it('[owner] records a check above the balance only after confirming it, sees the credit on account and applies it to another open invoice', async () => {
    const ngf = await customerId('NGF');
    const a = await makeOrder({ customer: 'NGF', quantity: 100, unitPriceCents: 100 });
    const b = await makeOrder({ customer: 'NGF', quantity: 100, unitPriceCents: 100 });
    const { issueInvoice } = await import('@/lib/billing/mutations');
    const ownerId = (await db.selectFrom('users').select('id').where('email', '=', 'owner@kestrel-plating.test').executeTakeFirstOrThrow()).id;
    // 100 × 100 ¢ = 10 000 ¢ + 7.25 % (725 ¢) = 10 725 ¢ each
    const first = await issueInvoice(ownerId, { customerId: ngf, orderIds: [a.id], extras: [] });
    const second = await issueInvoice(ownerId, { customerId: ngf, orderIds: [b.id], extras: [] });
    const page = await newPage();
    try {
      await signInAs(page, 'owner@kestrel-plating.test', DEMO_PASSWORD);
      await page.goto(`${APP_URL}/invoices/${first.id}`);
      const payment = page.locator('form').filter({ has: page.getByRole('button', { name: 'Record payment' }) });
      await payment.getByLabel('Amount ($)').fill('150.00');
      await payment.getByLabel('Reference').fill('Check 4410');
      await payment.getByRole('button', { name: 'Record payment' }).click();
      await page.getByText('That is $42.75 more than the open balance of $107.25.').waitFor();
      expect(await db.selectFrom('payments').select('id').where('invoice_id', '=', first.id).execute()).toEqual([]);
      await screenshot(page, 'billing-owner-check-above-balance');
      await payment.getByLabel(/Keep the excess as credit on account/).check();
      await payment.getByRole('button', { name: 'Record payment' }).click();
      await page.getByText('Payment recorded; anything above the balance is credit on account.').waitFor();
      await page.reload();
      await page.getByText('Overpaid', { exact: true }).first().waitFor();
      await page.getByRole('heading', { name: 'Credit on account: $42.75' }).waitFor();
      await screenshot(page, 'billing-owner-overpaid-invoice');

      const apply = page.locator('form').filter({ has: page.getByRole('button', { name: 'Apply credit' }) });
      await apply.getByLabel('Invoice').selectOption(second.id);
      await apply.getByLabel('Amount ($)').fill('42.75');
      await apply.getByRole('button', { name: 'Apply credit' }).click();
      await page.getByText('Credit applied. The other invoice shows it in its payment history.').waitFor();
      await page.goto(`${APP_URL}/invoices/${second.id}`);
      await page.getByText(`Credit from invoice ${first.number}`).waitFor();
      await page.getByText('Partly paid', { exact: true }).first().waitFor();
      await screenshot(page, 'billing-owner-credit-applied');
      const rows = await db.selectFrom('invoices').select(['id', 'status', 'paid_cents']).where('id', 'in', [first.id, second.id]).execute();
      expect(Object.fromEntries(rows.map((r) => [r.id === first.id ? 'first' : 'second', [r.status, r.paid_cents]]))).toEqual({ first: ['paid', 10_725], second: ['partly_paid', 4_275] });
    } finally {
      await page.context().close();
    }
  });

  it('[owner] sees a payment that fits no invoice on the home screen and in the payment exceptions list, with what Stripe sent', async () => {
    const { processStripeEvent } = await import('@/lib/billing/webhook');
    const pi = `pi_e2e_${Date.now()}`;
    await processStripeEvent({
      id: `evt_e2e_${Date.now()}`, object: 'event', type: 'payment_intent.succeeded', created: Math.floor(Date.now() / 1000),
      data: { object: { id: pi, object: 'payment_intent', amount: 4321, amount_received: 4321, currency: 'usd', metadata: {}, latest_charge: null } },
    } as never);
    const page = await newPage();
    try {
      await signInAs(page, 'owner@kestrel-plating.test', DEMO_PASSWORD);
      await page.goto(`${APP_URL}/home`);
      await page.getByRole('region', { name: 'Money to check' }).getByText(/payment exceptions? to review/).waitFor();
      await screenshot(page, 'billing-owner-home-exceptions');
      await page.goto(`${APP_URL}/invoices/exceptions`);
      const card = page.locator('section, div').filter({ hasText: pi }).last();
      await page.getByRole('heading', { name: 'No such invoice: $43.21' }).first().waitFor();
      await card.getByText('What the payment service sent').first().click();
      await page.getByText(`"amount_received": 4321`).first().waitFor();
      await screenshot(page, 'billing-owner-exceptions');
    } finally {
      await page.context().close();
    }
  });
});
