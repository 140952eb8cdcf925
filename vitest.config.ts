import { defineConfig } from 'vitest/config';

// One time budget: a test may run `testTimeout`; every wait inside it (expect.poll,
// playwright's locators and navigations, the mail sink, the database) gives up a margin
// earlier, so a wait that fails names what it waited for. Tests read it through
// tests/support/eventually.ts.
const testTimeout = 30_000;
const patience = { waitMs: testTimeout - 5_000, lookEveryMs: 100 };

// `npm test` (scripts/test.mjs) starts the throwaway PostgreSQL and builds the
// client first, then runs this. Unit tests sit beside the code in shared/.
export default defineConfig({
  test: {
    include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'tests/**/*.test.ts'],
    globalSetup: ['tests/support/global-setup.ts'],
    pool: 'forks',
    maxWorkers: 2,
    testTimeout,
    hookTimeout: 60_000,
    provide: { patience },
    // A bare expect.poll gets the same patience, not Vitest's one second.
    expect: { poll: { timeout: patience.waitMs, interval: patience.lookEveryMs } },
  },
});
