import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

// Three suites, one runner:
//  model — the pure model in src/, in plain Node (proves src/ needs no DOM);
//  ui    — React panels and the d3 chart in jsdom;
//  e2e   — the production build in real Chromium (tests/e2e), which needs
//          /usr/bin/chromium and skips loudly without it (fails under CI=true).
export default defineConfig({
  plugins: [react()],
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'model',
          environment: 'node',
          include: ['tests/**/*.test.ts'],
          exclude: ['tests/e2e/**', 'tests/app/**', 'node_modules/**'],
        },
      },
      {
        extends: true,
        test: {
          name: 'ui',
          environment: 'jsdom',
          include: ['tests/app/**/*.test.{ts,tsx}'],
          setupFiles: ['tests/app/setup.ts'],
          // Whole interactions (typing, a full analysis per keystroke) in jsdom on a shared 2-core machine:
          // some took just over the default 5 s under a full parallel run. Speed is the benches' job, not these tests'.
          testTimeout: 15_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/e2e/globalSetup.ts'],
          testTimeout: 60_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
