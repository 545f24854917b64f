import { mkdirSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { chromiumGate, openBrowser, openWorkbench, type OpenBrowser } from './browser';
import { cardPages, downloadOf, inkShare, pngSize } from './downloads';

const run = chromiumGate();

describe.runIf(run)('a push-pull output stage in Chromium', () => {
  let browser: OpenBrowser;
  beforeAll(async () => {
    browser = await openBrowser();
    mkdirSync('test-results', { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('is chosen with its phase splitter, given its tubes and load, dragged, saved, reloaded and exported as a build card', async () => {
    const { page, errors } = await openWorkbench(browser, inject('baseUrl'));
    await page.getByLabel('Output stage (transformer-coupled)').check();
    await page.getByRole('radio', { name: 'Push-pull pair' }).check();
    await page.getByRole('combobox', { name: 'Output tube', exact: true }).selectOption('EL84');
    const raa = page.getByRole('textbox', { name: /^Raa/ });
    await raa.fill('8k');
    await raa.press('Tab');
    await page.waitForSelector('[data-figure="worst-pa"]');
    // The strip ends in the splitter and the pair; the whole amplifier reaches the speaker.
    const strip = page.getByRole('region', { name: 'The amplifier, stage by stage' });
    const titles = () => strip.locator('button.chain-card .card-title').allTextContents();
    await expect.poll(async () => (await titles()).slice(-2)).toEqual(['Splitter · 12AU7 split-load phase splitter', 'Output · EL84 push-pull output']);
    // The direct-coupling box sits beside its words, on their first line (a later rule had wrapped it onto a line of its own).
    const direct = page.locator('.splitter-direct').first();
    const [tick, words] = [(await direct.locator('input').boundingBox())!, (await direct.locator('span').boundingBox())!];
    expect(tick.x + tick.width).toBeLessThanOrEqual(words.x);
    expect(tick.y).toBeLessThan(words.y + 20);
    await page.getByRole('radio', { name: 'Long-tailed pair' }).check();
    await expect.poll(async () => (await titles()).at(-2)).toBe('Splitter · 12AU7 long-tailed pair phase splitter');
    await expect.poll(() => strip.getByTestId('amplifier-figures').textContent()).toMatch(/Clean to\d+(\.\d+)? W/);
    // Dragged: the operating point sets the shared Rk (cathode bias) and B+.
    const rk = page.getByRole('textbox', { name: /^Rk/ });
    const rkBefore = await rk.inputValue();
    const point = page.getByRole('slider', { name: /operating point/i });
    await point.scrollIntoViewIfNeeded();
    const box = (await point.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(box.x + box.width / 2 + k * 4, box.y + box.height / 2 + k * 4);
    await page.mouse.up();
    await expect.poll(() => rk.inputValue()).not.toBe(rkBefore);
    const rkDragged = await rk.inputValue();
    // The composite load line and the lone tube's line are drawn, and the path at full drive.
    expect(await page.locator('.layer-lines path[data-series="alone-load"]').count()).toBeGreaterThan(0);
    await page.locator('.chart-frame').first().screenshot({ path: 'test-results/push-pull-chart.png' });
    await strip.screenshot({ path: 'test-results/push-pull-strip.png' });
    // The splitter on its own plate curves, in a panel of its own in the main column, wide enough to read.
    const splitter = page.getByRole('group', { name: 'Phase splitter', exact: true });
    const sheet = page.getByRole('region', { name: 'Phase splitter, 12AU7 long-tailed pair, on its plate curves' });
    expect(await sheet.getByRole('group', { name: /Plate curves of the phase splitter's 12AU7/ }).count()).toBe(1);
    expect((await sheet.locator('svg.plate-chart').boundingBox())!.width).toBeGreaterThan(500);
    // In the one plate-chart shell: its curves, its lines and its point, as every stage's chart.
    expect(await sheet.locator('.layer-curves path').count()).toBeGreaterThan(3);
    expect(await sheet.locator('.layer-lines path[data-series="dc-load"]').count()).toBe(1);
    expect(await sheet.locator('[data-splitter-point="first"]').count()).toBe(1);
    await sheet.screenshot({ path: 'test-results/push-pull-splitter-chart.png' });
    expect(await splitter.getByRole('table', { name: 'Splitter outputs' }).getByRole('row').count()).toBe(3);
    expect(await splitter.locator('[data-figure="splitter-balance"]').textContent()).toMatch(/Tail: .* mA/);
    await splitter.screenshot({ path: 'test-results/push-pull-splitter.png' });
    await page.screenshot({ path: 'test-results/push-pull.png', fullPage: true });
    // Printed, for the bench notes.
    await page.emulateMedia({ media: 'print' });
    await page.pdf({ format: 'A4', printBackground: true, path: 'test-results/print-push-pull.pdf' });
    await page.emulateMedia({ media: 'screen' });
    // Saved in the file.
    const file = JSON.parse((await downloadOf(page, 'Save file')).toString('utf8')) as { design: { output: { pair: string; raa: number; tubeId: string; splitter: { kind: string } } } };
    expect(file.design.output).toMatchObject({ pair: 'push-pull', raa: 8000, tubeId: 'EL84', splitter: { kind: 'long-tailed-pair' } });
    // Exported: the build card.
    const card = await downloadOf(page, 'Build card (PNG, A4)');
    writeFileSync('test-results/push-pull-build-card.png', card);
    // The pair, its splitter, the voltage stages' parts and the ratings run past one A4 page: the card goes on to a second.
    const pages = cardPages(pngSize(card));
    expect(pages).toBeGreaterThanOrEqual(2);
    expect(await inkShare(page, card)).toBeGreaterThan(0.03);
    // The last page reads from its left half: the parts run on there once the stages' figures have ended (they ran on
    // down the right half alone, the left half blank).
    expect(await inkShare(page, card, { x: 60, y: (pages - 1) * 1754 + 110, width: 560, height: 300 })).toBeGreaterThan(0.01);
    // Reloaded: the pair comes back as it was.
    await page.waitForTimeout(700); // autosave waits 400 ms after the last change
    await page.reload();
    await page.waitForSelector('[data-figure="worst-pa"]');
    expect(await page.getByRole('radio', { name: 'Push-pull pair' }).isChecked()).toBe(true);
    expect(await page.getByRole('textbox', { name: /^Raa/ }).inputValue()).toBe('8k');
    expect(await page.getByRole('textbox', { name: /^Rk/ }).inputValue()).toBe(rkDragged);
    expect(await page.getByRole('radio', { name: 'Long-tailed pair' }).isChecked()).toBe(true);
    expect(errors).toEqual([]);
    await page.close();
  });
});
