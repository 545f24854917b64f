import { mkdirSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { seriousViolations } from './axe';
import { chromiumGate, openBrowser, openWorkbench, type OpenBrowser } from './browser';
import { cardPages, downloadOf, inkShare, pngSize } from './downloads';

const run = chromiumGate();

describe.runIf(run)('the output stage in Chromium', () => {
  let browser: OpenBrowser;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  const openOutput = async (on: OpenBrowser = browser) => {
    const bench = await openWorkbench(on, inject('baseUrl'));
    await bench.page.getByLabel('Output stage (transformer-coupled)').check();
    await bench.page.waitForSelector('[data-figure="clean-power"]');
    return bench;
  };

  it('dragging the operating point sets Rk and B+; dragging the load handle sets the primary impedance', async () => {
    const { page, errors } = await openOutput();
    const rk = () => page.getByRole('textbox', { name: /^Rk/ }).inputValue();
    const bplus = () => page.getByRole('textbox', { name: /^B\+/ }).inputValue();
    const before = { rk: await rk(), bplus: await bplus() };
    const point = page.getByRole('slider', { name: /operating point/i });
    await point.scrollIntoViewIfNeeded();
    const box = (await point.boundingBox())!;
    const x = box.x + box.width / 2;
    const y = box.y + box.height / 2;
    await page.mouse.move(x, y);
    await page.mouse.down();
    for (let k = 1; k <= 10; k++) await page.mouse.move(x + k * 6, y + k * 3);
    await page.mouse.up();
    await expect.poll(rk).not.toBe(before.rk);
    expect(await bplus()).not.toBe(before.bplus);

    const z = () => page.getByRole('textbox', { name: /^Primary Z/ }).inputValue();
    const zBefore = await z();
    const handle = page.getByRole('slider', { name: /primary impedance/i });
    await handle.scrollIntoViewIfNeeded();
    const hb = (await handle.boundingBox())!;
    await page.mouse.move(hb.x + hb.width / 2, hb.y + hb.height / 2);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(hb.x + hb.width / 2 + k * 8, hb.y + hb.height / 2 - k * 2);
    await page.mouse.up();
    await expect.poll(z).not.toBe(zBefore);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('switched to fixed bias, designs its bias supply: the rail, the string, the drawing, with no serious accessibility violation', async () => {
    // The accessibility check injects its script: a browser that lets it past the page's policy.
    const tooling = await openBrowser(undefined, { bypassCSP: true });
    const { page, errors } = await openOutput(tooling);
    await page.getByLabel('Fixed bias').first().check();
    const bias = page.getByRole('region', { name: 'Bias supply' });
    await bias.scrollIntoViewIfNeeded();
    await expect.poll(() => bias.getByTestId('bias-results').textContent()).toMatch(/Rail−\d+(\.\d+)? V/);
    expect(await bias.getByRole('img', { name: /^The bias supply drawn: 50 V winding, one diode/ }).count()).toBe(1);
    // Built and idling, the tube is read at its grid and across its 1 Ω sense resistor (millivolts as milliamps).
    const meter = page.getByRole('group', { name: 'Meter readings, Output · EL34' });
    await meter.getByRole('textbox', { name: /^Plate to chassis/ }).fill('320');
    await meter.getByRole('textbox', { name: /^Screen to chassis/ }).fill('330');
    await meter.getByRole('textbox', { name: /^Grid to chassis/ }).fill('-24');
    await meter.getByRole('textbox', { name: /^Across its 1 Ω sense resistor/ }).fill('70m');
    await meter.getByRole('textbox', { name: /^Across its 1 Ω sense resistor/ }).press('Enter');
    await expect.poll(() => meter.getByRole('status').textContent()).toMatch(/^Ik 70 mA \(the drop across its 1 Ω sense resistor\).* The designed idle reads [\d.]+ mV across the sense resistor: set the trimmer to it\.$/);
    // Printed, the amplifier still takes one sheet: the bias supply's parts are the card's (its last sections).
    await page.locator('[data-part-line="bias-rectifier"]').waitFor();
    await page.locator('.supply-parts [data-part-line="rectifier"]').waitFor();
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    expect((pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length).toBe(1);
    await page.emulateMedia({ media: 'screen' });
    // A winding too low for the strongest tube: said where the figures were, and the last good design kept.
    const winding = bias.getByRole('textbox', { name: /^Bias winding/ });
    await winding.fill('12');
    await expect.poll(() => bias.getByRole('alert').first().textContent()).toMatch(/^The bias rail gives −/);
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await tooling.close();
  });

  it('compares two output tubes on one chart', async () => {
    const { page, errors } = await openOutput();
    await page.getByLabel('Compare with').check();
    await expect.poll(() => page.locator('.layer-rival-curves path').count()).toBeGreaterThan(3);
    expect(await page.locator('tr[data-row="clean"]').textContent()).toMatch(/W.*W/);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('has no serious accessibility violations (axe-core)', async () => {
    const tooling = await openBrowser(undefined, { bypassCSP: true });
    const { page } = await openOutput(tooling);
    expect(await seriousViolations(page)).toEqual([]);
    await tooling.close();
  });
});

describe.runIf(run)('keeping and exporting an output stage in Chromium', () => {
  let browser: OpenBrowser;
  beforeAll(async () => {
    browser = await openBrowser();
    mkdirSync('test-results', { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('exports an A4 build card of the output stage, and a reload brings the output stage back', async () => {
    const { page, errors } = await openWorkbench(browser, inject('baseUrl'));
    await page.getByLabel('Output stage (transformer-coupled)').check();
    await page.getByRole('textbox', { name: /^Primary Z/ }).fill('5k');
    await page.waitForSelector('[data-figure="clean-power"]');
    const card = await downloadOf(page, 'Build card (PNG, A4)');
    writeFileSync('test-results/output-build-card.png', card);
    expect(cardPages(pngSize(card))).toBeGreaterThanOrEqual(1);
    expect(await inkShare(page, card)).toBeGreaterThan(0.03);
    await page.waitForTimeout(700); // autosave waits 400 ms after the last change
    await page.reload();
    await page.waitForSelector('[data-figure="clean-power"]');
    expect(await page.getByRole('textbox', { name: /^Primary Z/ }).inputValue()).toBe('5k');
    expect(errors).toEqual([]);
    await page.close();
  });
});
