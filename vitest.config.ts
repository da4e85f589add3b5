import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    setupFiles: ['test/setup.ts'],
    // Unit tests never touch the wall clock, the network or a shared database file.
    testTimeout: 30_000,
  },
});
