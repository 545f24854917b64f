import { describe, expect, inject, it } from 'vitest';
import { chromiumGate, openWorkbench } from './browser';
import { useBrowser } from './useBrowser';

const run = chromiumGate();

describe.runIf(run)('at the bench: offline and on paper', () => {
  const browser = useBrowser();

  it('once loaded, the workbench opens and works with the network gone, and it offers itself for installing', async () => {
    const { page } = await openWorkbench(browser.current, inject('baseUrl'));
    expect(await page.locator('link[rel="manifest"]').count()).toBe(1);
    // Wait until the service worker controls the page and has precached the build.
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
      if (!navigator.serviceWorker.controller) await new Promise((r) => navigator.serviceWorker.addEventListener('controllerchange', r, { once: true }));
    });
    await browser.current.context.setOffline(true);
    try {
      await page.reload();
      await page.waitForSelector('.layer-curves path');
      const ack = page.getByRole('button', { name: 'I understand' });
      if (await ack.isVisible()) await ack.click();
      // It works, not just shows: a typed value re-solves the stage.
      await page.getByRole('textbox', { name: /^B\+/ }).fill('300');
      await expect.poll(() => page.locator('[data-figure="bplus"] dd').textContent()).toMatch(/300/);
    } finally {
      await browser.current.context.setOffline(false);
    }
    await page.close();
  });

  it('prints on one A4 page, controls left off, the caution kept', async () => {
    const { page } = await openWorkbench(browser.current, inject('baseUrl'));
    // Printed once the page has settled: the supply solved, its nodes and its parts on the sheet.
    await page.locator('.supply-parts [data-part-line="rectifier"]').waitFor();
    await page.locator('tr[data-node="3"]').waitFor();
    await page.emulateMedia({ media: 'print' });
    // Every control is left off; the stage cards stay, as the amplifier on paper.
    expect(await page.locator('button:not(.chain-card)').first().isVisible()).toBe(false);
    expect(await page.locator('button.chain-card').first().isVisible()).toBe(true);
    expect(await page.getByRole('complementary', { name: 'Safety caution' }).isVisible()).toBe(true);
    await page.screenshot({ path: 'test-results/print.png', fullPage: true });
    const pdf = await page.pdf({ format: 'A4', printBackground: true, path: 'test-results/print.pdf' });
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    expect(pages).toBe(1);
    await page.close();
  });

  it('a push-pull amplifier prints on one A4 page too: split-load or long-tailed splitter, either stage on the bench', async () => {
    const { page } = await openWorkbench(browser.current, inject('baseUrl'));
    await page.getByLabel('Output stage (transformer-coupled)').check();
    await page.getByRole('radio', { name: 'Push-pull pair' }).check();
    const pagesPrinted = async (name: string) => {
      // Settled: the supply solved for this amplifier (its splitter's node fed) and its parts on the sheet.
      await expect.poll(() => page.locator('tr[data-node="3"]').textContent(), { timeout: 15_000 }).toContain('Splitter');
      await page.locator('.supply-parts [data-part-line="rectifier"]').waitFor();
      await page.emulateMedia({ media: 'print' });
      const pdf = await page.pdf({ format: 'A4', printBackground: true, path: `test-results/print-${name}.pdf` });
      await page.emulateMedia({ media: 'screen' });
      return (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    };
    expect(await pagesPrinted('pair-output-bench')).toBe(1);
    await page.getByRole('radio', { name: 'Long-tailed pair' }).check();
    expect(await pagesPrinted('pair-long-tailed')).toBe(1);
    await page.getByLabel('Voltage stage (resistance-coupled)').check();
    expect(await pagesPrinted('pair-voltage-bench')).toBe(1);
    await page.close();
  });
});
