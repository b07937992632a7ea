// The staff pages' frame: the side navigation's panel holds all of its content whatever the
// window's height, on a page shorter than the navigation as on a long one.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '@/lib/seed';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('side navigation', () => {
  it('[estimator] keeps the user block inside the panel in a short window, scrolling the navigation, not off its edge', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 560 } });
    const page = await context.newPage();
    try {
      await signInAs(page, 'estimator@kestrel-plating.test', DEMO_PASSWORD);
      for (const path of ['/quotes', '/home']) {
        await page.goto(`${APP_URL}${path}`);
        await page.waitForLoadState('networkidle');
        const nav = page.locator('nav[aria-label="Main"]');
        const column = nav.locator('xpath=..');
        const signOut = nav.getByText('Sign out', { exact: true });
        await signOut.scrollIntoViewIfNeeded();
        const [n, c, s] = await Promise.all([nav.boundingBox(), column.boundingBox(), signOut.boundingBox()]);
        // The last thing in the navigation lies inside the navigation's box and its column's panel.
        expect(s!.y + s!.height).toBeLessThanOrEqual(n!.y + n!.height + 0.5);
        expect(n!.y + n!.height).toBeLessThanOrEqual(c!.y + c!.height + 0.5);
        await screenshot(page, `layout-short-window${path.replace('/', '-')}`);
      }
    } finally {
      await context.close();
    }
  });
});
