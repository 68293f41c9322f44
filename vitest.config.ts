import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['shared/**/__tests__/**/*.test.ts', 'server/**/__tests__/**/*.test.ts', 'src/**/__tests__/**/*.test.{ts,tsx}', 'tests/integration/**/*.test.ts'],
    globalSetup: ['tests/fixtures/global-setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    pool: 'forks',
  },
});
