import { describe, expect, inject, it } from 'vitest';
import { chromiumGate, openWorkbench } from './browser';
import { useBrowser } from './useBrowser';

const run = chromiumGate();

describe.runIf(run)('nothing lost, every danger shown, in Chromium', () => {
  const browser = useBrowser();

  it('a change reloaded at once (inside the autosave delay) is kept, with its undo step', async () => {
    const { page } = await openWorkbench(browser.current, inject('baseUrl'));
    await page.getByRole('textbox', { name: /^Ra/ }).fill('39k');
    await page.reload(); // pagehide flushes the autosave
    await page.waitForSelector('.layer-curves path');
    expect(await page.getByRole('textbox', { name: /^Ra/ }).inputValue()).toBe('39k');
    expect(await page.getByRole('button', { name: 'Undo' }).isEnabled()).toBe(true);
    await page.close();
  });

  it('a damaged link, opened on a tab or pasted into it, leaves the last design open and says why', async () => {
    const { page } = await openWorkbench(browser.current, inject('baseUrl'));
    await page.getByRole('textbox', { name: /^Ra/ }).fill('33k');
    await page.goto(`${inject('baseUrl')}/#design=abcd==`);
    await page.reload();
    await page.waitForSelector('.layer-curves path');
    expect(await page.getByRole('textbox', { name: /^Ra/ }).inputValue()).toBe('33k');
    expect(await page.getByText(/The shared link is damaged: at place 5 it has padding/).count()).toBe(1);
    await page.evaluate(() => (location.hash = '#design=%%%'));
    await expect.poll(() => page.getByText(/it has the character “%”/).count()).toBe(1);
    expect(await page.getByRole('textbox', { name: /^Ra/ }).inputValue()).toBe('33k');
    await page.close();
  });

  it('a follower past its heater–cathode rating is a danger in the one ratings list, tagged with its stage', async () => {
    const { page } = await openWorkbench(browser.current, inject('baseUrl'));
    await page.getByRole('radio', { name: /^12AX7/ }).check({ force: true });
    await page.getByRole('textbox', { name: /^B\+/ }).fill('400');
    await page.getByRole('textbox', { name: /^Ra/ }).fill('220k');
    await page.getByRole('textbox', { name: /^Rk/ }).fill('1k8');
    await page.getByLabel('Add', { exact: true }).selectOption('follower');
    await page.getByRole('textbox', { name: /^Rk \(follower\)/ }).fill('150k');
    const ratings = page.getByRole('region', { name: 'Ratings checks' });
    // The demo's driver is stage 2 (after its 12AX7 input stage): its follower is stage 3.
    await expect.poll(() => ratings.locator('.finding.danger').filter({ hasText: 'Stage 3, 12AX7 cathode follower: Heater-to-cathode voltage' }).count()).toBe(1);
    await page.close();
  });
});
