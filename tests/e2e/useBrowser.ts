import { afterAll, beforeAll } from 'vitest';
import { openBrowser, type OpenBrowser } from './browser';

/** One fresh Chromium for a describe block: opened before its tests, closed after. Read it as `browser.current`. */
export function useBrowser(): { readonly current: OpenBrowser } {
  const holder: { current: OpenBrowser } = { current: undefined as unknown as OpenBrowser };
  beforeAll(async () => {
    holder.current = await openBrowser();
  });
  afterAll(async () => {
    await holder.current?.close();
  });
  return holder;
}
