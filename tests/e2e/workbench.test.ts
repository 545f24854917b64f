import { mkdirSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { findTube, plateCurrent } from '../../src/index';
import { seriousViolations } from './axe';
import { chromiumGate, openBrowser, openWorkbench, type OpenBrowser } from './browser';

const run = chromiumGate();

const openBench = (browser: OpenBrowser) => openWorkbench(browser, inject('baseUrl'));

const value = (page: Page, label: RegExp) => page.getByRole('textbox', { name: label }).inputValue();

describe.runIf(run)('the workbench in Chromium', () => {
  let browser: OpenBrowser;
  beforeAll(async () => {
    browser = await openBrowser();
    mkdirSync('test-results', { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('dragging the operating point with the mouse changes Ra and Rk, keeps B+, and the point stays on the model\'s curve', async () => {
    const { page, errors } = await openBench(browser);
    const before = { bplus: await value(page, /^B\+/), ra: await value(page, /^Ra/), rk: await value(page, /^Rk/) };
    const handle = page.getByRole('slider', { name: /operating point/i });
    await handle.scrollIntoViewIfNeeded();
    const box = (await handle.boundingBox())!;
    const x = box.x + box.width / 2;
    const y = box.y + box.height / 2;
    await page.mouse.move(x, y);
    await page.mouse.down();
    for (let k = 1; k <= 12; k++) await page.mouse.move(x + k * 8, y - k * 5);
    await page.mouse.up();
    await page.waitForFunction((ra) => (document.querySelector('input[name="ra"]') as HTMLInputElement).value !== ra, before.ra);

    expect(await value(page, /^Ra/)).not.toBe(before.ra);
    expect(await value(page, /^Rk/)).not.toBe(before.rk);
    expect(await value(page, /^B\+/)).toBe(before.bplus);

    // The point drawn is the model's: on the 12AU7 curve for its own Vgk, to solver precision.
    const d = await handle.evaluate((el) => ({ ...(el as SVGGElement).dataset }));
    const vpk = Number(d.vpk);
    const ia = Number(d.ia);
    const vgk = Number(d.vgk);
    expect(Math.abs(plateCurrent(findTube('12AU7')!, vpk, vgk) - ia) / ia).toBeLessThan(1e-6);
    // And the figures strip shows those same values (to the three figures it prints).
    const shown = async (name: string) => Number((await page.locator(`[data-figure="${name}"] dd`).textContent())!.replace('−', '-').replace(/[^\d.-]/g, ''));
    expect(Math.abs((await shown('vpk')) - vpk)).toBeLessThan(0.5 + 1e-9);
    expect(Math.abs((await shown('ia')) - ia * 1e3) / (ia * 1e3)).toBeLessThan(0.005);
    expect(Math.abs((await shown('vgk')) - vgk) / Math.abs(vgk)).toBeLessThan(0.005);
    // The marker sits where the point moved to: right of and above where it started.
    const after = (await handle.boundingBox())!;
    expect(after.x).toBeGreaterThan(box.x + 20);
    expect(after.y).toBeLessThan(box.y - 10);

    await page.screenshot({ path: 'test-results/workbench-after-drag.png' });
    expect(errors).toEqual([]);
    await page.close();
  });

  it('dragging the load line\'s foot along the voltage axis changes B+', async () => {
    const { page } = await openBench(browser);
    const handle = page.getByRole('slider', { name: /^B\+/ });
    await handle.scrollIntoViewIfNeeded();
    const box = (await handle.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + 4);
    await page.mouse.down();
    for (let k = 1; k <= 6; k++) await page.mouse.move(box.x + box.width / 2 + k * 10, box.y + 4);
    await page.mouse.up();
    await page.waitForFunction(() => (document.querySelector('input[name="bplus"]') as HTMLInputElement).value !== '275');
    expect(Number(await value(page, /^B\+/))).toBeGreaterThan(275);
    await page.close();
  });

  it('typing a bad value shows its message beside the field and keeps the figures', async () => {
    const { page } = await openBench(browser);
    const ia = await page.locator('[data-figure="ia"] dd').textContent();
    await page.getByRole('textbox', { name: /^Ra/ }).fill('4k7k');
    await expect.poll(() => page.getByRole('alert').first().textContent()).toMatch(/not a part value/);
    expect(await page.locator('[data-figure="ia"] dd').textContent()).toBe(ia);
    await page.close();
  });

  it('every value box\'s message sits right under its box, as tall as its words (voltage bench with feedback on, then a push-pull pair behind its splitter)', async () => {
    // A browser of its own: the design it leaves behind (feedback on, a push-pull pair) would be the next test's autosave.
    const own = await openBrowser();
    const { page } = await openBench(own);
    const rf = page.getByRole('textbox', { name: /^Feedback Rf/ });
    await rf.fill('47k');
    await rf.press('Tab');
    await page.getByRole('textbox', { name: /^Across Rf/ }).waitFor();
    const misplaced: string[] = [];
    let checked = 0;
    const sweep = async () => {
      const fields = page.locator('.value-field:has(input):visible');
      for (let i = 0; i < (await fields.count()); i++) {
        const input = fields.nth(i).locator('input').first();
        const name = (await input.getAttribute('name')) ?? `box ${i}`;
        if (name.includes('eading.')) continue; // meter boxes: their messages are checked with their row (MeterReadings.test.tsx)
        const before = await input.inputValue();
        await input.fill('abc');
        await input.press('Tab');
        const message = fields.nth(i).locator('.field-error').first();
        await message.waitFor();
        // The words' own height (a range over them) against the message's box; and the gap from the input above it.
        const m = await message.evaluate((e) => {
          const words = document.createRange();
          words.selectNodeContents(e);
          const box = e.getBoundingClientRect();
          return { slack: box.height - words.getBoundingClientRect().height, gap: box.top - e.parentElement!.querySelector('input')!.getBoundingClientRect().bottom };
        });
        if (m.slack > 4 || m.gap < 0 || m.gap > 8) misplaced.push(`${name}: ${JSON.stringify(m)}`);
        checked++;
        await input.fill(before);
        await input.press('Tab');
      }
    };
    await sweep();
    await page.getByLabel('Output stage (transformer-coupled)').check();
    await page.getByRole('radio', { name: 'Push-pull pair' }).check();
    await page.getByRole('radio', { name: 'Long-tailed pair' }).check();
    await page.getByRole('textbox', { name: /^Raa/ }).waitFor();
    await sweep();
    // Feedback's two boxes had stood 405 px tall under a rule meant for the loop's own words beside them.
    expect(checked).toBeGreaterThan(60);
    expect(misplaced).toEqual([]);
    await own.close();
  });

  it('has no serious accessibility violations (axe-core)', async () => {
    const tooling = await openBrowser(undefined, { bypassCSP: true });
    const { page } = await openWorkbench(tooling, inject('baseUrl'));
    expect(await seriousViolations(page)).toEqual([]);
    await tooling.close();
  });

  it('its Content-Security-Policy refuses inline scripts', async () => {
    const { page } = await openBench(browser);
    const refused = await page.addScriptTag({ content: 'window.__inline = 1;' }).then(() => false, (e: Error) => /Content Security Policy/.test(e.message));
    expect(refused).toBe(true);
    expect(await page.evaluate(() => (window as unknown as { __inline?: number }).__inline)).toBeUndefined();
    await page.close();
  });

  it('every live figure fits its fixed box, for every tube in the library, in both stages', async () => {
    const { page, errors } = await openBench(browser);
    // A readout whose text is wider than its box would spill into the next figure (the box does not grow: see .readout).
    const overflowing = () =>
      page.evaluate(() =>
        [...document.querySelectorAll('.readout')].flatMap((box) => {
          const text = document.createRange();
          text.selectNodeContents(box);
          const spill = text.getBoundingClientRect().width - box.getBoundingClientRect().width;
          return spill > 0.5 ? [`${(box.closest('[data-figure]') as HTMLElement).dataset.figure}: “${box.textContent}” by ${spill.toFixed(1)} px`] : [];
        }),
      );
    const tubes = page.getByRole('radiogroup', { name: 'Tubes' }).getByRole('radio');
    const spills: string[] = [];
    for (let k = 0; k < (await tubes.count()); k++) {
      await tubes.nth(k).check();
      spills.push(...(await overflowing()));
    }
    // Values at the ends of what the fields accept widen the readings (MΩ, three-digit currents and gains).
    await tubes.first().check();
    for (const [field, text] of [['ra', '1.5M'], ['rk', '10k'], ['bplus', '450'], ['ra', '4.7k'], ['rk', '100']] as const) {
      await page.locator(`input[name="${field}"]`).fill(text);
      await page.locator(`input[name="${field}"]`).blur();
      spills.push(...(await overflowing()));
    }
    await page.getByLabel('Output stage (transformer-coupled)').check();
    const outputTubes = await page.getByLabel('Output tube', { exact: true }).locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
    expect(outputTubes.length).toBeGreaterThan(5);
    for (const id of outputTubes) {
      await page.getByLabel('Output tube', { exact: true }).selectOption(id);
      await page.waitForFunction(() => document.querySelector('[data-figure="limit-power"] dd')?.textContent !== '…');
      spills.push(...(await overflowing()));
    }
    for (const [field, text] of [['oZ', '1.2k'], ['oRk', '1.5k'], ['oBplus', '500'], ['oZ', '10k']] as const) {
      await page.locator(`input[name="${field}"]`).fill(text);
      await page.locator(`input[name="${field}"]`).blur();
      await page.waitForFunction(() => document.querySelector('[data-figure="limit-power"] dd')?.textContent !== '…');
      spills.push(...(await overflowing()));
    }
    expect(spills).toEqual([]);
    expect(errors).toEqual([]);
    await page.close();
  });
});
