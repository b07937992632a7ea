import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import { hashPassword } from '@/lib/auth/password';
import { DEMO_PASSWORD } from '@/lib/seed';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';
import { firstLink, waitForMessage } from '../helpers/mailbox';
import { TEST_DATABASE_URL } from '../helpers/test-db';
import { nextCodeFor } from '../helpers/second-factor';
import { Secret, TOTP } from 'otpauth';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const ROLE_NAV: { role: string; email: string; sees: string[]; doesNotSee: string[] }[] = [
  { role: 'owner', email: 'owner@kestrel-plating.test', sees: ['Home', 'Users', 'Demo mailbox'], doesNotSee: [] },
  { role: 'estimator', email: 'estimator@kestrel-plating.test', sees: ['Home'], doesNotSee: ['Users', 'Demo mailbox'] },
  { role: 'plater', email: 'plater@kestrel-plating.test', sees: ['Home'], doesNotSee: ['Users', 'Demo mailbox'] },
  { role: 'supervisor', email: 'supervisor@kestrel-plating.test', sees: ['Home'], doesNotSee: ['Users', 'Demo mailbox'] },
  { role: 'customer', email: 'buyer@northgate-fastener.test', sees: ['Overview'], doesNotSee: ['Users', 'Home'] },
];

describe('signing in', () => {
  for (const r of ROLE_NAV) {
    it(`[${r.role}] signs in and sees their own navigation`, async () => {
      const context = await browser.newContext();
      const page = await context.newPage();
      try {
        await signInAs(page, r.email, DEMO_PASSWORD);
        const nav = page.getByRole('navigation').first();
        for (const label of r.sees) await expect(nav.getByRole('link', { name: label, exact: true }).count()).resolves.toBe(1);
        for (const label of r.doesNotSee) await expect(nav.getByRole('link', { name: label, exact: true }).count()).resolves.toBe(0);
        await screenshot(page, `home-${r.role}`);
      } finally {
        await context.close();
      }
    });
  }

  it('[visitor] is sent to sign-in from a staff page', async () => {
    const page = await browser.newPage();
    try {
      await page.goto(`${APP_URL}/settings/users`);
      expect(new URL(page.url()).pathname).toBe('/sign-in');
      expect(new URL(page.url()).searchParams.get('next')).toBe('/settings/users');
    } finally {
      await page.close();
    }
  });

  it('[visitor] with a wrong password gets the generic message', async () => {
    const page = await browser.newPage();
    try {
      await page.goto(`${APP_URL}/sign-in`);
      await page.getByLabel('E-mail').fill('estimator@kestrel-plating.test');
      await page.getByLabel('Password').fill('wrong-password');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await expect(page.getByText('That e-mail address and password do not match an active account.').waitFor()).resolves.toBeUndefined();
      expect(new URL(page.url()).pathname).toBe('/sign-in');
      await screenshot(page, 'sign-in-wrong-password');
    } finally {
      await page.close();
    }
  });

  it('[customer] opening a staff URL gets "not allowed" and no data', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      await signInAs(page, 'buyer@northgate-fastener.test', DEMO_PASSWORD);
      const res = await page.goto(`${APP_URL}/settings/users`);
      expect(res?.status()).toBe(403);
      await expect(page.getByRole('heading', { name: 'Not allowed' }).count()).resolves.toBe(1);
      const body = await page.content();
      expect(body).not.toContain('owner@kestrel-plating.test');
      await screenshot(page, 'customer-not-allowed');
    } finally {
      await context.close();
    }
  });

  it('[customer] can reset a forgotten password; the link works once', async () => {
    const email = 'quality@halvorsen-valve.test';
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      const since = Date.now();
      await page.goto(`${APP_URL}/reset`);
      await page.getByLabel('E-mail').fill(email);
      await page.getByRole('button', { name: 'Send me a link' }).click();
      await page.getByText('If that address has an account').waitFor();
      const link = firstLink((await waitForMessage(email, /Reset your Ampwright password/, since)).text);
      expect(link.startsWith(`${APP_URL}/set-password/`)).toBe(true);

      await page.goto(link);
      await page.getByLabel('New password').fill('halvorsen-new-pass');
      await page.getByLabel('Repeat the password').fill('halvorsen-new-pass');
      await page.getByRole('button', { name: 'Save password' }).click();
      await page.waitForURL((u) => u.pathname === '/sign-in');
      await signInAs(page, email, 'halvorsen-new-pass');
      expect(new URL(page.url()).pathname).toBe('/portal');

      const again = await context.newPage();
      await again.goto(link);
      await expect(again.getByText('This link has already been used').count()).resolves.toBe(1);
      await screenshot(again, 'reset-link-used');
    } finally {
      await context.close();
      // Other files sign in as this demo contact with the demo password: give it back.
      const client = new pg.Client({ connectionString: TEST_DATABASE_URL });
      await client.connect();
      await client.query('update users set password_hash = $1 where email = $2', [await hashPassword(DEMO_PASSWORD), email]).finally(() => client.end());
    }
  });

  it('[owner] is asked for the app code after the password; a password-only session opens no page and no API', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      const since = Date.now();
      await page.goto(`${APP_URL}/sign-in?next=/invoices`);
      await page.getByLabel('E-mail').fill('owner@kestrel-plating.test');
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL((u) => u.pathname === '/two-factor');
      await screenshot(page, 'sign-in-second-factor');
      // with only the password given, a staff page sends back to the code and the API refuses
      const cookie = (await context.cookies()).find((c) => c.name === 'ampwright_session');
      expect(cookie).toBeDefined();
      const api = await fetch(`${APP_URL}/api/quotes`, { headers: { cookie: `ampwright_session=${cookie!.value}` }, redirect: 'manual' });
      expect(api.status).toBe(401);
      const other = await context.newPage();
      await other.goto(`${APP_URL}/settings/users`);
      expect(new URL(other.url()).pathname).toBe('/two-factor');
      expect(await other.content()).not.toContain('estimator@kestrel-plating.test');
      await other.close();
      // a wrong code is refused with a field message
      await page.getByLabel('Code').fill('000000');
      await page.getByRole('button', { name: 'Continue' }).click();
      await page.getByText(/does not match|used already/).waitFor();
      await page.getByLabel('Code').fill(await nextCodeFor('owner@kestrel-plating.test'));
      await page.getByRole('button', { name: 'Continue' }).click();
      await page.waitForURL((u) => u.pathname === '/invoices');
      // a browser the account had not used before: the owner is e-mailed
      const mail = await waitForMessage('owner@kestrel-plating.test', /New sign-in to your Ampwright account/, since);
      expect(mail.text).toContain('Browser:');
    } finally {
      await context.close();
    }
  });

  it('[supervisor] turns on a second factor from the account page and sees the recovery codes once', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const email = 'supervisor@kestrel-plating.test';
    try {
      await signInAs(page, email, DEMO_PASSWORD);
      await page.goto(`${APP_URL}/account`);
      await page.getByRole('link', { name: 'Set up an authenticator app' }).click();
      await page.waitForURL((u) => u.pathname === '/two-factor/setup');
      const key = (await page.getByTestId('totp-secret').innerText()).replace(/\s/g, '');
      expect(key).toMatch(/^[A-Z2-7]{32}$/);
      await page.getByLabel(/6-digit code/).fill(new TOTP({ algorithm: 'SHA1', digits: 6, period: 30, secret: Secret.fromBase32(key) }).generate());
      await page.getByRole('button', { name: 'Turn on' }).click();
      await page.getByRole('list', { name: 'Recovery codes' }).waitFor();
      expect(await page.getByRole('list', { name: 'Recovery codes' }).getByRole('listitem').count()).toBe(10);
      await screenshot(page, 'second-factor-recovery-codes');
      await page.goto(`${APP_URL}/account`);
      await page.getByText(/^On\. Signing in asks for a code/).waitFor();
      await screenshot(page, 'account-second-factor-on');
    } finally {
      await context.close();
      // other files sign in as the supervisor with the password alone
      const client = new pg.Client({ connectionString: TEST_DATABASE_URL });
      await client.connect();
      await client
        .query('update users set totp_secret = null, totp_enabled_at = null, totp_last_step = null where email = $1', [email])
        .then(() => client.query('delete from recovery_codes where user_id = (select id from users where email = $1)', [email]))
        .finally(() => client.end());
    }
  });
});
