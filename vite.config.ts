import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import pkg from './package.json' with { type: 'json' };
import { precompress } from './scripts/precompress';
import { firstLoadChunkOf } from './scripts/firstLoadChunks';
import { reactRouterProduction, reactRouterTrim } from './scripts/reactRouterTrim';

export default defineConfig({
  define: {
    __APP_VERSION__: JSON.stringify(pkg.version),
  },
  plugins: [
    react(),
    tailwindcss(),
    VitePWA({
      // A new version waits until the person taps "Update" (never mid-end); see src/app/pwa.
      registerType: 'prompt',
      injectRegister: false,
      includeAssets: ['favicon.svg', 'icons/apple-touch-icon.png'],
      manifest: {
        name: 'Ringcall scorecard',
        short_name: 'Ringcall',
        description:
          'Offline scorecard for target archery: two writers, one cross-check, synced when signal returns.',
        lang: 'en',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        background_color: '#f7f6f1',
        theme_color: '#123047',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      // The service worker is written before the files are precompressed, so it gets its copies too.
      integration: { closeBundleOrder: 'pre' },
      workbox: {
        // The first install takes control at once so a phone that loses signal right after
        // opening the app still has it; later versions wait for the person's go-ahead.
        clientsClaim: true,
        skipWaiting: false,
        cleanupOutdatedCaches: true,
        // Only the woff2 font files (the browsers we support all read woff2).
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest}', '**/atkinson-hyperlegible-latin-*.woff2'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/\.well-known\//, /^\/files\//],
      },
    }),
    precompress(),
    reactRouterTrim(),
  ],
  resolve: {
    // Dexie's package entry wraps its ES5 build; its ES module build for modern browsers is ~2 KiB gzip smaller.
    // Every import of 'dexie' (ours and dexie-react-hooks') goes here, so there is still one copy.
    // React Router's production build, trimmed of what the app never uses: scripts/reactRouterTrim.ts.
    alias: [{ find: /^dexie$/, replacement: 'dexie/dist/modern/dexie.mjs' }, ...reactRouterProduction],
  },
  build: {
    manifest: true,
    // Browsers without native module preload still load every chunk, only later; the polyfill is not worth its bytes.
    modulePreload: { polyfill: false },
    sourcemap: false,
    chunkSizeWarningLimit: 600,
    rolldownOptions: {
      // Fewer, larger chunks in the pad's first load (scripts/firstLoadChunks.ts). A group's modules
      // only: taking their imports too would pull React into it, and the entry would load the group.
      output: { codeSplitting: { groups: [{ name: firstLoadChunkOf(), includeDependenciesRecursively: false }] } },
    },
  },
  server: {
    proxy: {
      '/api': 'http://localhost:3000',
      '/.well-known': 'http://localhost:3000',
    },
  },
});
