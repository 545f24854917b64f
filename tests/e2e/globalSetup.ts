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
  // Vitest runs with NODE_ENV=test, which would make Vite bundle React's
  // development build. The browser suites must test what users get.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({ mode: 'production', logLevel: 'warn', build: { outDir: 'dist' } });
  } finally {
    process.env.NODE_ENV = nodeEnv;
  }
  server = await preview({ logLevel: 'warn', preview: { host: '127.0.0.1', port: 0, strictPort: false } });
  const url = server.resolvedUrls?.local[0];
  if (!url) throw new Error('the preview server did not report its address');
  project.provide('baseUrl', url.replace(/\/$/, ''));
  return async () => {
    await server?.close();
  };
}
