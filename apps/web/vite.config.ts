import { fileURLToPath, URL } from 'node:url';
import react from '@vitejs/plugin-react';
import { defaultClientConditions, defineConfig } from 'vite';
import { compression } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';

const src = fileURLToPath(new URL('./src', import.meta.url));

export default defineConfig({
  // Brotli and gzip copies of every built file beside it; the API serves them precompressed (web-app.ts).
  plugins: [
    react(),
    compression({ algorithms: ['gzip', 'brotliCompress'], exclude: [/\.(br|gz)$/, /\.map$/] }),
    // Field mode (issue 17): the app installs and opens with no network underground.
    VitePWA({
      strategies: 'generateSW',
      registerType: 'autoUpdate',
      // Registered from main.tsx (registerSW), so no inline script and the CSP stays strict.
      injectRegister: false,
      includeAssets: ['icon.svg'],
      manifest: {
        name: 'Roundbook',
        short_name: 'Roundbook',
        description: 'Round-by-round face mapping and shift handover',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        background_color: '#ffffff',
        theme_color: '#1f4e5f',
        icons: [
          { src: '/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
        ],
      },
      workbox: {
        // The app shell and its fonts (png/webmanifest are added by the plugin; listing them duplicates).
        globPatterns: ['**/*.{js,css,html,woff2}'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api(\/|$)/],
        cleanupOutdatedCaches: true,
        // The first visit is kept too: the worker takes the open page over as soon as it is installed.
        clientsClaim: true,
        skipWaiting: true,
        runtimeCaching: [
          {
            // The data the person works on (setup, headings, recent rounds, sets, photos list): the network
            // first, this device's last answer when there is none. Only GETs; never sign-in or mutations.
            urlPattern: ({ url, request }) =>
              request.method === 'GET' &&
              url.pathname.startsWith('/api/') &&
              !url.pathname.startsWith('/api/auth/login') &&
              !url.pathname.startsWith('/api/invitations') &&
              !url.pathname.startsWith('/api/local-mail') &&
              !url.pathname.startsWith('/api/docs') &&
              !url.pathname.endsWith('/url'),
            handler: 'NetworkFirst',
            method: 'GET',
            options: {
              cacheName: 'roundbook-api',
              networkTimeoutSeconds: 6,
              expiration: { maxEntries: 400, maxAgeSeconds: 14 * 24 * 3600 },
              cacheableResponse: { statuses: [200] },
              plugins: [
                {
                  // One person's answers are never served to another on a shared tablet: the cache key
                  // carries the signed-in user's id (the token's subject). Answers to requests without a
                  // token (public ones, e.g. /api/config) share the key "none"; protected routes answer those 401,
                  // which is never stored.
                  cacheKeyWillBeUsed: ({ request }: { request: Request }) => {
                    const auth = request.headers.get('Authorization') ?? '';
                    let sub: string;
                    try {
                      const part = auth.replace(/^Bearer\s+/i, '').split('.')[1] ?? '';
                      const json = JSON.parse(atob(part.replace(/-/g, '+').replace(/_/g, '/'))) as {
                        sub?: unknown;
                      };
                      sub = typeof json.sub === 'string' ? json.sub : '';
                    } catch {
                      sub = '';
                    }
                    const url = new URL(request.url);
                    url.searchParams.set('__user', sub === '' ? 'none' : sub);
                    return Promise.resolve(url.href);
                  },
                },
              ],
            },
          },
        ],
      },
    }),
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
