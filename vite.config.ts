import path from 'node:path';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// React, React Router and TanStack Query change rarely: one long-cached chunk that every route shares.
const VENDOR = /node_modules[\\/](react|react-dom|react-router|react-router-dom|scheduler|@tanstack[\\/](query-core|react-query))[\\/]/;

export default defineConfig({
  plugins: [react(), tailwindcss()],
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
            { name: 'ui', test: /[\\/]src[\\/](components[\\/]ui|lib[\\/](api-client|auth|query-client))[\\/.]/ },
          ],
        },
      },
    },
  },
  server: { host: '127.0.0.1' },
});
