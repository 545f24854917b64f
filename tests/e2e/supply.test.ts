import { mkdirSync, readFileSync } from 'node:fs';
import { describe, expect, inject, it } from 'vitest';
import { chromiumGate, openWorkbench } from './browser';
import { useBrowser } from './useBrowser';

const run = chromiumGate();

describe.runIf(run)('the amplifier on its supply in Chromium', () => {
  const browser = useBrowser();

  it('solves the whole amplifier on its supply off the page\'s thread (no long task over 200 ms), keeps a changed supply through a saved file and a reload, each gain stage on its own node, and prints it', async () => {
    const { page, errors } = await openWorkbench(browser.current, inject('baseUrl'));
    const supply = page.getByRole('region', { name: 'B+ supply' });
    await supply.getByTestId('supply-results').waitFor({ timeout: 15_000 });
    // The output stage after the choke, the two voltage stages at the end of the ladder.
    expect(await supply.locator('tr[data-node="2"] td').last().textContent()).toBe('Output (EL34)');
    expect(await supply.locator('tr[data-node="4"] td').last().textContent()).toBe('Stage 1 (12AX7), Stage 2 (12AU7)');
    const before = await supply.locator('tr[data-node="1"] [data-figure="node-dc"]').textContent();
    // A larger reservoir and two channels: solved again a round at a time, never holding the page for long.
    await page.evaluate(() => {
      const w = window as unknown as { longest: number };
      w.longest = 0;
      new PerformanceObserver((list) => list.getEntries().forEach((e) => (w.longest = Math.max(w.longest, e.duration)))).observe({ type: 'longtask' });
    });
    await supply.getByRole('textbox', { name: /^Node 1 capacitor/ }).fill('220u');
    await supply.getByLabel('Channels').selectOption('2');
    // Stage 2 up the ladder on a node of its own (node 3), stage 1 left on the last.
    await supply.getByLabel('Stage 2 (12AU7) from').selectOption('2');
    await expect.poll(() => supply.locator('.supply-nodes caption').textContent(), { timeout: 15_000 }).toMatch(/2 channels/);
    await expect.poll(() => supply.locator('.supply-results.stale').count(), { timeout: 15_000 }).toBe(0);
    const after = await supply.locator('tr[data-node="1"] [data-figure="node-dc"]').textContent();
    expect(await page.evaluate(() => (window as unknown as { longest: number }).longest)).toBeLessThan(200);
    expect(after).not.toBe(before);
    expect(await supply.locator('tr[data-node="3"] td').last().textContent()).toBe('Stage 2 (12AU7)');
    expect(await supply.locator('tr[data-node="4"] td').last().textContent()).toBe('Stage 1 (12AX7)');
    // Saved as a file, the supply is in it.
    const [dl] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save file' }).click()]);
    const saved = JSON.parse(readFileSync((await dl.path())!, 'utf8'));
    expect(saved.design.supply).toMatchObject({ channels: 2, input: { kind: 'capacitor', c: 220e-6 }, feeds: { voltage: 3 } });
    // The bench's stage (stage 2) carries its node.
    expect(saved.design.node).toBe(2);
    // Reloaded (autosave), the same supply and the same solved node.
    await page.waitForTimeout(700);
    await page.reload();
    await supply.getByTestId('supply-results').waitFor({ timeout: 15_000 });
    expect(await supply.getByRole('textbox', { name: /^Node 1 capacitor/ }).inputValue()).toBe('220u');
    expect(await supply.getByLabel('Stage 2 (12AU7) from').inputValue()).toBe('2');
    await expect.poll(() => supply.locator('tr[data-node="1"] [data-figure="node-dc"]').textContent(), { timeout: 15_000 }).toBe(after);
    // On paper: one A4 page, the supply's nodes on it.
    await page.emulateMedia({ media: 'print' });
    expect(await supply.locator('.supply-nodes').isVisible()).toBe(true);
    expect(await supply.getByRole('textbox', { name: /^Node 1 capacitor/ }).isVisible()).toBe(false);
    mkdirSync('test-results', { recursive: true });
    const pdf = await page.pdf({ format: 'A4', printBackground: true, path: 'test-results/print-supply.pdf' });
    expect((pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length).toBe(1);
    expect(errors).toEqual([]);
    await page.close();
  });
});
