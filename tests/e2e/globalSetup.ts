import { existsSync } from 'node:fs';
import { build, preview, type PreviewServer } from 'vite';
import type { TestProject } from 'vitest/node';

/**
 * Builds the production bundle once and serves it on a free loopback port for
 * the browser suites. Skipped (with the suites) when Chromium is absent.
 */
let server: PreviewServer | undefined;

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  if (!existsSync('/usr/bin/chromium')) {
    project.provide('baseUrl', '');
    return;
  }
  await build({ logLevel: 'warn', build: { outDir: 'dist' } });
  server = await preview({ logLevel: 'warn', preview: { host: '127.0.0.1', port: 0, strictPort: false } });
  const url = server.resolvedUrls?.local[0];
  if (!url) throw new Error('the preview server did not report its address');
  project.provide('baseUrl', url.replace(/\/$/, ''));
  return async () => {
    await server?.close();
  };
}
