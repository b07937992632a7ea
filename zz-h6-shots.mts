import { chromium } from 'playwright-core';
const BASE = process.env.BASE ?? 'http://127.0.0.1:3216';
const OUT = '/tmp/h6';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'] });
async function as(email: string, shots: [string, string][], viewport = { width: 1280, height: 900 }) {
  const ctx = await browser.newContext({ viewport });
  const page = await ctx.newPage();
  page.setDefaultTimeout(180_000);
  await page.goto(`${BASE}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('plating-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
  for (const [name, path] of shots) {
    const res = await page.goto(`${BASE}${path}`, { timeout: 300_000 });
    await page.waitForTimeout(Number(process.env.WAIT ?? 8000));
    await page.screenshot({ path: `${OUT}/${name}.png`, fullPage: true });
    console.log(name, res?.status());
  }
  await ctx.close();
}
const args = process.argv.slice(2);
const [email, ...rest] = args;
const shots: [string, string][] = [];
for (let i = 0; i < rest.length; i += 2) shots.push([rest[i]!, rest[i + 1]!]);
const phone = email!.startsWith('phone:');
await as(phone ? email!.slice(6) : email!, shots, phone ? { width: 390, height: 844 } : undefined);
await browser.close();
