import { defineConfig } from 'vitest/config';

// One config for every suite. Browser tests (tests/e2e) need the exported web build and a database;
// scripts/test.sh prepares both before vitest starts.
export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    testTimeout: 60_000,
    hookTimeout: 180_000,
    fileParallelism: true,
    maxWorkers: 2,
  },
});
