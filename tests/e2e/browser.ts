import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** Debian's Chromium; never a downloaded browser. */
export const CHROMIUM_PATH = '/usr/bin/chromium';

/** The flags this machine needs: no sandbox as root, no GPU, and no background network calls (the network is closed). */
export const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export const CHROMIUM_MISSING_MESSAGE =
  '\n*** Chromium is not installed: the browser end-to-end tests are SKIPPED. ***\n' +
  '*** Install it with: sudo apt-get install -y chromium   (Debian/Ubuntu; gives /usr/bin/chromium) ***\n' +
  '*** Under CI=true a missing Chromium fails the run instead. ***\n';

/** True to run the browser suites; false after a loud warning; throws under CI. */
export function chromiumGate(): boolean {
  if (existsSync(CHROMIUM_PATH)) return true;
  if (process.env.CI === 'true') throw new Error(`Chromium is required under CI=true at ${CHROMIUM_PATH} (apt-get install -y chromium)`);
  console.warn(CHROMIUM_MISSING_MESSAGE);
  return false;
}

export interface OpenBrowser {
  readonly context: BrowserContext;
  close(): Promise<void>;
}

/** A fresh Chromium with a new, empty profile directory (deleted on close). */
export async function openBrowser(viewport = { width: 1280, height: 900 }, options: { bypassCSP?: boolean } = {}): Promise<OpenBrowser> {
  const profile = mkdtempSync(join(tmpdir(), 'quiescent-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: CHROMIUM_FLAGS,
    viewport,
    acceptDownloads: true,
    // Only for injecting test tools (axe-core): the app's own policy is tested as it ships.
    bypassCSP: options.bypassCSP ?? false,
  });
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Opens the workbench in a new tab, collecting console errors and page
 * errors, and acknowledges the first-visit safety caution when it shows.
 */
export async function openWorkbench(browser: OpenBrowser, url: string): Promise<{ page: Page; errors: string[] }> {
  const page = await browser.context.newPage();
  const errors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(url);
  await page.waitForSelector('.layer-curves path');
  const ack = page.getByRole('button', { name: 'I understand' });
  if (await ack.isVisible()) await ack.click();
  return { page, errors };
}

