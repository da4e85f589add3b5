import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    setupFiles: ['test/setup.ts'],
    // One throw-away PostgreSQL 15 server on loopback for the run (test/support/postgres-global.ts).
    globalSetup: ['test/support/postgres-global.ts'],
    // Unit tests never touch the wall clock, the network or a shared database file.
    testTimeout: 30_000,
  },
});
