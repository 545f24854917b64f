import { openBrowser, openWorkbench } from './tests/e2e/browser.ts';
const b = await openBrowser({ width: 1400, height: 1000 });
const { page, errors } = await openWorkbench(b, 'http://localhost:4199/');
await page.waitForTimeout(800);
await page.getByLabel('Output stage (transformer-coupled)').check();
await page.getByRole('radio', { name: 'Push-pull pair' }).check();
await page.getByRole('radio', { name: 'Long-tailed pair' }).check();
await page.waitForTimeout(2500);
const h = await page.evaluate(() => document.body.scrollHeight);
for (let y = 0, i = 0; y < h; y += 950, i++) {
  await page.evaluate((y) => window.scrollTo(0, y), y);
  await page.waitForTimeout(400);
  await page.screenshot({ path: `/tmp/p${i}.png` });
}
console.log(h, errors);
await b.close();
