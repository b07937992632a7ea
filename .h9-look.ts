import { chromium } from 'playwright-core';
const BASE = 'http://127.0.0.1:3219';
async function main() {
  const [email, ...paths] = process.argv.slice(2);
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu'] });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 1400 } });
    await page.goto(`${BASE}/sign-in`);
    await page.getByLabel('E-mail').fill(email!);
    await page.getByLabel('Password').fill('plating-demo-2026');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    for (const p of paths) {
      const [url, name] = p.split('=');
      const res = await page.goto(`${BASE}${url}`);
      await page.waitForTimeout(800);
      await page.screenshot({ path: `/tmp/h9/${name}.png`, fullPage: !name!.endsWith('-top'), clip: name!.endsWith('-top') ? { x: 0, y: Number(process.env.Y ?? 0), width: 1280, height: 1400 } : undefined });
      console.log(url, res?.status());
    }
  } finally {
    await browser.close();
  }
}
main();
