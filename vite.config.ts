import path from 'node:path';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA, type ManifestOptions } from 'vite-plugin-pwa';

// React, React Router and TanStack Query change rarely: one long-cached chunk that every route shares.
const VENDOR = /node_modules[\\/](react|react-dom|react-router|react-router-dom|scheduler|@tanstack[\\/](query-core|react-query))[\\/]/;

/** The installed app (W3C Web App Manifest): opens on the technician's home, standalone, in Lifeplate's colours. */
const webAppManifest: Partial<ManifestOptions> = {
  id: '/',
  name: 'Lifeplate',
  short_name: 'Lifeplate',
  description: 'The life record of every boiler you service, on the phone in the basement.',
  start_url: '/',
  scope: '/',
  display: 'standalone',
  orientation: 'any',
  background_color: '#F6F3EE',
  theme_color: '#23272B',
  icons: [
    { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
    { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
    { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
  ],
};

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // Our own service worker (src/sw/sw.ts) with Workbox's precache list injected: the app shell on the phone, never API data.
    VitePWA({
      strategies: 'injectManifest',
      srcDir: 'src/sw',
      filename: 'sw.ts',
      injectRegister: false,
      registerType: 'prompt',
      manifest: webAppManifest,
      includeAssets: ['logo.svg', 'icons/apple-touch-icon.png'],
      injectManifest: {
        // The Latin fonts only (the other subsets load on demand when online); no source maps, no sample files.
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest}', 'assets/source-sans-3-latin-{400,600,700}-normal-*.woff2'],
        globIgnores: ['**/*.map', 'import-sample.csv'],
      },
      devOptions: { enabled: false },
    }),
  ],
  resolve: {
    alias: { '@': path.resolve(import.meta.dirname, 'src'), '@shared': path.resolve(import.meta.dirname, 'shared') },
  },
  build: {
    outDir: 'dist/client',
    sourcemap: true,
    // The server reads .vite/manifest.json to add modulepreload links for the route's lazy chunks; the bundle budget walks it too.
    manifest: true,
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            { name: 'vendor', test: VENDOR },
            // The small shared primitives in one chunk rather than a request each (they hold no zod and no feature code).
            { name: 'ui', test: /[\\/]src[\\/](components[\\/]ui|lib[\\/](api-client|auth|query-client|network-state))[\\/.]/ },
          ],
        },
      },
    },
  },
  server: { host: '127.0.0.1' },
});
