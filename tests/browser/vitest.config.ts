import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Browser tests only: one app server for the whole run (global-setup.ts), one file at a time.
export default defineConfig({
  root: fileURLToPath(new URL('../..', import.meta.url)),
  test: {
    include: ['tests/browser/**/*.test.ts'],
    globalSetup: ['tests/browser/global-setup.ts'],
    hookTimeout: 180_000,
    testTimeout: 120_000,
    teardownTimeout: 30_000,
    fileParallelism: false,
    pool: 'forks',
    environment: 'node',
  },
});
