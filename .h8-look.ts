import { chromium, type Page } from 'playwright-core';
const BASE = 'http://127.0.0.1:3218';
async function signIn(page: Page, email: string) {
  await page.goto(`${BASE}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('plating-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 120000 });
}
async function main() {
  const who = process.argv[2] ?? 'owner';
  const paths = process.argv.slice(3);
  const b = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu'] });
  try {
    const page = await b.newPage({ viewport: { width: 1280, height: 900 } });
    page.setDefaultTimeout(240000);
    await signIn(page, who === 'owner' ? 'owner@kestrel-plating.test' : who === 'hvi' ? 'quality@halvorsen-valve.test' : 'buyer@northgate-fastener.test');
    for (const p of paths) {
      const r = await page.goto(`${BASE}${p}`, { timeout: 180000 });
      await page.waitForTimeout(800);
      const name = `${who}${p.replace(/[^a-z0-9]+/gi, '-')}`.slice(0, 80);
      await page.screenshot({ path: `/tmp/h8/shots/${name}.png`, fullPage: true });
      console.log(p, r?.status(), name);
    }
  } finally {
    await b.close();
  }
}
void main();
