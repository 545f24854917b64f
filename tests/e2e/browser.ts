import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

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
export async function openBrowser(viewport = { width: 1280, height: 900 }): Promise<OpenBrowser> {
  const profile = mkdtempSync(join(tmpdir(), 'quiescent-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: CHROMIUM_FLAGS,
    viewport,
    acceptDownloads: true,
  });
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
