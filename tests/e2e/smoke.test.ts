import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { chromiumGate, openBrowser, openWorkbench, type OpenBrowser } from './browser';

const run = chromiumGate();

describe.runIf(run)('the built workbench in Chromium', () => {
  let browser: OpenBrowser;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('loads with no console errors and draws the plate curves', async () => {
    const { page, errors } = await openWorkbench(browser, inject('baseUrl'));
    expect(await page.locator('h1').textContent()).toBe('Quiescent');
    expect(await page.locator('.layer-curves path').count()).toBeGreaterThanOrEqual(5);
    expect(await page.getByLabel('Safety caution').textContent()).toMatch(/lethal voltages/i);
    expect(await page.getByRole('slider', { name: /operating point/i }).count()).toBe(1);
    // The amplifier solved on its supply in the Web Worker: the node table arrives.
    await page.getByTestId('supply-results').waitFor({ timeout: 15_000 });
    expect(await page.locator('.supply-nodes tbody tr').count()).toBe(4);
    mkdirSync('test-results', { recursive: true });
    await page.screenshot({ path: 'test-results/smoke.png', fullPage: true });
    await page.locator('.chain-strip').screenshot({ path: 'test-results/chain-strip.png' });
    // The supply is taller than the window: clipped from the whole page.
    const box = (await page.locator('.supply').boundingBox())!;
    const scrollY = await page.evaluate(() => window.scrollY);
    await page.screenshot({ path: 'test-results/supply.png', fullPage: true, clip: { x: box.x, y: box.y + scrollY, width: box.width, height: box.height } });
    expect(errors).toEqual([]);
  });
});
