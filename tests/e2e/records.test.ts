import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { cubeMesh, formatStoredQuantity, makeBinaryStl } from '@/lib/plating';
import { DEMO_PASSWORD } from '@/lib/seed';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

const run = Date.now().toString(36).toUpperCase().slice(-6);

describe('shop records', () => {
  it('[estimator] adds a part with its area from an STL upload', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const partNumber = `E2E-STL-${run}`;
    try {
      await signInAs(page, 'estimator@kestrel-plating.test', DEMO_PASSWORD);
      await page.goto(`${APP_URL}/parts/new`);
      await page.getByLabel('Customer', { exact: false }).first().selectOption({ label: 'HVI · Halvorsen Valve & Instrument' });
      await page.getByLabel('Customer’s part number').fill(partNumber);
      await page.getByLabel('Hardness').fill('36');
      await page.getByRole('radio', { name: 'From an STL model' }).check();
      await page.getByLabel('The model is drawn in').selectOption('mm');
      // A 20 mm cube: 6 × 20² mm² = 2400 mm² = 0.24 dm² (geometry by hand).
      await page.locator('#stl-file').setInputFiles({ name: 'cube-20mm.stl', mimeType: 'application/octet-stream', buffer: Buffer.from(makeBinaryStl(cubeMesh(20))) });
      const expected = formatStoredQuantity(0.24, 'area', 'metric');
      await page.getByTestId('stl-area').filter({ hasText: expected }).waitFor({ timeout: 30_000 });
      // The upload has finished when its progress message is gone.
      await page.getByText('Uploading cube-20mm.stl…').waitFor({ state: 'detached', timeout: 30_000 });
      await expect(page.getByRole('note').first().textContent()).resolves.toMatch(/embrittlement relief bake/);
      await screenshot(page, 'records-part-stl-preview');
      await page.getByRole('button', { name: 'Add part' }).click();
      await page.waitForURL(/\/parts\/[0-9a-f-]{36}\?saved=1$/, { timeout: 30_000 });
      await expect(page.getByTestId('part-area').textContent()).resolves.toBe(expected);
      await screenshot(page, 'records-part-saved');
      const part = await db.selectFrom('parts').select(['area_dm2', 'stl_file_id', 'weight_g']).where('part_number', '=', partNumber).executeTakeFirstOrThrow();
      expect(part.area_dm2).toBeCloseTo(0.24, 9);
      expect(part.stl_file_id).not.toBeNull();
      // 8 cm³ of carbon steel at 7.85 g/cm³ (the engine's substrate table).
      expect(part.weight_g).toBeCloseTo(62.8, 6);
    } finally {
      await context.close();
      await db.deleteFrom('parts').where('part_number', '=', partNumber).execute();
    }
  });

  it('[owner] imports customers from CSV; one bad row writes nothing', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const codes = [`E2A${run}`, `E2B${run}`, `E2C${run}`];
    const header = 'code,name,billing_address,shipping_address,billing_email,phone,payment_terms_days,tax_rate_percent';
    const good = [`${codes[0]},Elm Street Hardware,,,ap@elm.test,,30,7.25`, `${codes[1]},"Fir, Spruce & Co",,,,,45,0`];
    const bad = `${codes[2]},Larch Fittings,,,not-an-email,,30,7.255`;
    const file = (rows: string[]) => ({ name: 'customers.csv', mimeType: 'text/csv', buffer: Buffer.from(`${header}\r\n${rows.join('\r\n')}\r\n`) });
    const stored = () => db.selectFrom('customers').select('code').where('code', 'in', codes).execute();
    try {
      await signInAs(page, 'owner@kestrel-plating.test', DEMO_PASSWORD);
      await page.goto(`${APP_URL}/customers/import`);
      await page.locator('#import-file').setInputFiles(file([...good, bad]));
      await page.getByRole('button', { name: 'Check and import' }).click();
      await page.getByText('1 row has problems. Nothing was imported').waitFor({ timeout: 30_000 });
      const problems = page.getByRole('table', { name: /Problems found/ });
      await expect(problems.getByRole('row').count()).resolves.toBe(3); // header + two problems on row 4
      await expect(problems.textContent()).resolves.toMatch(/4\s*billing_email/);
      await expect(problems.textContent()).resolves.toMatch(/4\s*tax_rate_percent/);
      await screenshot(page, 'records-import-refused');
      expect(await stored()).toEqual([]);

      await page.locator('#import-file').setInputFiles(file(good));
      await page.getByRole('button', { name: 'Check and import' }).click();
      await page.getByText('Imported 2 customers.').waitFor({ timeout: 30_000 });
      await screenshot(page, 'records-import-done');
      expect((await stored()).map((r) => r.code).sort()).toEqual(codes.slice(0, 2).sort());
    } finally {
      await context.close();
      await db.deleteFrom('customers').where('code', 'in', codes).execute();
    }
  });
});
