import { describe, expect, inject, it } from 'vitest';
import { chromiumGate, openWorkbench } from './browser';
import { useBrowser } from './useBrowser';

const run = chromiumGate();

/** Points from a smooth 3/2-power family, in the box's units (V, V, mA). */
const points = (n: number) =>
  Array.from({ length: n }, (_, k) => {
    const vg = -2 * (k % 6);
    const va = 40 + ((k * 7) % 300);
    return `${va}, ${vg}, ${Math.max(0.01, 1.2e-3 * Math.pow(Math.max(0, va / 20 + vg), 1.5)).toFixed(4)}`;
  }).join('\n');

describe.runIf(run)('heavy work off the page\'s thread', () => {
  const browser = useBrowser();

  it('a 10,000-point fit runs in a worker with progress, can be cancelled, and then runs to the end', async () => {
    const { page, errors } = await openWorkbench(browser.current, inject('baseUrl'));
    const box = page.locator('.custom-tube textarea').first();
    await box.evaluate((el) => el.scrollIntoView());
    await box.evaluate((el, t) => {
      Object.getOwnPropertyDescriptor(HTMLTextAreaElement.prototype, 'value')!.set!.call(el, t);
      el.dispatchEvent(new Event('input', { bubbles: true }));
    }, points(10_000));
    const fitButton = page.locator('.custom-tube button', { hasText: 'Fit the model' });
    await fitButton.click({ force: true });
    await page.waitForSelector('.custom-tube progress', { state: 'attached' });
    await page.locator('.custom-tube button', { hasText: 'Cancel' }).click({ force: true });
    await expect.poll(() => page.locator('.custom-tube [role="status"]').textContent()).toBe('Fit cancelled: nothing changed.');
    expect(await page.locator('[data-testid="fit-summary"]').count()).toBe(0);
    await fitButton.click({ force: true });
    // Where the fit stands, should it not finish: the progress bar's value, or the status line.
    const state = () => page.locator('.custom-tube').evaluate((el) => `progress ${el.querySelector('progress')?.value ?? 'none'}; status ${el.querySelector('[role="status"]')?.textContent ?? 'none'}`);
    await page.waitForSelector('[data-testid="fit-summary"]', { state: 'attached', timeout: 60_000 }).catch(async (e: Error) => {
      throw new Error(`${e.message.split('\n')[0]} (${await state()})`);
    });
    expect(await page.locator('[data-testid="fit-summary"]').textContent()).toMatch(/RMS error/);
    expect(errors).toEqual([]);
    await page.close();
  }, 150_000); // two fits of 10,000 points on a loaded 2-core CI machine (a few seconds each alone)
});
