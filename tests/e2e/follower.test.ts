import { mkdirSync } from 'node:fs';
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { seriousViolations } from './axe';
import { chromiumGate, openBrowser, openWorkbench } from './browser';
import { useBrowser } from './useBrowser';

const run = chromiumGate();

/** The demo with a cathode follower after its driver, put on the bench from its card. */
async function followerOnBench(page: Page): Promise<void> {
  await page.getByRole('button', { name: "Add a cathode follower direct-coupled to Stage 2's plate" }).click();
  const cards = page.getByRole('region', { name: 'The amplifier, stage by stage' }).locator('button.chain-card');
  await expect.poll(() => cards.count()).toBe(4);
  await cards.nth(2).click();
  await expect.poll(() => cards.nth(2).getAttribute('aria-pressed')).toBe('true');
}

const figure = (page: Page, name: string) => page.locator(`[data-figure="${name}"] dd`);
const mA = (text: string | null) => Number.parseFloat((text ?? '').replace('−', '-'));

describe.runIf(run)('a cathode follower on the bench in Chromium', () => {
  const browser = useBrowser();

  it('is shown on its own curves, dragged and moved by keyboard to choose its Rk, compared with a second tube, and kept through a reload', async () => {
    mkdirSync('test-results', { recursive: true });
    const { page, errors } = await openWorkbench(browser.current, inject('baseUrl'));
    await followerOnBench(page);
    await expect.poll(() => page.getByRole('group', { name: /^Plate curves of the follower's 12AU7/ }).count()).toBe(1);
    const rk = page.locator('input[name=rk2]');
    const rk0 = await rk.inputValue();
    const ia0 = mA(await figure(page, 'follower-ia').textContent());
    // Dragged up: more current, a smaller Rk; the release snaps it to the series.
    const point = page.getByRole('slider', { name: /follower's operating point/ });
    await point.scrollIntoViewIfNeeded();
    const box = (await point.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2 - k * 5);
    await page.mouse.up();
    await expect.poll(async () => mA(await figure(page, 'follower-ia').textContent())).toBeGreaterThan(ia0);
    const rkDragged = await rk.inputValue();
    expect(rkDragged).not.toBe(rk0);
    await page.locator('.sheet-panel').screenshot({ path: 'test-results/follower-chart.png' });
    // By keyboard: down three steps is less current; Enter settles it.
    const ia1 = mA(await figure(page, 'follower-ia').textContent());
    await point.focus();
    for (let k = 0; k < 3; k++) await page.keyboard.press('ArrowDown');
    await page.keyboard.press('Enter');
    await expect.poll(async () => mA(await figure(page, 'follower-ia').textContent())).toBeLessThan(ia1);
    const rkKeyed = await rk.inputValue();
    // A second tube in the same socket: its row beside the first.
    await page.getByRole('checkbox', { name: 'Compare with' }).check();
    await page.getByRole('combobox', { name: 'Second tube' }).selectOption('12AT7');
    const table = page.locator('.compare-table');
    await expect.poll(() => table.locator('th').allTextContents()).toContain('12AT7');
    expect(await table.locator('tr[data-row="ia"] td').count()).toBe(2);
    // Printed with the follower on the bench: the whole amplifier's page, its supply solved and its parts listed, still fits one A4 sheet.
    await page.locator('.supply-parts [data-part-line="rectifier"]').waitFor();
    await page.locator('tr[data-node="3"]').waitFor();
    await page.emulateMedia({ media: 'print' });
    const pdf = (await page.pdf({ format: 'A4', printBackground: true, path: 'test-results/print-follower.pdf' })).toString('latin1');
    expect(pdf.match(/\/Type\s*\/Page[^s]/g)?.length).toBe(1);
    await page.emulateMedia({ media: 'screen' });
    // Kept: a reload opens on the follower with its Rk.
    await page.waitForTimeout(1200);
    await page.reload();
    await expect.poll(() => page.locator('input[name=rk2]').inputValue()).toBe(rkKeyed);
    await expect.poll(() => figure(page, 'follower-vk').count()).toBe(1);
    expect(errors).toEqual([]);
  });

  it('with targets set, marks where along its line they hold, and takes the top-ranked tube as the follower', async () => {
    // A browser of its own: the one above keeps the last test's autosave, whose follower is already added.
    const fresh = await openBrowser();
    const { page, errors } = await openWorkbench(fresh, inject('baseUrl'));
    await followerOnBench(page);
    await page.locator('input[name=tDiss]').fill('50');
    await page.locator('input[name=tClean]').fill('20');
    await page.locator('input[name=tClean]').press('Tab');
    const status = page.getByTestId('region-status');
    await expect.poll(() => status.textContent(), { timeout: 15_000 }).toMatch(/^\d+ of \d+ points along the follower's line meet every target\.$/);
    // The band is drawn by the chart's effect, which runs after the commit that writes the status (on a loaded
    // machine a frame or more later): waited for, as the status is.
    await expect.poll(() => page.locator('[data-region="inside"] path').count(), { timeout: 5_000 }).toBeGreaterThan(0);
    await page.locator('.sheet-panel').screenshot({ path: 'test-results/follower-targets.png' });
    await page.getByRole('button', { name: 'Rank every tube for these targets' }).click();
    const take = page.getByRole('button', { name: /^Take the \S+ as the follower at Rk/ }).first();
    await take.waitFor({ timeout: 20_000 });
    const tube = /^Take the (\S+) as/.exec((await take.getAttribute('aria-label'))!)![1]!;
    await take.click();
    await expect.poll(() => page.getByRole('group', { name: new RegExp(`^Plate curves of the follower's ${tube}`) }).count()).toBe(1);
    expect(errors).toEqual([]);
    await fresh.close();
  });

  it('has no serious accessibility violations with the follower on the bench (axe-core)', async () => {
    const tooling = await openBrowser(undefined, { bypassCSP: true });
    const { page } = await openWorkbench(tooling, inject('baseUrl'));
    await followerOnBench(page);
    await page.locator('input[name=tDiss]').fill('50');
    await page.getByRole('button', { name: 'Rank every tube for these targets' }).click();
    await page.getByRole('button', { name: /^Take the / }).first().waitFor({ timeout: 20_000 });
    expect(await seriousViolations(page)).toEqual([]);
    await tooling.close();
  });
});
