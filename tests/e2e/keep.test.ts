import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { chromiumGate, openBrowser, openWorkbench, type OpenBrowser } from './browser';
import { cardPages, downloadOf, inkShare, pngSize } from './downloads';

const run = chromiumGate();

describe.runIf(run)('compare, export and keep in Chromium', () => {
  let browser: OpenBrowser;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('compare mode draws two plate families and two operating points on shared axes', async () => {
    const { page, errors } = await openWorkbench(browser, inject('baseUrl'));
    await page.getByLabel('Second tube').selectOption('12AX7');
    expect(await page.locator('.layer-curves path').count()).toBeGreaterThanOrEqual(5);
    expect(await page.locator('.layer-rival-curves path').count()).toBeGreaterThanOrEqual(5);
    await expect.poll(() => page.locator('.handle-rival').getAttribute('visibility')).toBe('visible');
    expect(await page.locator('[data-series="rival-dc-load"]').count()).toBe(1);
    expect(await page.locator('.compare-table tbody tr').count()).toBeGreaterThan(10);
    await page.screenshot({ path: 'test-results/compare.png', fullPage: true });
    expect(errors).toEqual([]);
    await page.close();
  });

  it('exports the chart as a PNG at the chosen scale, not blank, and a build card on A4 proportions', async () => {
    const { page } = await openWorkbench(browser, inject('baseUrl'));
    const [, , w, h] = (await page.locator('svg.plate-chart').getAttribute('viewBox'))!.split(' ').map(Number);
    const png2 = await downloadOf(page, 'Chart PNG 2×');
    // The chart at twice its size, with the caption band (title, figures above; legend below) added to its height.
    const size2 = pngSize(png2);
    expect(size2.width).toBe(w! * 2);
    expect(size2.height / 2 - h!).toBeGreaterThan(80);
    expect(size2.height / 2 - h!).toBeLessThan(200);
    expect(await inkShare(page, png2)).toBeGreaterThan(0.05);
    const png3 = await downloadOf(page, 'Chart PNG 3×');
    expect(pngSize(png3)).toEqual({ width: w! * 3, height: (size2.height / 2) * 3 });
    const svg = (await downloadOf(page, 'Chart SVG')).toString('utf8');
    expect(svg).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg).toContain('class="layer-curves"'); // the static sheet, drawn in its own SVG on screen, is merged in
    expect(svg).toContain('12AU7, B+ 275 V, Ra 27 kΩ, Rk 1.2 kΩ bypassed'); // the title line
    expect(svg).toContain('Maximum plate voltage'); // the legend
    const card = await downloadOf(page, 'Build card (PNG, A4)');
    expect(cardPages(pngSize(card))).toBeGreaterThanOrEqual(1);
    expect(await inkShare(page, card)).toBeGreaterThan(0.03);
    // The demo is three stages: the whole amplifier is drawn across the page under the title (the band left of where the bench
    // stage's drawing alone had stood at the right is inked), before the chart.
    expect(await inkShare(page, card, { x: 60, y: 200, width: 640, height: 240 })).toBeGreaterThan(0.02);
    // The amplifier as a netlist for ngspice (run by ngspice in tests/spice/amplifierNetlist.spice.test.ts).
    const netlist = (await downloadOf(page, 'Netlist for ngspice (.cir)')).toString('utf8');
    expect(netlist).toMatch(/^\* .+: a netlist for ngspice\n/);
    expect(netlist).toMatch(/^\* stage 3 \(single-ended-output\)/m);
    expect(netlist).toMatch(/\n\.control\nop\n[\s\S]*\n\.endc\n\.end$/);
    // And on the demo's own supply (run by ngspice in tests/spice/amplifierOnSupplyNetlist.spice.test.ts).
    const onSupply = (await downloadOf(page, 'Netlist with the supply (.cir)')).toString('utf8');
    expect(onSupply).toMatch(/^\* The supply: secondary, rectifier and filter/m);
    expect(onSupply).not.toMatch(/^VB\d+ \S+ 0 DC/m);
    await page.close();
  });

  it('a reload brings the last design back', async () => {
    const { page } = await openWorkbench(browser, inject('baseUrl'));
    await page.getByRole('textbox', { name: /^Ra/ }).fill('33k');
    await page.waitForTimeout(700); // autosave waits 400 ms after the last change
    await page.reload();
    await page.waitForSelector('.layer-curves path');
    expect(await page.getByRole('textbox', { name: /^Ra/ }).inputValue()).toBe('33k');
    await page.close();
  });

  it('meter readings typed on the build sheet are read by the model and come back after a reload', async () => {
    const { page, errors } = await openWorkbench(browser, inject('baseUrl'));
    const stage1 = page.getByRole('group', { name: 'Meter readings, Stage 1 · 12AX7' });
    await stage1.getByRole('textbox', { name: /^Plate to chassis/ }).fill('175');
    await stage1.getByRole('textbox', { name: /^Cathode to chassis/ }).fill('1.5');
    await stage1.getByRole('textbox', { name: /^Cathode to chassis/ }).press('Enter');
    // Ohm's law: 1.5 V across the demo's 1.5 kΩ.
    await expect.poll(() => stage1.getByRole('status').textContent()).toMatch(/^Ia 1 mA \(the cathode’s drop across Rk\)/);
    await page.waitForTimeout(700); // autosave waits 400 ms after the last change
    await page.reload();
    await page.waitForSelector('.layer-curves path');
    expect(await stage1.getByRole('textbox', { name: /^Cathode to chassis/ }).inputValue()).toBe('1.5');
    expect(await stage1.getByRole('status').textContent()).toMatch(/^Ia 1 mA /);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('undo after a drag restores the previous Ra and Rk', async () => {
    const { page } = await openWorkbench(browser, inject('baseUrl'));
    const ra = await page.getByRole('textbox', { name: /^Ra/ }).inputValue();
    const rk = await page.getByRole('textbox', { name: /^Rk/ }).inputValue();
    await page.getByRole('slider', { name: /operating point/i }).scrollIntoViewIfNeeded();
    const box = (await page.getByRole('slider', { name: /operating point/i }).boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(box.x + box.width / 2 + k * 9, box.y + box.height / 2 - k * 4);
    await page.mouse.up();
    await expect.poll(() => page.getByRole('textbox', { name: /^Ra/ }).inputValue()).not.toBe(ra);
    await page.getByRole('button', { name: 'Undo' }).click();
    expect(await page.getByRole('textbox', { name: /^Ra/ }).inputValue()).toBe(ra);
    expect(await page.getByRole('textbox', { name: /^Rk/ }).inputValue()).toBe(rk);
    await page.close();
  });

  it('a share link opened in a fresh browser shows the same design', async () => {
    const { page } = await openWorkbench(browser, inject('baseUrl'));
    await page.getByRole('textbox', { name: /^Ra/ }).fill('39k');
    await page.getByRole('textbox', { name: 'Design title' }).fill('Shared by a colleague');
    await page.getByRole('button', { name: 'Share link' }).click();
    const link = await page.getByRole('textbox', { name: 'Share link for this design' }).inputValue();
    expect(link).toMatch(/#design=/);
    await page.close();
    const fresh = await openBrowser();
    try {
      const other = await openWorkbench(fresh, link);
      expect(await other.page.getByRole('textbox', { name: /^Ra/ }).inputValue()).toBe('39k');
      expect(await other.page.getByRole('textbox', { name: 'Design title' }).inputValue()).toBe('Shared by a colleague');
      expect(other.errors).toEqual([]);
    } finally {
      await fresh.close();
    }
  });
});
