/**
 * Builds the React UI into dist/renderer. The built HTML must carry no inline script, because the
 * CSP (script-src 'self') would block it; so the modulepreload polyfill, which Vite would inline,
 * is turned off. `base: './'` keeps asset paths relative, so the same files load from file:// in
 * the desktop window and from http://127.0.0.1 in the browser host.
 */
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

const root = decodeURIComponent(new URL('.', import.meta.url).pathname);

export default defineConfig({
  root,
  base: './',
  plugins: [react()],
  build: {
    outDir: '../dist/renderer',
    emptyOutDir: true,
    modulePreload: { polyfill: false },
    assetsInlineLimit: 0,
    sourcemap: false,
  },
  server: { host: '127.0.0.1', strictPort: false },
});
