import type { Page } from 'playwright-core';
import { openWorkbench, type OpenBrowser } from '../tests/e2e/browser';

/**
 * The inputs that once froze the page, each timed by its longest main-thread
 * task (Chromium's Long Tasks API reports every task over 50 ms; none means
 * the longest was under 50). The budget for each is 200 ms.
 */
export interface HeavyInputResults {
  readonly import2000TubesMs: number;
  readonly fit10000PointsMs: number;
  readonly paste100000LinesMs: number;
  /** A keystroke in the largest points box still edited as text. */
  readonly keystrokeLargestBoxMs: number;
  readonly link2MBMs: number;
}

const WATCH = `window.__long = []; new PerformanceObserver((l) => l.getEntries().forEach((e) => window.__long.push(e.duration))).observe({ type: 'longtask' });`;
const longest = (page: Page) => page.evaluate(() => Math.max(50, ...((window as unknown as { __long: number[] }).__long ?? [])));
const reset = (page: Page) => page.evaluate(() => ((window as unknown as { __long: number[] }).__long = []));

/** Points from a smooth 3/2-power family, in the points box's units (V, V, mA). */
function pointsText(n: number): string {
  const lines: string[] = [];
  for (let k = 0; k < n; k++) {
    const vg = -2 * (k % 6);
    const va = 40 + ((k * 7) % 300);
    const ia = Math.max(0.01, 1.2e-3 * Math.pow(Math.max(0, va / 20 + vg), 1.5));
    lines.push(`${va}, ${vg}, ${ia.toFixed(4)}`);
  }
  return lines.join('\n');
}

function tubesFile(n: number): string {
  const tubes = Array.from({ length: n }, (_, k) => ({
    name: `Bench tube ${k}`, params: { mu: 20, ex: 1.35, kg1: 1200, kp: 60, kvb: 300 },
    maxPlateVoltage: 300, maxPlateDissipation: 2.5, maxHeaterCathodeVoltage: 100,
    points: Array.from({ length: 40 }, (_, j) => ({ va: 50 + j * 5, vg: -(j % 5), ia: 1e-3 })), rmsPercent: 2,
  }));
  return JSON.stringify({ format: 'quiescent-tubes', version: 1, tubes });
}

/** Runs one measure; a measure that cannot run reports NaN ("not measured") instead of ending the bench. */
async function measure(page: Page, step: () => Promise<void>): Promise<number> {
  try {
    await reset(page);
    await step();
    return await longest(page);
  } catch (e) {
    console.warn(`  (not measured: ${(e as Error).message.split("\n")[0]})`);
    return Number.NaN;
  }
}

export async function benchHeavyInputs(browser: OpenBrowser, url: string): Promise<HeavyInputResults> {
  const { page } = await openWorkbench(browser, url);
  // The pages before may have left the autosave on the output stage: these inputs live on the voltage stage's bench.
  await page.getByLabel('Voltage stage (resistance-coupled)').check();
  await page.waitForSelector('.custom-tube textarea', { state: 'attached' });
  await page.evaluate(WATCH);
  const box = page.locator('.custom-tube textarea').first();
  // The file is made in the page and handed to the input before the watch starts: Playwright's own
  // file transfer (base64 through the driver) would otherwise be timed as if it were the page's work.
  await page.evaluate((text) => {
    const input = document.querySelector<HTMLInputElement>('.custom-tube input[type="file"]')!;
    const dt = new DataTransfer();
    dt.items.add(new File([text], 'tubes.json', { type: 'application/json' }));
    input.files = dt.files;
  }, tubesFile(2000));
  const import2000TubesMs = await measure(page, async () => {
    await page.evaluate(() => document.querySelector('.custom-tube input[type="file"]')!.dispatchEvent(new Event('change', { bubbles: true })));
    await page.waitForFunction(() => /Imported|Nothing imported/.test(document.querySelector('.custom-tube [role="status"]')?.textContent ?? ''), null, { timeout: 60_000 });
  });
  // A paste, as the browser delivers one: the whole text set at once and one input event (Playwright's fill is far slower).
  const paste = (text: string) =>
    box.evaluate((el, t) => {
      Object.getOwnPropertyDescriptor(HTMLTextAreaElement.prototype, 'value')!.set!.call(el, t);
      el.dispatchEvent(new Event('input', { bubbles: true }));
    }, text);
  const fit10000PointsMs = await measure(page, async () => {
    await paste(pointsText(10_000));
    await page.locator('.custom-tube button', { hasText: 'Fit the model' }).click();
    await page.waitForSelector('[data-testid="fit-summary"]', { timeout: 60_000 });
  });
  // A paste by hand: the browser's paste event, which the box handles itself (it places the whole lines that fit
  // and shows a large set as a preview, so no keystroke ever lays out 400,000 characters).
  // The text is made in the page before the watch starts (handing 4 MB through the driver is the harness's work, not the page's).
  await page.evaluate((lines) => {
    (window as unknown as { pasted: string }).pasted = lines;
  }, pointsText(100_000));
  const paste100000LinesMs = await measure(page, async () => {
    await box.evaluate((el) => {
      const t = el as HTMLTextAreaElement;
      t.setSelectionRange(0, t.value.length);
      const data = new DataTransfer();
      data.setData('text/plain', (window as unknown as { pasted: string }).pasted);
      t.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
    });
    await page.waitForFunction(() => /The paste had 100,000 lines/.test(document.querySelector('.custom-tube')?.textContent ?? ''));
  });
  // A keystroke in the largest box that is still edited as text (just under EDITABLE_POINTS_TEXT).
  await paste(pointsText(2_500)); // about 39,500 characters
  const keystrokeLargestBoxMs = await measure(page, async () => {
    await box.evaluate((el) => {
      const t = el as HTMLTextAreaElement;
      Object.getOwnPropertyDescriptor(HTMLTextAreaElement.prototype, 'value')!.set!.call(t, `${t.value}1`);
      t.dispatchEvent(new Event('input', { bubbles: true }));
    });
    await page.waitForTimeout(300);
  });
  const link2MBMs = await measure(page, async () => {
    await page.evaluate(() => (location.hash = `#design=${'A'.repeat(2_000_000)}`));
    await page.waitForFunction(() => /shared link is/.test(document.body.textContent ?? ''));
  });
  await page.close();
  return { import2000TubesMs, fit10000PointsMs, paste100000LinesMs, keystrokeLargestBoxMs, link2MBMs };
}
