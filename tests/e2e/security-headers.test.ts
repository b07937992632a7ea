import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '@/lib/seed';
import { APP_URL, launchBrowser, signInAs } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('security headers', () => {
  it('pages carry a nonce-based CSP, frame-ancestors none, nosniff and a referrer policy', async () => {
    const res = await fetch(`${APP_URL}/sign-in`);
    const csp = res.headers.get('content-security-policy') ?? '';
    expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    // A new nonce each time.
    const again = (await fetch(`${APP_URL}/sign-in`)).headers.get('content-security-policy');
    expect(again).not.toBe(csp);
  });

  it('[owner] pages satisfy the policy: no violation while signing in and browsing', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const violations: string[] = [];
    page.on('console', (m) => {
      if (/Content Security Policy|Refused to (load|execute|apply)/i.test(m.text())) violations.push(m.text());
    });
    try {
      await signInAs(page, 'owner@kestrel-plating.test', DEMO_PASSWORD);
      for (const path of ['/home', '/settings/users', '/account']) {
        await page.goto(`${APP_URL}${path}`);
        await page.waitForLoadState('networkidle');
      }
      // The client-side React actually ran (a hydrated form answers without a full page load).
      await page.goto(`${APP_URL}/account`);
      await page.getByLabel('Current password').fill('wrong-current-pass');
      await page.getByRole('textbox', { name: 'New password', exact: true }).fill('short');
      await page.getByLabel('Repeat the new password').fill('short');
      await page.getByRole('button', { name: 'Change password' }).click();
      await page.getByText('Use at least 10 characters.').waitFor();
      expect(violations).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('an API write from another origin is refused', async () => {
    const res = await fetch(`${APP_URL}/api/health`, { method: 'POST', headers: { origin: 'https://evil.example' } });
    expect(res.status).toBe(403);
  });
});
