import { fileURLToPath, URL } from 'node:url';
import react from '@vitejs/plugin-react';
import { defaultClientConditions, defineConfig } from 'vite';
import { compression } from 'vite-plugin-compression2';

const src = fileURLToPath(new URL('./src', import.meta.url));

export default defineConfig({
  // Brotli and gzip copies of every built file beside it; the API serves them precompressed (web-app.ts).
  plugins: [
    react(),
    compression({ algorithms: ['gzip', 'brotliCompress'], exclude: [/\.(br|gz)$/, /\.map$/] }),
  ],
  resolve: {
    alias: { '@': src },
    // Workspace packages are consumed as TypeScript source: geomath publishes it under the
    // `source` export condition, ui exports its src/index.ts directly.
    conditions: ['source', ...defaultClientConditions],
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: true,
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: 'http://127.0.0.1:8080', changeOrigin: false } },
  },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
});
