// From the dock to the dock in a real browser: a short delivery with a photo is received and the
// customer told; two partial shipments leave with their packing slips; the customer sees the
// dates and papers of their own order, and another customer sees nothing of it.
import { randomInt } from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { DEMO_PASSWORD } from '@/lib/seed';
import { isoDate } from '@/lib/billing/dates';
import { formatDay } from '@/lib/quotes/format';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';
import { waitForMessage } from '../helpers/mailbox';

const PLATER = 'plater@kestrel-plating.test';
const SUPERVISOR = 'supervisor@kestrel-plating.test';
const BUYER = 'buyer@northgate-fastener.test';
const STRANGER = 'quality@halvorsen-valve.test';
// A 1×1 PNG (PNG spec §5.2 signature, IHDR, IDAT, IEND).
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

let browser: Browser;
let workOrderId = '';
const po = `PO-DOCK-${randomInt(100000, 999999)}`;

async function as<T>(email: string, name: string, fn: (page: Page) => Promise<T>): Promise<T> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  try {
    await signInAs(page, email, DEMO_PASSWORD);
    return await fn(page);
  } catch (err) {
    await screenshot(page, `dock-failed-${name}`).catch(() => undefined);
    throw err;
  } finally {
    await context.close();
  }
}

beforeAll(async () => {
  browser = await launchBrowser();
  // An accepted order of the demo's Northgate account (the quote-to-order story is walked in quotes.test.ts).
  const customer = await db.selectFrom('customers').select('id').where('code', '=', 'NGF').executeTakeFirstOrThrow();
  const part = await db.selectFrom('parts').select('id').where('part_number', '=', 'NGF-HX-0816').executeTakeFirstOrThrow();
  const finish = await db.selectFrom('finishes').select('id').where('code', '=', 'ZN-B633-SC2').executeTakeFirstOrThrow();
  const wo = await db
    .insertInto('work_orders')
    .values({ number: `W2099-${randomInt(1_000_000, 9_999_999)}`, customer_id: customer.id, part_id: part.id, finish_id: finish.id, po_number: po, due_date: '2027-01-15', quantity_ordered: 200, unit_price_cents: 30, pricing_basis: 'piece', total_cents: 6000 })
    .returning('id')
    .executeTakeFirstOrThrow();
  workOrderId = wo.id;
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe('dock to dock', () => {
  it('[plater] finds the order by its PO and receives a short delivery with a photo; the customer is e-mailed', async () => {
    const since = Date.now();
    await as(PLATER, 'receive', async (page) => {
      await page.goto(`${APP_URL}/receiving`);
      await page.getByLabel('PO, order, quote, customer or part').fill(po);
      await page.getByRole('button', { name: 'Find' }).click();
      await page.getByRole('row', { name: new RegExp(po) }).getByRole('link').click();
      await page.getByRole('heading', { name: 'Receive parts' }).waitFor();
      await page.getByLabel('Parts counted').fill('180');
      await page.getByLabel('Containers').fill('2');
      await page.getByLabel('Gross weight').fill('1.8');
      await page.getByLabel("Customer's lot").fill('NG-7781');
      await page.getByLabel('Discrepancy').selectOption('short');
      await page.getByLabel('What is wrong').fill('Packing list says 200; 180 counted, second carton light.');
      await page.setInputFiles('#receipt-photos', { name: 'carton.png', mimeType: 'image/png', buffer: PNG });
      await page.getByText('carton.png').waitFor();
      await screenshot(page, 'dock-receive-short');
      await page.getByRole('button', { name: 'Save receipt' }).click();
      await page.getByText(/^Receipt R\d{4}-\d{5} saved\. Discrepancy e-mailed to /).waitFor();
    });
    const mail = await waitForMessage(BUYER, new RegExp(`Receiving discrepancy on PO ${po}: short`), since);
    expect(mail.text).toContain('180 counted, second carton light.');
    expect(mail.text).toContain('Counted: 180 parts in 2 container(s), 1.8 kg (4 lb); ordered 200.');
  });

  let plannedDay = '';
  it('[supervisor] finds the received order on the schedule and drags it to another day; the customer sees that day', async () => {
    await as(SUPERVISOR, 'schedule', async (page) => {
      await page.goto(`${APP_URL}/schedule`);
      const number = (await db.selectFrom('work_orders').select('number').where('id', '=', workOrderId).executeTakeFirstOrThrow()).number;
      const chip = page.getByRole('button', { name: new RegExp(number) });
      await chip.waitFor();
      const from = await chip.locator('xpath=ancestor::td[1]').getAttribute('data-cell');
      const [tank, day] = from!.split(' ');
      // The next working day shown on the same tank's row.
      const cells = await page.locator(`td[data-cell^="${tank} "]`).evaluateAll((tds) => tds.map((td) => td.getAttribute('data-cell')!));
      const target = cells[cells.indexOf(from!) + 1]!;
      plannedDay = target.split(' ')[1]!;
      expect(plannedDay > day!).toBe(true);
      // A real drag: press on the chip, move over the other day's cell (twice, so the browser
      // fires dragover there), release.
      const cell = page.locator(`td[data-cell="${target}"]`);
      await chip.hover();
      await page.mouse.down();
      await cell.hover({ position: { x: 20, y: 10 } });
      await cell.hover({ position: { x: 24, y: 14 } });
      await page.mouse.up();
      await page.getByText(`Placed on ${formatDay(plannedDay)}.`, { exact: false }).waitFor();
      await page.locator(`td[data-cell="${target}"]`).getByRole('button', { name: new RegExp(`${number}.*placed`) }).waitFor();
      await screenshot(page, 'dock-schedule-placed');
      // The order's own page says the same day, linked to the schedule.
      await page.goto(`${APP_URL}/work-orders/${workOrderId}`);
      const row = page.locator('dt', { hasText: 'Planned on the line' }).locator('xpath=following-sibling::dd[1]');
      expect(await row.getByRole('link').textContent()).toContain(formatDay(plannedDay));
      await screenshot(page, 'dock-order-planned');
    });
    const placed = await db.selectFrom('schedule_placements').select(['day']).where('work_order_id', '=', workOrderId).executeTakeFirstOrThrow();
    expect(isoDate(placed.day)).toBe(plannedDay);
    await as(BUYER, 'portal-planned', async (page) => {
      await page.goto(`${APP_URL}/portal/orders/${workOrderId}`);
      await page.getByRole('heading', { name: 'Dates' }).waitFor();
      await page.getByText(formatDay(plannedDay), { exact: false }).first().waitFor();
    });
  });

  it('[plater] ships the inspected lot in two parts, each with its packing slip', async () => {
    // Runs, thickness and inspection are walked in quality.test.ts; here the lot is put at inspected.
    await db.updateTable('work_orders').set({ state: 'inspected' }).where('id', '=', workOrderId).execute();
    const since = Date.now();
    await as(PLATER, 'ship', async (page) => {
      await page.goto(`${APP_URL}/work-orders/${workOrderId}`);
      await page.getByRole('link', { name: 'Ship parts' }).first().click();
      await page.getByLabel('Parts in this shipment').fill('100');
      await page.getByLabel('Carrier').fill('Harbourline Freight');
      await page.getByLabel('Tracking or pro number').fill('HF-55120');
      await page.getByRole('button', { name: 'Ship and print the slip' }).click();
      await page.getByText(/^Shipment S\d{4}-\d{5} recorded\. Packing slip e-mailed to /).waitFor();
      await expect(page.getByLabel('Parts in this shipment').inputValue()).resolves.toBe('80');
      await page.getByLabel('Carrier').fill('Customer pickup');
      await page.getByRole('button', { name: 'Ship and print the slip' }).click();
      await page.getByText(/Every part is accounted for: the order is shipped\./).waitFor();
      await page.goto(`${APP_URL}/work-orders/${workOrderId}`);
      await page.getByText('Every part accounted for').waitFor();
      await expect(page.getByRole('link', { name: 'Packing slip' }).count()).resolves.toBe(2);
      await screenshot(page, 'dock-work-order-shipped');
    });
    await waitForMessage(BUYER, new RegExp(`Shipped: 100 parts on PO ${po}`), since);
    await waitForMessage(BUYER, new RegExp(`Shipped: 80 parts on PO ${po}`), since);
  });

  it('[customer] sees the dates, the discrepancy and both packing slips; another customer sees none of it', async () => {
    let slipUrl = '';
    await as(BUYER, 'portal', async (page) => {
      await page.goto(`${APP_URL}/portal/orders`);
      await page.getByRole('row', { name: new RegExp(po) }).getByRole('link').click();
      await page.getByRole('heading', { name: 'Dates' }).waitFor();
      await page.getByText('Short', { exact: true }).waitFor();
      await expect(page.getByRole('link', { name: 'Packing slip' }).count()).resolves.toBe(2);
      await expect(page.getByText('Not yet').count()).resolves.toBe(0);
      slipUrl = new URL((await page.getByRole('link', { name: 'Packing slip' }).first().getAttribute('href'))!, APP_URL).toString();
      const slip = await page.request.get(slipUrl);
      expect(slip.status()).toBe(200);
      expect(slip.headers()['content-type']).toBe('application/pdf');
      expect((await slip.body()).subarray(0, 5).toString()).toBe('%PDF-');
      await screenshot(page, 'dock-portal-order');
    });
    await as(STRANGER, 'stranger', async (page) => {
      const order = await page.goto(`${APP_URL}/portal/orders/${workOrderId}`);
      expect(order?.status()).toBe(404);
      expect((await page.request.get(slipUrl)).status()).toBe(404);
    });
  });
});
