// Debian's Chromium driven by playwright-core (no browser download).
import { type Browser, type Page, chromium } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { nextCodeFor } from './second-factor';

export const APP_URL = `http://127.0.0.1:${process.env.APP_PORT ?? 3100}`;
export const ARTIFACTS = path.resolve(__dirname, '../artifacts');

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export async function signInAs(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${APP_URL}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
  // An account with a second factor (the owner must have one) asks for its code next.
  if (new URL(page.url()).pathname === '/two-factor') {
    await page.getByLabel('Code').fill(await nextCodeFor(email));
    await page.getByRole('button', { name: 'Continue' }).click();
    await page.waitForURL((u) => !u.pathname.startsWith('/two-factor'));
  }
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: true });
}
