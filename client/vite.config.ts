import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

/**
 * The page is built from client/ into client/dist. Relative asset paths (`base: './'`) so the
 * server can mount the folder anywhere; no inline scripts are emitted (the server's CSP is
 * `script-src 'self'`), and the module-preload polyfill is off so nothing is injected inline.
 */
const root = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  root,
  base: './',
  publicDir: false,
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    target: 'es2022',
    modulePreload: { polyfill: false },
    assetsInlineLimit: 0,
    sourcemap: false,
    // Two pages: one series in full (index.html) and many series at once (batch.html).
    rollupOptions: { input: { main: `${root}index.html`, batch: `${root}batch.html` } },
  },
  server: { host: '127.0.0.1' },
});
