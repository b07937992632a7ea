// A customer's administrator makes an API token in the portal, sees it once, and their
// purchasing system reads the company's own work orders with it; after revoking, it gets 401.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { DEMO_PASSWORD } from '@/lib/seed';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';

const BUYER = 'buyer@northgate-fastener.test'; // the demo's Northgate administrator
const NOT_ADMIN = 'quality@halvorsen-valve.test';
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser.close();
  await db.destroy();
});

describe('API tokens in the portal', () => {
  it('[customer admin] makes a token, uses it, revokes it', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    try {
      await signInAs(page, BUYER, DEMO_PASSWORD);
      await page.goto(`${APP_URL}/portal`);
      await page.getByRole('link', { name: 'API tokens', exact: true }).click();
      await page.getByRole('heading', { name: 'API tokens' }).waitFor();
      const name = `Purchasing ${Date.now()}`;
      await page.getByLabel('Name').fill(name);
      await page.getByRole('button', { name: 'Make token' }).click();
      await page.getByText(`Token “${name}” made. Copy it now: it is shown only once.`).waitFor();
      const token = await page.getByLabel('The new token').inputValue();
      expect(token).toMatch(/^amp_[A-Za-z0-9_-]{43}$/);
      await page.getByRole('row', { name: new RegExp(name) }).getByText(token.slice(0, 12)).waitFor();
      await screenshot(page, 'portal-api-token-made');

      const northgate = await db.selectFrom('customers').select('id').where('code', '=', 'NGF').executeTakeFirstOrThrow();
      const res = await fetch(`${APP_URL}/api/v1/work-orders?limit=200`, { headers: { authorization: `Bearer ${token}` } });
      expect(res.status).toBe(200);
      expect(res.headers.get('ratelimit-limit')).toBe('120');
      const body = (await res.json()) as { data: { customerId: string }[] };
      expect(body.data.length).toBeGreaterThan(0);
      expect(body.data.every((w) => w.customerId === northgate.id)).toBe(true);

      await page.reload();
      await page.getByRole('row', { name: new RegExp(name) }).getByRole('button', { name: `Revoke ${name}` }).click();
      await page.getByText('Revoked: the token no longer works.').waitFor();
      const after = await fetch(`${APP_URL}/api/v1/work-orders`, { headers: { authorization: `Bearer ${token}` } });
      expect(after.status).toBe(401);
    } finally {
      await context.close();
    }
  });

  it('[customer, not an administrator] is told to ask their administrator and can make none', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      await signInAs(page, NOT_ADMIN, DEMO_PASSWORD);
      await page.goto(`${APP_URL}/portal/api-tokens`);
      await page.getByText('Your company’s administrator makes API tokens.').waitFor();
      await expect(page.getByRole('button', { name: 'Make token' }).count()).resolves.toBe(0);
    } finally {
      await context.close();
    }
  });

  it('publishes its OpenAPI document to anyone', async () => {
    const res = await fetch(`${APP_URL}/api/v1/openapi.json`);
    expect(res.status).toBe(200);
    const doc = (await res.json()) as { openapi: string; paths: Record<string, unknown> };
    expect(doc.openapi).toBe('3.1.0');
    expect(Object.keys(doc.paths)).toContain('/api/v1/work-orders');
  });
});
