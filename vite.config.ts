import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import { VitePWA } from 'vite-plugin-pwa';

/**
 * The page's Content-Security-Policy: scripts only from the app's own origin,
 * nothing fetched or framed from elsewhere. Images may be blob: and data: URLs
 * (exports are drawn through them). Inline style attributes are allowed for
 * the few React sets (bar widths, editor positions). Injected into the build
 * only: Vite's dev server needs inline scripts for hot reload.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' blob: data:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
].join('; ');

function contentSecurityPolicy(): Plugin {
  return {
    name: 'quiescent-csp',
    apply: 'build',
    transformIndexHtml: () => [{ tag: 'meta', attrs: { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }, injectTo: 'head-prepend' }],
  };
}

// The workbench is a static single page: `vite build` writes dist/, which any
// static file server (or `npm run preview`) can serve.
/**
 * Offline at the bench: a service worker (vite-plugin-pwa, generated with
 * Workbox) precaches the built page, so once loaded the workbench opens and
 * works with no network, and it can be installed as an app. Registered from
 * its own script file, which the page's policy allows.
 */
const offline = VitePWA({
  registerType: 'autoUpdate',
  injectRegister: 'script',
  manifest: {
    name: 'Quiescent: load lines and part values for tube stages',
    short_name: 'Quiescent',
    description: 'A workbench for designing vacuum-tube audio stages: plate curves, load lines, figures and parts.',
    theme_color: '#1d2329',
    background_color: '#fbfaf5',
    display: 'standalone',
    icons: [{ src: 'favicon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' }],
  },
  workbox: { globPatterns: ['**/*.{js,css,html,svg,webmanifest}'], navigateFallback: 'index.html', cleanupOutdatedCaches: true, clientsClaim: true, skipWaiting: true },
});

export default defineConfig({
  plugins: [react(), contentSecurityPolicy(), offline],
  server: { host: '127.0.0.1', port: 5173, strictPort: false },
  preview: { host: '127.0.0.1', port: 4173 },
  build: {
    outDir: 'dist',
    sourcemap: true,
    target: 'es2022',
    // The model worker is an entry of this build, not a bundle of its own: the code the page and the
    // worker both run (the model, comlink) goes into a chunk they share and is downloaded once
    // (measured: 2.5 kB gzipped less than the worker bundled apart). Its name is fixed, as the page
    // starts it by name (app/work/offThread.ts); the service worker's precache keeps it current.
    rollupOptions: {
      input: { index: 'index.html', modelWorker: 'app/work/modelWorker.ts' },
      output: {
        entryFileNames: (chunk) => (chunk.name === 'modelWorker' ? 'assets/modelWorker.js' : 'assets/[name]-[hash].js'),
        chunkFileNames: 'assets/shared-[hash].js',
      },
    },
  },
});
