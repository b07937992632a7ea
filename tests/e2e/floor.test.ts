import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { DEMO_PASSWORD } from '@/lib/seed';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';

// Phone size: the floor screens are made for a phone or tablet in a splash case.
const PHONE = { width: 390, height: 844 };
const OUTBOX = 'ampwright.floor.outbox.v1';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

async function platerOnPhone(): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
  const page = await context.newPage();
  await signInAs(page, 'plater@kestrel-plating.test', DEMO_PASSWORD);
  return { context, page };
}

const outboxKeys = (page: Page) => page.evaluate((k) => (JSON.parse(localStorage.getItem(k) ?? '[]') as { key: string }[]).map((e) => e.key), OUTBOX);

describe('floor', () => {
  it('[plater] logs an out-of-range nickel reading', async () => {
    const { context, page } = await platerOnPhone();
    try {
      await page.goto(`${APP_URL}/floor`);
      await page.getByRole('link', { name: /N-NI1/ }).click();
      await page.getByRole('link', { name: /Nickel metal/ }).click();
      await page.getByLabel('Burette reading').fill('15');
      // Before saving: 15 mL × 2.935 = 44.02 g/L, below the demo's 45 g/L lower specification limit.
      const live = page.getByTestId('live-result');
      await expect(live.getByTestId('live-value').textContent()).resolves.toMatch(/44\.02\s*g\/L/);
      await expect(live.getByText('Out of range').count()).resolves.toBe(1);
      await expect(live.getByText(/Below the lower specification limit \(45 g\/L\)/).count()).resolves.toBe(1);
      const advice = await live.getByTestId('recommendation').textContent();
      expect(advice).toMatch(/^Add \d+(\.\d+)? kg of Nickel sulfate hexahydrate\.$/);
      await screenshot(page, 'floor-nickel-out-of-range');

      await page.getByRole('button', { name: 'Save analysis' }).click();
      await page.getByText('Analysis saved.').waitFor();
      await expect(page.getByLabel('What was added').inputValue()).resolves.toBe('Nickel sulfate hexahydrate');
      await page.getByLabel('Amount added').fill('280');
      await page.getByRole('button', { name: 'Save addition' }).click();
      await page.getByText('Addition saved.').waitFor();
      await screenshot(page, 'floor-nickel-addition-recorded');

      const addition = await db
        .selectFrom('additions as ad')
        .innerJoin('analyses as an', 'an.id', 'ad.analysis_id')
        .innerJoin('tanks as t', 't.id', 'ad.tank_id')
        .select(['ad.amount', 'ad.unit', 'ad.material', 'ad.recommended_amount', 'an.verdict', 'an.value', 't.code'])
        .where('t.code', '=', 'N-NI1')
        .orderBy('ad.created_at', 'desc')
        .executeTakeFirstOrThrow();
      expect(addition).toMatchObject({ amount: 280, unit: 'kg', material: 'Nickel sulfate hexahydrate', verdict: 'out_of_range', code: 'N-NI1' });
      expect(addition.value).toBeCloseTo(15 * 2.93467, 2);
      expect(addition.recommended_amount).toBeGreaterThan(250);
    } finally {
      await context.close();
    }
  });

  it('[plater] logs two entries with the connection down; each is stored exactly once when it flickers back', async () => {
    const { context, page } = await platerOnPhone();
    try {
      await page.goto(`${APP_URL}/floor/tanks/N-NI1/analytes/ph`);
      await page.getByLabel('Reading').waitFor();
      await context.setOffline(true);

      await page.getByLabel('Reading').fill('4.85');
      await page.getByRole('button', { name: 'Save analysis' }).click();
      await page.getByText(/waiting to send/).first().waitFor();
      await page.getByRole('button', { name: 'Log another reading' }).click();
      await page.getByLabel('Reading').fill('4.92');
      await page.getByRole('button', { name: 'Save analysis' }).click();
      await expect(page.getByTestId('outbox-count').textContent()).resolves.toBe('2 entries waiting to send');
      await screenshot(page, 'floor-offline-waiting');
      const keys = await outboxKeys(page);
      expect(keys).toHaveLength(2);
      expect(await db.selectFrom('analyses').select('id').where('idempotency_key', 'in', keys).execute()).toHaveLength(0);

      // The first request reaches the server but its answer is lost (the connection drops again):
      // the device must send it again, and the server must not store it twice.
      let posts = 0;
      await page.route('**/api/floor/entries', async (route) => {
        posts++;
        if (posts === 1) {
          await route.fetch();
          await route.abort('connectionreset');
          return;
        }
        await route.continue();
      });
      await context.setOffline(false);
      await context.setOffline(true);
      await page.waitForTimeout(300);
      await context.setOffline(false);
      await page.getByTestId('outbox-count').waitFor({ state: 'detached', timeout: 30_000 });
      expect(await outboxKeys(page)).toEqual([]);
      expect(posts).toBeGreaterThanOrEqual(3);

      const stored = await db.selectFrom('analyses').select(['idempotency_key', 'value']).where('idempotency_key', 'in', keys).execute();
      expect(stored.map((r) => r.idempotency_key).sort()).toEqual([...keys].sort());
      expect(stored.map((r) => r.value).sort()).toEqual([4.85, 4.92]);
      await screenshot(page, 'floor-offline-sent');
    } finally {
      await context.close();
    }
  });
});
