import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { chromiumGate, openBrowser, openWorkbench, type OpenBrowser } from './browser';
import { downloadOf } from './downloads';

const run = chromiumGate();

describe.runIf(run)('a four-stage amplifier end to end in Chromium', () => {
  let browser: OpenBrowser;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('is designed from the strip, dragged on the selected stage, checked, saved, shared and printed', async () => {
    const { page, errors } = await openWorkbench(browser, inject('baseUrl'));
    const strip = page.getByRole('region', { name: 'The amplifier, stage by stage' });
    const cards = strip.locator('button.chain-card');
    // Designed: the demo's input stage, driver and output stage, and a follower after the driver.
    await page.getByRole('button', { name: "Add a cathode follower direct-coupled to Stage 2's plate" }).click();
    await expect.poll(() => cards.count()).toBe(4);
    expect(await cards.locator('.card-kind').allTextContents()).toEqual(['common cathode', 'common cathode', 'cathode follower', 'single-ended output']);
    // A different tube and plate resistor on stage 2 (on the bench), typed.
    const ra = page.getByRole('textbox', { name: /^Ra/ }).first();
    await ra.fill('100k');
    await ra.press('Tab');
    await page.getByRole('radiogroup', { name: 'Tubes' }).getByRole('radio', { name: /^12AX7/ }).check();
    await expect.poll(() => cards.nth(1).locator('.card-title').textContent()).toBe('Stage 2 · 12AX7 common cathode');
    // Dragged: the operating point of the stage on the bench moves its Ra.
    const point = page.getByRole('slider', { name: /operating point/i });
    await point.scrollIntoViewIfNeeded();
    const box = (await point.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(box.x + box.width / 2 + k * 8, box.y + box.height / 2 - k * 3);
    await page.mouse.up();
    await expect.poll(() => ra.inputValue()).not.toBe('100k');
    const draggedRa = await ra.inputValue();
    // Stage 1 on the bench shows its own values; stage 2 keeps the dragged one.
    await cards.nth(0).click();
    await expect.poll(() => ra.inputValue()).toBe('100k');
    await cards.nth(1).click();
    await expect.poll(() => ra.inputValue()).toBe(draggedRa);
    // Edited on the whole amplifier's drawing: stage 1's Rk, pressed where it is drawn, opens in place and takes a value.
    await strip.getByRole('button', { name: /^Stage 1 Rk .*: change$/ }).click();
    await expect.poll(() => cards.nth(0).getAttribute('aria-pressed')).toBe('true');
    const inPlace = strip.locator('.chain-frame .inline-editor input');
    await expect.poll(() => inPlace.evaluate((el) => el === document.activeElement)).toBe(true);
    await inPlace.fill('2k2');
    await inPlace.press('Enter');
    await expect.poll(() => page.getByRole('textbox', { name: /^Rk/ }).first().inputValue()).toBe('2.2k');
    expect(await strip.getByRole('button', { name: 'Stage 1 Rk 2.2 kΩ: change' }).count()).toBe(1);
    await cards.nth(1).click();
    await expect.poll(() => ra.inputValue()).toBe(draggedRa);
    // Checked: the ratings list names stages by place; the build sheet lists the stages off the bench with their own parts.
    const sheet = page.getByRole('region', { name: 'Build sheet' });
    await expect.poll(() => sheet.getByText('Stage 1, 12AX7 gain stage').count()).toBe(1);
    expect(await sheet.getByRole('row').filter({ hasText: /^Ra1/ }).count()).toBe(1);
    mkdirSync('test-results', { recursive: true });
    await strip.screenshot({ path: 'test-results/chain-four-stages.png' });
    // Saved: the design file holds the chain.
    const file = JSON.parse((await downloadOf(page, 'Save file')).toString('utf8')) as { version: number; design: { before: unknown[]; after: unknown[]; stage2: { kind: string } } };
    expect(file.version).toBe(3);
    expect(file.design.before).toHaveLength(1);
    expect(file.design.stage2.kind).toBe('follower');
    // Shared: a fresh browser opens the same four stages with stage 2 on the bench.
    await page.getByRole('button', { name: 'Share link' }).click();
    const link = await page.getByRole('textbox', { name: 'Share link for this design' }).inputValue();
    const fresh = await openBrowser();
    try {
      const other = await openWorkbench(fresh, link);
      const otherCards = other.page.getByRole('region', { name: 'The amplifier, stage by stage' }).locator('button.chain-card');
      await expect.poll(() => otherCards.count()).toBe(4);
      expect(await otherCards.nth(1).getAttribute('aria-pressed')).toBe('true');
      expect(await other.page.getByRole('textbox', { name: /^Ra/ }).first().inputValue()).toBe(draggedRa);
      expect(other.errors).toEqual([]);
    } finally {
      await fresh.close();
    }
    // Printed: every stage of the amplifier is on the page.
    await page.emulateMedia({ media: 'print' });
    expect(await cards.nth(3).isVisible()).toBe(true);
    await page.pdf({ format: 'A4', printBackground: true, path: 'test-results/print-chain.pdf' });
    expect(errors).toEqual([]);
    await page.close();
  });
});
