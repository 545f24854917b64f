import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { chromiumGate, openBrowser, type OpenBrowser } from './browser';

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
    const page = await browser.context.newPage();
    const errors: string[] = [];
    page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
    page.on('pageerror', (e) => errors.push(String(e)));
    await page.goto(inject('baseUrl'));
    await page.waitForSelector('.layer-curves path');
    expect(await page.locator('h1').textContent()).toBe('Quiescent');
    expect(await page.locator('.layer-curves path').count()).toBeGreaterThanOrEqual(5);
    expect(await page.getByLabel('Safety caution').textContent()).toMatch(/lethal voltages/i);
    mkdirSync('test-results', { recursive: true });
    await page.screenshot({ path: 'test-results/smoke.png', fullPage: true });
    expect(errors).toEqual([]);
  });
});
