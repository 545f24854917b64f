import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

// The workbench is a static single page: `vite build` writes dist/, which any
// static file server (or `npm run preview`) can serve.
export default defineConfig({
  plugins: [react()],
  server: { host: '127.0.0.1', port: 5173, strictPort: false },
  preview: { host: '127.0.0.1', port: 4173 },
  build: { outDir: 'dist', sourcemap: true, target: 'es2022' },
});
