import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { recordReadings } from '@/lib/quality/thickness';
import { DEMO_PASSWORD } from '@/lib/seed';
import { actorFor, createLot, inspect, passingReadings, PLATER } from '../integration/quality/fixtures';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';

let browser: Browser;
// A lot of 20 for Northgate (Z1.4 code C → 5 parts) with its five readings, inspected and ready to certify;
// a bake lot plated three hours ago; a lot with no readings yet.
let ready: { id: string; number: string };
let bakeLot: { id: string; number: string };
let bare: { id: string; number: string };
let certificateNumber = '';

beforeAll(async () => {
  browser = await launchBrowser();
  ready = await createLot(db, { quantity: 20 });
  await recordReadings(await actorFor(db, PLATER), { workOrderId: ready.id, entry: 'manual', readings: passingReadings(5) });
  await inspect(db, ready.id);
  bakeLot = await createLot(db, { bake: true, quantity: 60, platingEnd: new Date(Date.now() - 3 * 3_600_000) });
  bare = await createLot(db, { quantity: 20 });
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

async function signedIn(email: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 1000 } })).newPage();
  await signInAs(page, email, DEMO_PASSWORD);
  return page;
}

describe('lot quality', () => {
  it('[plater] enters readings by hand and sees them judged', async () => {
    const page = await signedIn(PLATER);
    try {
      await page.goto(`${APP_URL}/quality/orders/${bare.id}`);
      await expect(page.getByText('Measure 5 parts').count()).resolves.toBe(1);
      const values = ['9.6', '10.2', '7.4', '11.0', '10.8'];
      for (const [i, v] of values.entries()) await page.getByLabel(`Thickness in µm, part ${i + 1}`).fill(v);
      await page.getByRole('button', { name: 'Save 5 readings' }).click();
      await page.getByText('Saved 5 readings. 1 of 5 readings fail (1 below the minimum 8 µm). A nonconformance is open for the lot.').waitFor();
      await expect(page.getByText('Below minimum').count()).resolves.toBeGreaterThan(0);
      await screenshot(page, 'quality-plater-readings');
    } finally {
      await page.context().close();
    }
  });

  it('[plater] sees the bake window count down on the floor screen', async () => {
    const page = await signedIn(PLATER);
    try {
      await page.goto(`${APP_URL}/quality/bake-board`);
      const card = page.locator('li', { hasText: bakeLot.number });
      await card.getByText(/59 min left|1 h 00 min left/).first().waitFor();
      await screenshot(page, 'quality-bake-board');
    } finally {
      await page.context().close();
    }
  });

  it('[supervisor] is refused a certificate while readings are missing, with the reason', async () => {
    const page = await signedIn('supervisor@kestrel-plating.test');
    try {
      const other = await createLot(db, { quantity: 20 });
      await page.goto(`${APP_URL}/quality/orders/${other.id}`);
      await page.getByRole('button', { name: 'Sign and issue the certificate' }).click();
      await page.getByText('The certificate cannot be issued yet. Thickness readings are missing: 0 of 5 sampled parts measured (lot of 20, code C).').waitFor();
      await screenshot(page, 'quality-certificate-refused');
    } finally {
      await page.context().close();
    }
  });

  it('[supervisor] issues a certificate', async () => {
    const page = await signedIn('supervisor@kestrel-plating.test');
    try {
      await page.goto(`${APP_URL}/quality/orders/${ready.id}`);
      await screenshot(page, 'quality-lot-ready');
      await page.getByRole('button', { name: 'Sign and issue the certificate' }).click();
      // Once issued, the card shows the signed certificate in place of the button.
      const issued = page.getByText(/^Issued CC\d{4}-\d{5}$/);
      await issued.waitFor({ timeout: 60_000 });
      certificateNumber = /CC\d{4}-\d{5}/.exec((await issued.textContent()) ?? '')![0];
      await page.getByText(/^Signed by Priya Natarajan, /).waitFor();
      await page.getByRole('link', { name: 'Open the PDF' }).waitFor();
      await screenshot(page, 'quality-certificate-issued');
      // The button is gone: an issued certificate is not issued again.
      await expect(page.getByRole('button', { name: 'Sign and issue the certificate' }).count()).resolves.toBe(0);
    } finally {
      await page.context().close();
    }
  });

  it('[customer] downloads it', async () => {
    expect(certificateNumber).toMatch(/^CC/);
    const page = await signedIn('buyer@northgate-fastener.test');
    try {
      await page.getByRole('navigation').first().getByRole('link', { name: 'Certificates', exact: true }).click();
      await page.waitForURL(`${APP_URL}/portal/certificates`);
      await page.getByRole('link', { name: certificateNumber, exact: true }).click();
      await page.getByRole('heading', { name: certificateNumber }).waitFor();
      await screenshot(page, 'quality-portal-certificate');
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download the PDF' }).click()]);
      expect(download.suggestedFilename()).toBe(`${certificateNumber}.pdf`);
      const chunks: Buffer[] = [];
      for await (const c of (await download.createReadStream())!) chunks.push(c as Buffer);
      expect(Buffer.concat(chunks).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    } finally {
      await page.context().close();
    }
  });

  it("[customer] of another company gets not found for that certificate", async () => {
    const page = await signedIn('quality@halvorsen-valve.test');
    try {
      const cert = await db.selectFrom('certificates').select('id').where('number', '=', certificateNumber).executeTakeFirstOrThrow();
      const res = await page.goto(`${APP_URL}/portal/certificates/${cert.id}`);
      expect(res?.status()).toBe(404);
      const api = await page.request.get(`${APP_URL}/api/portal/certificates/${cert.id}`);
      expect(api.status()).toBe(404);
      await page.goto(`${APP_URL}/portal/certificates`);
      await expect(page.getByText(certificateNumber).count()).resolves.toBe(0);
    } finally {
      await page.context().close();
    }
  });
});
