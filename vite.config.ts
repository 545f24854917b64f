import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';

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
export default defineConfig({
  plugins: [react(), contentSecurityPolicy()],
  server: { host: '127.0.0.1', port: 5173, strictPort: false },
  preview: { host: '127.0.0.1', port: 4173 },
  build: { outDir: 'dist', sourcemap: true, target: 'es2022' },
});
