import { defineConfig } from 'vitest/config';

// `npm test` (scripts/test.mjs) starts the throwaway PostgreSQL and builds the
// client first, then runs this. Unit tests sit beside the code in shared/.
export default defineConfig({
  test: {
    include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'tests/**/*.test.ts'],
    globalSetup: ['tests/support/global-setup.ts'],
    pool: 'forks',
    maxWorkers: 2,
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
