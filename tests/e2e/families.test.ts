// Each of the shop's other lines walked through in the browser, as its people would: the estimator
// quotes it and sees the family's figures, the customer accepts, the plater logs the bath and the
// run at the tank, the supervisor is refused the certificate until the family's records pass, then
// issues it, and the customer sees it with the process in the trade's words.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { DEMO_PASSWORD } from '@/lib/seed';
import { APP_URL, launchBrowser, screenshot, signInAs } from '../helpers/browser';

const ESTIMATOR = 'estimator@kestrel-plating.test';
const PLATER = 'plater@kestrel-plating.test';
const SUPERVISOR = 'supervisor@kestrel-plating.test';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

async function as<T>(email: string, name: string, fn: (page: Page) => Promise<T>, viewport?: { width: number; height: number }): Promise<T> {
  const context = await browser.newContext(viewport ? { viewport } : {});
  const page = await context.newPage();
  page.setDefaultTimeout(30_000);
  try {
    await signInAs(page, email, DEMO_PASSWORD);
    return await fn(page);
  } catch (err) {
    await screenshot(page, `families-failed-${name}`).catch(() => undefined);
    throw err;
  } finally {
    await context.close();
  }
}

type Walk = {
  key: string;
  customer: { label: string; contact: string; email: string };
  part: string;
  finish: string;
  quantity: string;
  /** A figure of the family the quote line must show. */
  figure: RegExp;
  tank: string;
  analyte: { link: RegExp; fill: (page: Page) => Promise<void> };
  run: (page: Page) => Promise<void>;
  refusal: RegExp;
  records: (page: Page) => Promise<void>;
  portal: RegExp;
};

const WALKS: Walk[] = [
  {
    key: 'electroless',
    customer: { label: 'Halvorsen Valve & Instrument (HVI)', contact: 'Ingrid Sorensen', email: 'quality@halvorsen-valve.test' },
    part: 'HV-BODY-120', finish: 'EN-B733-25', quantity: '12', figure: /Share of a metal turnover/,
    tank: 'E-EN1',
    analyte: { link: /Nickel metal/, fill: (p) => p.getByLabel('Burette reading').fill('10.2') },
    run: async (p) => {
      await p.getByLabel('Minutes per load in the bath').fill('112');
      await p.getByLabel('Bath temperature').fill('88');
      await p.getByText('Meets the minimum').waitFor();
    },
    refusal: /The phosphorus content has not been recorded\./,
    records: async (p) => {
      const section = p.getByRole('region', { name: 'Phosphorus content' });
      await section.getByLabel(/^Phosphorus/).fill('8.2');
      await section.getByRole('button', { name: 'Record' }).click();
      await p.getByText('Phosphorus content recorded: passes.').waitFor();
    },
    portal: /Autocatalytic \(electroless\) nickel–phosphorus, 8 % phosphorus nominal \(ASTM B733 Type IV\)/,
  },
  {
    key: 'anodizing',
    customer: { label: 'Halvorsen Valve & Instrument (HVI)', contact: 'Ingrid Sorensen', email: 'quality@halvorsen-valve.test' },
    part: 'HV-ACT-6061', finish: 'AN-8625-II', quantity: '12', figure: /Change on a diameter/,
    tank: 'A-AN1',
    analyte: { link: /Free sulfuric acid/, fill: (p) => p.getByLabel('Burette reading').fill('18.4') },
    run: async (p) => {
      await p.getByText('Rectifier amps').click();
      // 12 × 1.45 dm² at 1.5 A/dm² = 26.1 A; 40 min → 15.7 µm by the 720 rule.
      await p.getByLabel('Rectifier current').fill('26.1');
      await p.getByLabel('Minutes per load under current').fill('40');
      await p.getByText('Meets the minimum').waitFor();
    },
    refusal: /The seal quality test has not been recorded\./,
    records: async (p) => {
      const section = p.getByRole('region', { name: 'Seal quality test' });
      await section.getByLabel(/^Result/).fill('1');
      await section.getByLabel(/^Limit in the specification/).fill('2');
      await section.getByRole('button', { name: 'Record' }).click();
      await p.getByText('Seal quality test recorded: passes.').waitFor();
    },
    portal: /Anodized in sulfuric acid \(Type II\), sealed in hot deionised water/,
  },
  {
    key: 'passivation',
    customer: { label: 'Northgate Fastener Co. (NGF)', contact: 'Glen Okafor', email: 'buyer@northgate-fastener.test' },
    part: 'NGF-SS-0612', finish: 'PS-A967-N2', quantity: '250', figure: /Tank occupied by the lot/,
    tank: 'P-NT1',
    analyte: { link: /Nitric acid/, fill: (p) => p.getByLabel('Burette reading').fill('22.2') },
    run: async (p) => {
      await p.getByLabel('Minutes per load in the bath').fill('30');
      await p.getByLabel('Bath temperature').fill('27');
      await p.getByLabel('Acid concentration').fill('25');
      await p.getByText('Inside the process window').waitFor();
    },
    refusal: /The passivation verification test has not been recorded\./,
    records: async (p) => {
      const section = p.getByRole('region', { name: 'Passivation verification test' });
      await section.getByLabel(/^Result/).selectOption('pass');
      await section.getByRole('button', { name: 'Record' }).click();
      await p.getByText('Passivation verification test recorded: passes.').waitFor();
    },
    portal: /Passivated per ASTM A967, treatment Nitric 2/,
  },
];

