import path from 'node:path';
import { defineConfig } from 'vitest/config';

const alias = { '@': path.resolve(import.meta.dirname, 'src'), '@shared': path.resolve(import.meta.dirname, 'shared') };

export default defineConfig({
  resolve: { alias },
  test: {
    globalSetup: ['tests/support/global-setup.ts'],
    setupFiles: ['tests/support/fail-on-console-error.ts'],
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/unit/**/*.test.{ts,tsx}'], environment: 'node' },
      },
      {
        extends: true,
        // Client code in a simulated DOM (happy-dom) with @testing-library/react: hooks, query keys, error screens.
        test: { name: 'client', include: ['tests/client/**/*.test.{ts,tsx}'], environment: 'happy-dom' },
      },
      {
        extends: true,
        test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', testTimeout: 20_000, hookTimeout: 30_000 },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