describe.each(WALKS)('the $key line', (w) => {
  let quoteId = '';
  let workOrderId = '';
  let workOrderNumber = '';
  const po = `PO-${w.key.slice(0, 3).toUpperCase()}-${Date.now().toString(36).toUpperCase()}`;

  it(`[estimator] quotes ${w.finish} and sees the family's own figures`, async () => {
    await as(ESTIMATOR, `${w.key}-estimator`, async (page) => {
      await page.goto(`${APP_URL}/quotes/new`);
      await page.getByLabel(/^Customer\b/).selectOption({ label: w.customer.label });
      await page.getByRole('button', { name: 'Create draft quote' }).click();
      await page.getByRole('heading', { level: 1 }).waitFor();
      const partOption = page.getByLabel(/^Part\b/).locator('option', { hasText: w.part });
      await page.getByLabel(/^Part\b/).selectOption({ label: (await partOption.first().textContent())!.trim() });
      const finishOption = page.getByLabel(/^Finish\b/).locator('option', { hasText: w.finish });
      await page.getByLabel(/^Finish\b/).selectOption({ label: (await finishOption.first().textContent())!.trim() });
      await page.getByLabel(/^Quantity\b/).fill(w.quantity);
      await page.getByRole('button', { name: 'Add and price line' }).click();
      await page.getByText('Line added and priced.').waitFor();
      await page.getByText(w.figure).first().waitFor();
      await screenshot(page, `families-${w.key}-quote`);
      await page.getByLabel('Send to').selectOption({ label: `${w.customer.contact} <${w.customer.email}>` });
      await page.getByRole('button', { name: 'Send quote' }).click();
      await page.getByText(`Sent to ${w.customer.email} with the PDF attached.`).waitFor();
      quoteId = new URL(page.url()).pathname.split('/').pop() ?? '';
    });
  });

  it('[customer] accepts it with a PO number', async () => {
    expect(quoteId).not.toBe('');
    await as(w.customer.email, `${w.key}-customer`, async (page) => {
      await page.goto(`${APP_URL}/portal/quotes/${quoteId}`);
      await page.getByLabel('Purchase-order number').fill(po);
      await page.getByRole('button', { name: 'Accept quote' }).click();
      const done = page.getByText(/Thank you\. Quote .* is accepted with PO/);
      await done.waitFor();
      workOrderNumber = (/W\d{4}-\d{5,}/.exec(await done.innerText()) ?? [''])[0];
    });
    const wo = await db.selectFrom('work_orders').select('id').where('number', '=', workOrderNumber).executeTakeFirstOrThrow();
    workOrderId = wo.id;
  });

  it('[plater] titrates the bath at the tank and logs the run on a phone', async () => {
    expect(workOrderId).not.toBe('');
    await as(PLATER, `${w.key}-plater`, async (page) => {
      await page.goto(`${APP_URL}/floor/tanks/${w.tank}`);
      await page.getByRole('link', { name: w.analyte.link }).first().click();
      await w.analyte.fill(page);
      await page.getByRole('button', { name: 'Save analysis' }).click();
      await page.getByText('Analysis saved.').waitFor();

      await page.goto(`${APP_URL}/work-orders/${workOrderId}/receive`);
      await page.getByLabel('Parts counted').fill(w.quantity);
      await page.getByRole('button', { name: 'Save receipt' }).click();
      await page.getByText(/^Receipt R\d{4}-\d{5} saved/).waitFor();
      await page.goto(`${APP_URL}/work-orders/${workOrderId}/log-run`);
      await page.getByLabel(/^Tank/).selectOption({ index: 1 });
      await w.run(page);
      await screenshot(page, `families-${w.key}-run`);
      await page.getByRole('button', { name: 'Save run' }).click();
      await page.getByText(/^Run saved/).waitFor();
    }, { width: 412, height: 915 });
  });

  it('[supervisor] is refused the certificate until the records pass, then issues it', async () => {
    await as(SUPERVISOR, `${w.key}-supervisor`, async (page) => {
      await page.goto(`${APP_URL}/work-orders/${workOrderId}`);
      await page.getByRole('button', { name: 'Mark plated' }).click();
      await page.getByText('Now plated.').waitFor();
      await page.goto(`${APP_URL}/quality/orders/${workOrderId}`);
      await page.getByRole('button', { name: 'Sign and issue the certificate' }).click();
      await page.getByText(w.refusal).first().waitFor();
      await screenshot(page, `families-${w.key}-refused`);
      // Thickness, where the family makes a coating: the sample, all passing.
      const rows = page.getByLabel(/^Thickness in µm, part \d+$/);
      const count = await rows.count();
      for (let i = 0; i < count; i++) await rows.nth(i).fill(w.key === 'electroless' ? '27' : '15');
      if (count) {
        await page.getByRole('button', { name: new RegExp(`^Save ${count} readings?$`) }).click();
        await page.getByText(new RegExp(`^Saved ${count} readings?`)).waitFor();
      }
      await w.records(page);
      await page.goto(`${APP_URL}/work-orders/${workOrderId}`);
      await page.getByRole('button', { name: 'Mark inspected' }).click();
      await page.getByText('Now inspected.').waitFor();
      await page.goto(`${APP_URL}/quality/orders/${workOrderId}`);
      await page.getByRole('button', { name: 'Sign and issue the certificate' }).click();
      await page.getByText(/^Issued CC\d{4}-\d{5}$/).waitFor();
      await screenshot(page, `families-${w.key}-issued`);
    });
  });

  it('[customer] sees the certificate with the process in the trade’s words', async () => {
    const cert = await db.selectFrom('certificates').select(['id', 'number']).where('work_order_id', '=', workOrderId).executeTakeFirstOrThrow();
    await as(w.customer.email, `${w.key}-customer-cert`, async (page) => {
      await page.goto(`${APP_URL}/portal/certificates/${cert.id}`);
      await page.getByRole('heading', { name: cert.number }).waitFor();
      await page.getByText(w.portal).waitFor();
      await screenshot(page, `families-${w.key}-portal-certificate`);
    });
  });
});
